/** The chip-part land table lives with the design (core/design/footprints.ts); sizing reads it from there. */
export { smdFootprint, type SmdFootprint } from '../design/footprints.ts';
