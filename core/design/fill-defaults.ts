/**
 * Sections a hand-written design may leave out, filled with documented defaults before the schema runs (the README's
 * "Writing a design by hand" lists them). Each fill is named in an info note, so nothing is filled silently.
 * Headings written as an angle with a unit ("90 deg", "90°", "1.571 rad") become radians here; a heading given as a
 * plain number stays radians, as the file format has always held it.
 *
 * Defaults (the project's own choices; the copper values are common practice):
 *  - substrate.sigma: the named preset's conductivity, else annealed copper 5.8e7 S/m;
 *  - substrate.roughness: the named preset's roughness, else 0 (smooth copper);
 *  - frequency.band: f0 ± 2 % (as a new design given only f0);
 *  - process: a 30° V-bit, 0.1 mm tip, 0.05 mm deep (PROCESS_DEFAULT);
 *  - board: null (no outline); areas, phaseGroups, targets, tolerances: empty lists.
 */
import { parseQuantity } from '../units/quantity.ts';
import { ANNEALED_COPPER_SIGMA } from '../substrate/defaults.ts';
import { findPreset } from '../substrate/presets.ts';
import { InputError, describe } from '../util/errors.ts';
import type { Warning } from '../util/warnings.ts';
import { PROCESS_DEFAULT, structuredCopy } from './defaults.ts';
import { issue, type DesignIssue } from './issues.ts';

/** The relative band a missing `frequency.band` spans on each side of f0 (the same as `newDesign` given only f0). */
export const BAND_DEFAULT_FRACTION = 0.02;

type Obj = Record<string, unknown>;
const isObj = (x: unknown): x is Obj => x !== null && typeof x === 'object' && !Array.isArray(x);

export interface FillResult { doc: Obj; filled: string[]; errors: DesignIssue[]; warnings: Warning[] }

/** Returns a copy of `raw` with the missing sections filled, the paths filled and any heading that cannot be read. */
export function fillDefaults(raw: Obj): FillResult {
  const doc = { ...raw };
  const filled: string[] = [];
  const fill = (target: Obj, key: string, value: unknown, path: string, shown: string): void => {
    if (target[key] !== undefined) return;
    target[key] = value;
    filled.push(`${path} = ${shown}`);
  };
  if (isObj(doc.substrate)) {
    const sub = { ...doc.substrate };
    doc.substrate = sub;
    const preset = typeof sub.preset === 'string' ? findPreset(sub.preset) : undefined;
    const sigma = preset?.spec.sigma ?? ANNEALED_COPPER_SIGMA;
    const rough = preset?.spec.roughness ?? 0;
    const from = preset ? ` (preset ${preset.id})` : '';
    fill(sub, 'sigma', sigma, 'substrate.sigma', `${sigma / 1e6} MS/m${from || ' (annealed copper)'}`);
    fill(sub, 'roughness', rough, 'substrate.roughness', `${rough * 1e6} µm${from || ' (smooth copper)'}`);
  }
  if (isObj(doc.frequency) && typeof doc.frequency.f0 === 'number' && Number.isFinite(doc.frequency.f0)) {
    const f = { ...doc.frequency };
    doc.frequency = f;
    const f0 = f.f0 as number;
    const band = { start: f0 * (1 - BAND_DEFAULT_FRACTION), stop: f0 * (1 + BAND_DEFAULT_FRACTION) };
    fill(f, 'band', band, 'frequency.band', `f0 ± ${BAND_DEFAULT_FRACTION * 100} % (${band.start / 1e9}–${band.stop / 1e9} GHz)`);
  }
  fill(doc, 'process', structuredCopy(PROCESS_DEFAULT), 'process', '30° V-bit, 0.1 mm tip, 0.05 mm deep');
  fill(doc, 'board', null, 'board', 'null (no outline)');
  for (const key of ['areas', 'phaseGroups', 'targets', 'tolerances']) fill(doc, key, [], key, '[]');
  const errors = Array.isArray(doc.nodes) ? readHeadings(doc) : [];
  const warnings: Warning[] = filled.length
    ? [{ code: 'note', severity: 'info', source: 'design-defaults', message: `Filled with defaults (the file left them out): ${filled.join('; ')}. Saving writes them into the file.` }]
    : [];
  return { doc, filled, errors, warnings };
}

/** Headings written as text with an angle unit become radians; text without a unit is refused (degrees or radians?). */
function readHeadings(doc: Obj): DesignIssue[] {
  const errors: DesignIssue[] = [];
  const nodes = (doc.nodes as unknown[]).slice();
  doc.nodes = nodes;
  nodes.forEach((n, i) => {
    if (!isObj(n) || typeof n.heading !== 'string') return;
    const path = `nodes[${i}].heading`;
    const text = n.heading;
    const expected = 'a heading in radians (a number) or an angle with its unit, e.g. "90 deg", "90°" or "1.571 rad"';
    if (!/^\s*[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*[^\d.\s]/.test(text)) {
      errors.push(issue('invalid-design', path, expected, describe(text), { fix: /^\s*[+-]?[\d.]/.test(text) ? `say which unit: "${text.trim()} deg" or "${text.trim()} rad"` : 'write a number with deg, ° or rad' }));
      return;
    }
    try {
      nodes[i] = { ...n, heading: parseQuantity(text, 'angle', path) };
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      errors.push(issue('invalid-design', path, expected, describe(text), { fix: 'use deg, ° or rad as the unit' }));
    }
  });
  return errors;
}
