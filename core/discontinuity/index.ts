/**
 * Discontinuity models: each file one published model (or one common-practice rule, marked so) with its source,
 * equations and validity. Junction models (tee, step) feed sizing and the network; see docs/junctions.md.
 */
export * from './kirschningJansenKoster1981OpenEnd.ts';
export * from './douvilleJames1978Miter.ts';
export * from './goldfarbPucel1991Via.ts';
export * from './hammerstad1981TeeJunction.ts';
export * from './gargBahl1978Step.ts';
export * from './curvedBend.ts';
export * from './junctionResidual.ts';
