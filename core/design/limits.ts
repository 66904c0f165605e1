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
