/**
 * Text helpers of the quantity field: a bare number typed into a field takes the unit the field shows, so "13" in
 * a field showing "12 mm" means 13 mm (and "2.45" in a GHz field 2.45 GHz, never 2.45 Hz).
 */
const BARE_NUMBER = /^\s*[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*$/;
const LEADING_NUMBER = /^\s*[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*(.*)$/;

/** The unit of a formatted quantity ("1.6 mm" → "mm", "90°" → "°", "0.02" → ""). */
export function unitOf(shown: string): string {
  return LEADING_NUMBER.exec(shown)?.[1]?.trim() ?? '';
}

/** `typed` with `unit` added when it is a bare number (and the field shows a unit); otherwise as typed. */
export function withShownUnit(typed: string, unit: string): string {
  if (!unit || !BARE_NUMBER.test(typed)) return typed;
  return `${typed.trim()} ${unit}`;
}
