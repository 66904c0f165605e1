/** The pipeline from a design to its files (see README.md): stages memoised per revision, and exportDesign. */
export * from './memo.ts';
export * from './revision.ts';
export * from './refusal.ts';
export * from './stages.ts';
export * from './request.ts';
export * from './formats.ts';
export * from './export.ts';
export * from './gcode.ts';
export * from './sweep.ts';
