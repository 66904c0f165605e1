/**
 * Generic land sizes for two-terminal SMD parts (resistors, capacitors, inductors) by EIA size code.
 *
 * Where the numbers come from: written from memory as typical nominal reflow land patterns for chip parts
 * (pad length along the part axis, pad width across it, pad centre to pad centre), rounded to 0.05 mm. They are
 * NOT a copy of any standard's table; check the part maker's recommended land pattern for a real build. Body
 * sizes behind the codes (inches ×0.01): 0402 = 1.0 × 0.5 mm, 0603 = 1.6 × 0.8 mm, 0805 = 2.0 × 1.25 mm,
 * 1206 = 3.2 × 1.6 mm (the size codes themselves are the trade's common naming).
 */
import type { SmdSize } from './types.ts';
import { exhaustive } from '../util/errors.ts';

/** Pad sizes and pitch of a chip part's land pattern (m). Kept with the design so edits (inserting a part) and sizing read one table. */
export interface SmdFootprint {
  size: SmdSize;
  /** Pad length along the part's axis, m. */
  padAlong: number;
  /** Pad width across the part's axis, m. */
  padAcross: number;
  /** Pad centre to pad centre, m. */
  pitch: number;
}

export function smdFootprint(size: SmdSize): SmdFootprint {
  switch (size) {
    case '0402': return { size, padAlong: 0.5e-3, padAcross: 0.6e-3, pitch: 1.0e-3 };
    case '0603': return { size, padAlong: 0.8e-3, padAcross: 0.9e-3, pitch: 1.6e-3 };
    case '0805': return { size, padAlong: 1.0e-3, padAcross: 1.4e-3, pitch: 2.0e-3 };
    case '1206': return { size, padAlong: 1.2e-3, padAcross: 1.8e-3, pitch: 3.1e-3 };
    default: return exhaustive(size, 'size');
  }
}
