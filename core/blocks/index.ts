/**
 * Blocks: pure generator functions that make a complete, sized-ready design from a small spec (a later block registry
 * can wrap them). Each names its design equations in its own file.
 */
export { prototypeValues, type PrototypeKind } from './lowpassPrototype.ts';
export { couplerBlock, type CouplerOptions } from './coupler.ts';
export { bandpassBlock, bandpassSections, type BandpassOptions } from './bandpassEdgeCoupled.ts';
export type { BlockBase } from './common.ts';
