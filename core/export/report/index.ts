export { designReport, type DesignReport, type ReportOptions, type PlacedPlot } from './report.ts';
export type { DrawItem, ReportPage, Rgb } from './drawing.ts';
