/**
 * Fuzz: a sample of CLI commands in-process (sweep on generated Touchstone files, line with odd flags and batch tables, build/sweep/export on damaged design bytes, random command lines).
 * 800 inputs from a fixed seed (fast-check), run in a child process under a 10 s watchdog (io-watchdog.ts). Fails on
 * any crash, any input the watchdog had to stop, a non-finite (or null) result, or a message not in our own words.
 * The figures are printed and written to reports/fuzz-cli.json for the README's reliability section.
 */
import { describe } from 'vitest';
import { ioFuzzSuite } from './io-suite.ts';

describe('fuzz: cli', () => {
  ioFuzzSuite('cli', 800, 1322);
});
