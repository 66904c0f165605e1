/**
 * The names of exported files, one table for every face (CLI, board editor), so a board exported from the app and
 * from the command line gives the same file set. `base` is a stem made by `exportBase` (the CLI from the design
 * file's name, the app from the design's name).
 */

/** The one rule for the stem of exported file names: letters, digits, '_', '.', '-'; anything else becomes '_'. */
export function exportBase(name: string): string {
  const stem = name.replace(/[^\w.-]+/g, '_').replace(/^[.]+/, '');
  return stem || 'board';
}

export const EXPORT_FILE_NAMES = {
  dxf: (base: string) => `${base}.dxf`,
  svg: (base: string) => `${base}.svg`,
  gerberCopperTop: (base: string) => `${base}-copper-top.gbr`,
  gerberCopperBottom: (base: string) => `${base}-copper-bottom.gbr`,
  gerberProfile: (base: string) => `${base}-profile.gbr`,
  drillPlated: (base: string) => `${base}-plated.drl`,
  drillNonPlated: (base: string) => `${base}-nonplated.drl`,
  maskSvg: (base: string) => `${base}-mask.svg`,
  maskPdf: (base: string) => `${base}-mask.pdf`,
  /** One G-code file per tool, numbered in the order to run them. */
  gcode: (base: string, tool: { number: number; slug: string }) => `${base}-T${tool.number}-${tool.slug}.nc`,
} as const;
