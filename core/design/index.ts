/**
 * The design document: types, loading (validation, migrations), saving, commands as data and undo by diffs.
 * Faces read and edit designs only through these.
 */
export * from './types.ts';
export { DESIGN_LIMITS, PROCESS_LIMITS } from './limits.ts';
export { MAX_MEASURED, measuredListSchema } from './measured.ts';
export type { DesignIssue } from './issues.ts';
export { DESIGN_VERSION, MIGRATIONS, migrate, type Migration } from './migrations.ts';
export { asMadeOf, isMilled } from './as-made-default.ts';
export { newDesign, FR4_DEFAULT, PROCESS_DEFAULT, FREQUENCY_DEFAULT, type NewDesignOptions } from './defaults.ts';
export { validateDesign, type ValidateResult, type ValidateOptions } from './validate.ts';
export { parseDesign, type ParseResult } from './parse.ts';
export { serializeDesign } from './serialize.ts';
export { DEGREE } from './crossref.ts';
export { DESIGN_COMMANDS, runCommand, defaultNodeSpec, DEFAULT_SEGMENT_SPEC, type DesignCommand } from './commands.ts';
export { snap as snapToGrid } from './command-args.ts';
export { copySelection, pasteClipboard, CLIPBOARD_FORMAT, type ClipboardContent } from './clipboard.ts';
export { diffDesigns, applyDiff, invertDiff, isEmptyDiff, jsonEqual, type DesignDiff, type RecordChanges } from './diff.ts';
export { History, type HistoryOptions, type HistoryStep } from './history.ts';
export { applyCommandList, parseCommandList, readCommandList, summarizeChanges, MAX_COMMANDS, type CommandEntry, type BatchResult, type ChangeSummary } from './command-list.ts';
export { namer, nameOf, nodeByName, portNamesText, sParameterName } from './names.ts';
export { targetSchema, targetsSchema } from './targets-schema.ts';
export { withBlock, type BlockRecords } from './commands-blocks.ts';
export { TARGET_FIGURES, FIGURE_PORTS, TOLERANCE_QUANTITIES, TOLERANCE_WORDS, FIGURE_WORDS, FIGURE_UNIT_SUFFIX } from './targets.ts';
export type { FigureUnit } from './targets.ts';
export { proximityLimitSchema, proximityLimitSettingFrom, proximityLimitMetres, proximityLimitFor, proximityLimitText, DEFAULT_PROXIMITY_LIMIT, PROXIMITY_MAX_HEIGHTS } from './proximity-limit.ts';
