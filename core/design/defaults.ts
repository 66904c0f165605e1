/**
 * A fresh design and the default values a migration fills in. The FR-4 numbers are the generic glass-epoxy values
 * used across the trade for first designs (εr 4.4, tanδ 0.02, 1.6 mm, 35 µm = 1 oz copper; common practice); annealed copper σ = 5.8e7 S/m; 1.5 µm rms roughness and the preset id follow the glass-epoxy entry of core/substrate/presets.ts. f0 = 2.45 GHz is the middle of the 2.4 GHz ISM
 * band (ITU Radio Regulations 5.150: 2400–2500 MHz), which is also the default band.
 */
import type { AsMade, DesignDoc, FabProcess, SubstrateSpec } from './types.ts';
import { DESIGN_FORMAT } from './types.ts';
import { DESIGN_VERSION } from './migrations.ts';
import { defaultAsMade } from './as-made-default.ts';

export const FR4_DEFAULT: Readonly<SubstrateSpec> = Object.freeze({
  preset: 'glass-epoxy', er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 1.5e-6,
});

/**
 * A 30° V-bit with a 0.1 mm tip cutting 0.05 mm deep: a usual isolation-milling setup for RF boards; 0.7 mm of
 * isolation clearance beside the copper (DEFAULT_ISOLATION_CLEARANCE in core/layout/process-cut.ts gives the reason).
 */
export const PROCESS_DEFAULT: Readonly<FabProcess> = Object.freeze({ kind: 'v-bit', tipWidth: 0.1e-3, angleDeg: 30, depth: 0.05e-3, clearance: 0.7e-3 });

export const FREQUENCY_DEFAULT = Object.freeze({ f0: 2.45e9, band: Object.freeze({ start: 2.4e9, stop: 2.5e9 }) });

export interface NewDesignOptions {
  name?: string;
  notes?: string;
  substrate?: Partial<SubstrateSpec>;
  f0?: number;
  band?: { start: number; stop: number };
  process?: FabProcess;
  /** How lines are sized; absent: the default for the way it is made (a milled design is sized as made). */
  asMade?: AsMade;
}

/**
 * A fresh, valid, empty design. Without options: FR-4 1.6 mm, f0 2.45 GHz over 2.4–2.5 GHz, a V-bit process.
 * Given only f0, the band is f0 ± 2 %.
 *
 * @example newDesign({ name: 'Patch feed', f0: 5.8e9 })
 */
export function newDesign(opts: NewDesignOptions = {}): DesignDoc {
  const f0 = opts.f0 ?? FREQUENCY_DEFAULT.f0;
  const band = opts.band ?? (opts.f0 === undefined ? { ...FREQUENCY_DEFAULT.band } : { start: f0 * 0.98, stop: f0 * 1.02 });
  const doc: DesignDoc = {
    format: DESIGN_FORMAT,
    version: DESIGN_VERSION,
    name: opts.name ?? 'Untitled design',
    substrate: { ...FR4_DEFAULT, ...opts.substrate },
    frequency: { f0, band: { ...band } },
    process: structuredCopy(opts.process ?? PROCESS_DEFAULT),
    nodes: [],
    segments: [],
    board: null,
    areas: [],
    phaseGroups: [],
    targets: [],
    tolerances: [],
  };
  if (opts.notes !== undefined) doc.notes = opts.notes;
  // New files say how their lines are sized: as made when milled (the default), unless the caller chose.
  doc.asMade = structuredCopy(opts.asMade ?? defaultAsMade(doc.process));
  return doc;
}

/** Deep copy of plain JSON data (the core has no structuredClone in its ES2022 library). */
export function structuredCopy<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}
