/**
 * Writing a design as text: stable key order (known keys in the order of types.ts, then unknown keys sorted),
 * 2-space indent, a trailing newline, so saved files diff cleanly in version control. Unknown fields, at the top
 * level and inside records, are written back unchanged. A number that is not finite is refused (JSON would turn it
 * into null and the file would no longer load).
 */
import { InputError } from '../util/errors.ts';
import type { DesignDoc } from './types.ts';

interface Order { keys: readonly string[]; children?: Record<string, Order>; items?: Order }

const XY: Order = { keys: ['x', 'y'] };
const POINTS: Order = { keys: [], items: XY };
const WIDTH: Order = { keys: ['by', 'z0', 'width'] };
const ORDER: Order = {
  keys: ['format', 'version', 'app', 'name', 'notes', 'substrate', 'frequency', 'process', 'board', 'nodes', 'segments', 'areas', 'phaseGroups', 'targets', 'tolerances', 'junctions', 'asMade', 'blocks', 'sweep', 'measured', 'proximityLimit', 'view'],
  children: {
    substrate: { keys: ['preset', 'er', 'h', 't', 'tanDelta', 'sigma', 'roughness', 'dielectricModel'], children: { dielectricModel: { keys: ['kind', 'fMeasure'] } } },
    frequency: { keys: ['f0', 'band'], children: { band: { keys: ['start', 'stop'] } } },
    process: { keys: ['kind', 'toolDiameter', 'tipWidth', 'angleDeg', 'depth', 'edgeBias', 'minFeature'] },
    asMade: { keys: ['sizing', 'sideCopper', 'cover', 'fencePitch'], children: { cover: { keys: ['er', 'thickness'] } } },
    board: { keys: ['outline'], children: { outline: POINTS } },
    nodes: {
      keys: [], items: {
        keys: ['id', 'kind', 'label', 'at', 'zRef', 'heading', 'launch', 'bend', 'via'],
        children: { at: XY, launch: { keys: ['padWidth', 'padLength', 'pinDrill'] }, bend: { keys: ['style', 'fraction', 'radius'] }, via: { keys: ['drill', 'pad', 'count', 'plating'] } },
      },
    },
    segments: {
      keys: [], items: {
        keys: ['id', 'kind', 'label', 'a', 'b', 'c', 'd', 'part', 'value', 'size', 'name', 'profile', 'width', 'from', 'to', 'pair', 'length', 'rippleDb', 'touchstone'],
        children: { width: WIDTH, from: WIDTH, to: WIDTH, length: { keys: ['by', 'deg', 'length'] }, pair: { keys: ['by', 'width', 'gap', 'z0Even', 'z0Odd'] } },
      },
    },
    areas: { keys: [], items: { keys: ['id', 'kind', 'clearance', 'polygon'], children: { polygon: POINTS } } },
    phaseGroups: { keys: [], items: { keys: ['id', 'name', 'from', 'to', 'toleranceDeg'] } },
    targets: { keys: [], items: { keys: ['id', 'name', 'figure', 'ports', 'group', 'band', 'limit'], children: { band: { keys: ['start', 'stop'] }, limit: { keys: ['min', 'max'] } } } },
    tolerances: { keys: [], items: { keys: ['quantity', 'distribution', 'spread', 'scope'] } },
    blocks: { keys: [], items: { keys: ['id', 'kind', 'at', 'spec', 'members', 'made'], children: { at: XY } } },
    sweep: { keys: ['start', 'stop', 'points', 'spacing'] },
    measured: { keys: [], items: { keys: ['id', 'name', 'ports', 'touchstone'] } },
    proximityLimit: { keys: ['by', 'heights', 'length'] },
    view: { keys: ['units', 'grid'] },
  },
};

/**
 * The file text of `doc`.
 *
 * @example writeFile(path, serializeDesign(doc))  // in a face; the core never touches files
 */
export function serializeDesign(doc: DesignDoc): string {
  return stringify(canonical(doc, ORDER, ''), '') + '\n';
}

/** Widest line kept on one line for a small leaf object or list (a point, a width spec). */
const INLINE_MAX = 72;

/**
 * JSON with 2-space indent where objects and lists holding only plain values (points, width and length specs)
 * stay on one line when short: a design of a hundred nodes stays readable and diffs one line per change.
 */
function stringify(value: unknown, indent: string): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value);
  const inner = indent + '  ';
  const isArr = Array.isArray(value);
  const entries: [string | null, unknown][] = isArr ? (value as unknown[]).map((x) => [null, x]) : Object.entries(value as object);
  if (entries.length === 0) return isArr ? '[]' : '{}';
  const leaf = entries.every(([, x]) => x === null || typeof x !== 'object');
  if (leaf) {
    const parts = entries.map(([k, x]) => (k === null ? '' : JSON.stringify(k) + ': ') + JSON.stringify(x));
    const one = isArr ? `[${parts.join(', ')}]` : `{ ${parts.join(', ')} }`;
    if (one.length + indent.length <= INLINE_MAX && !one.includes('\n')) return one;
  }
  const lines = entries.map(([k, x]) => inner + (k === null ? '' : JSON.stringify(k) + ': ') + stringify(x, inner));
  return (isArr ? '[\n' : '{\n') + lines.join(',\n') + '\n' + indent + (isArr ? ']' : '}');
}

/** A copy of `value` with keys in canonical order; throws InputError on a non-finite number or a cycle. */
export function canonical(value: unknown, order: Order | undefined, path: string, depth = 0): unknown {
  if (depth > 64) throw new InputError('invalid-design', path || 'design', 'nesting at most 64 levels deep (or a cycle)', 'deeper');
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new InputError('invalid-number', path || 'design', 'a finite number (the design cannot be saved with it)', String(value));
    return Object.is(value, -0) ? 0 : value;
  }
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map((x, i) => canonical(x, order?.items, `${path}[${i}]`, depth + 1));
  const obj = value as Record<string, unknown>;
  const out: Record<string, unknown> = {};
  const known = order?.keys ?? [];
  for (const k of known) if (obj[k] !== undefined && Object.hasOwn(obj, k)) out[k] = canonical(obj[k], order?.children?.[k], path ? `${path}.${k}` : k, depth + 1);
  const rest = Object.keys(obj).filter((k) => !known.includes(k) && obj[k] !== undefined).sort();
  for (const k of rest) out[k] = canonical(obj[k], undefined, path ? `${path}.${k}` : k, depth + 1);
  return out;
}
