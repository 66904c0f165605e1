/** Quantities with units: one parser and formatter for every face; SI inside. */
export { parseQuantity, formatQuantity, QUANTITY_KINDS, OZ_COPPER_M, IACS_S_PER_M } from './quantity.ts';
export type { QuantityKind } from './quantity.ts';
export { C0, MU0, EPS0, ETA0, NP_TO_DB } from './constants.ts';
