/**
 * The abstract netlist the nodal solver works on: named nodes joined by elements, ports to ground.
 * Independent of the design document, so ideal circuits (tests, generators, benches) and sized designs
 * (fromSized.ts) use the same engine. SI units: m, Hz, Ω, F, H, S.
 */
import { C0 } from '../units/constants.ts';
import type { Complex } from './complex.ts';

/** The reserved name of the ground (return) node. */
export const GROUND = 'gnd';

/** Characteristic impedance and propagation constant of a line at one frequency (Pozar, Microwave Engineering, 4th ed., 2012, §2.1). */
export interface LineConstants {
  /** Zc, Ω (complex for a lossy line). */
  zc: Complex;
  /** γ = α + jβ, 1/m (α in Np/m, β in rad/m). */
  gamma: Complex;
}

/**
 * Gives a line's constants at a frequency (Hz). Called once per line per frequency. `key`, when present, names
 * everything the constants depend on (two models with one key give the same numbers), so a sweep may keep its
 * values from one revision to the next (sweepValues.ts).
 */
export type LineModel = ((f: number) => LineConstants) & { readonly key?: string };

/** Frequency-dependent admittance, S. */
export type AdmittanceFn = (f: number) => Complex;

export type NetElement =
  /** Uniform line from node a to node b over ground (Pozar, Microwave Engineering, 4th ed., 2012, §4.4, ABCD of a line). Length 0 joins a and b (a wire). */
  | { kind: 'line'; id: string; a: string; b: string; length: number; model: LineModel }
  /** Ideal lumped part between a and b (b may be GROUND). R = 0 or L = 0 is a wire; C = 0 is left open. */
  | { kind: 'resistor' | 'capacitor' | 'inductor'; id: string; a: string; b: string; value: number }
  /** Series R + jωL, e.g. a via to ground (Goldfarb & Pucel 1991, IEEE Microwave and Guided Wave Letters 1(6), from memory); `r` may depend on frequency (skin effect). */
  | { kind: 'series-rl'; id: string; a: string; b: string; r: number | ((f: number) => number); l: number }
  /** Any two-terminal admittance. */
  | { kind: 'admittance'; id: string; a: string; b: string; y: AdmittanceFn }
  /**
   * An n-port against ground given by its admittance matrix (n×n, row-major, interleaved re/im, S).
   * Nodes may repeat GROUND for a terminal tied to the return.
   */
  | { kind: 'nport'; id: string; nodes: string[]; y: (f: number) => Float64Array; /** Names all that y depends on (as LineModel's key). */ key?: string };

/** A port: the node it drives and its real reference impedance (Ω, > 0). */
export interface NetPort { name: string; node: string; zRef: number; /** What people call the port (its label), when it has one. */ label?: string }

export interface Netlist {
  elements: NetElement[];
  ports: NetPort[];
}

/** A line with frequency-independent Zc and εeff: lossless TEM, γ = jω√εeff/c0. For ideal circuits and tests. */
export function idealLine(z0: number, eeff = 1): LineModel {
  const k = Math.sqrt(eeff) * 2 * Math.PI / C0;
  return (f) => ({ zc: { re: z0, im: 0 }, gamma: { re: 0, im: k * f } });
}

/** Physical length (m) of an ideal line of `deg` degrees at `f0` with effective permittivity `eeff`. */
export function temLengthForDegrees(deg: number, f0: number, eeff = 1): number {
  return (deg / 360) * C0 / (f0 * Math.sqrt(eeff));
}
