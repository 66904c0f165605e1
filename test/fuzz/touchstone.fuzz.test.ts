/**
 * Fuzz: the Touchstone reader (generated files and damaged real ones), each result read on as a part's admittance and figures.
 * 3000 inputs from a fixed seed (fast-check), run in a child process under a 10 s watchdog (io-watchdog.ts). Fails on
 * any crash, any input the watchdog had to stop, a non-finite (or null) result, or a message not in our own words.
 * The figures are printed and written to reports/fuzz-touchstone.json for the README's reliability section.
 */
import { describe } from 'vitest';
import { ioFuzzSuite } from './io-suite.ts';

describe('fuzz: touchstone', () => {
  ioFuzzSuite('touchstone', 3000, 20261205);
});
