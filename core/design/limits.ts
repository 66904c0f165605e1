/**
 * Size limits of a design file. They keep a wrong or hostile file from freezing the app: each is far above what a
 * real feed network needs (the largest example has a few dozen nodes) and each has its own clear message.
 */
export const DESIGN_LIMITS = {
  /** Whole file, UTF-8 bytes. */
  fileBytes: 16 * 1024 * 1024,
  /** Nesting of objects and lists (a design needs 5; unknown fields from a newer app get some room). */
  depth: 32,
  /** Items in any one list of the file. */
  listItems: 100_000,
  nodes: 20_000,
  segments: 20_000,
  areas: 1_000,
  phaseGroups: 500,
  /** Points of the board outline or of one area polygon. */
  polygonPoints: 10_000,
  /** Ports listed in one phase group. */
  phaseGroupPorts: 1_000,
  /** Characters. */
  id: 64,
  name: 200,
  label: 200,
  notes: 50_000,
  /** Touchstone text kept inside a segment. */
  touchstone: 2_000_000,
  /** Problems reported for one file; the rest are counted in one closing line. */
  issues: 50,
} as const;

/**
 * What real cutting tools and etch processes are, so a slip (a unit mistake, an angle typed as 179.9°) is refused at
 * load instead of making a cut metres wide that the polygon engine then works on for minutes. Generous bounds, from
 * memory of what is sold and used for isolation milling and etching (common practice):
 * - engraving V-bits come with included angles from about 10° to 90°, chamfer bits up to 120°; flat tips up to
 *   about 0.5 mm; an isolation cut goes just through the copper (18–70 µm), 1 mm deep is already a groove;
 * - end mills for boards run from 0.05 mm micro mills to 1/4 inch (6.35 mm); 3.5 mm cuts through a 3.2 mm board;
 * - etching undercuts each edge by about the copper thickness (35 µm for 1 oz); ±0.25 mm covers 6 oz copper; the
 *   smallest feature of home etching is some tenths of a millimetre, 10 µm to 2 mm covers every process.
 */
export const PROCESS_LIMITS = {
  vBitAngleDegMin: 10,
  vBitAngleDegMax: 120,
  vBitTipMax: 0.5e-3,
  vBitDepthMax: 1e-3,
  endMillDiameterMin: 0.05e-3,
  endMillDiameterMax: 6.35e-3,
  endMillDepthMax: 3.5e-3,
  etchBiasMax: 0.25e-3,
  etchMinFeatureMin: 10e-6,
  etchMinFeatureMax: 2e-3,
} as const;

/** Byte length of `text` encoded as UTF-8, without TextEncoder (not part of the core's ES2022 library). */
export function utf8Length(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d <= 0xdfff) { n += 4; i++; } else n += 3;
    } else n += 3;
  }
  return n;
}

/** "1.2 MB" style size for messages. */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}
