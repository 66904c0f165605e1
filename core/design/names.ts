/**
 * How a record is named for people: by the label the user gave it, by its id only where it has none. Every face
 * (path ledger, shop check, response chips and tooltips, CLI tables, Touchstone comments) names ports, nodes and
 * pieces through these functions, so "in" and "out 2" read the same everywhere. Two records sharing a label are told
 * apart by their ids ("out (n7)"), so a name always points at one record.
 */
import type { DesignDoc } from './types.ts';

type Named = { id: string; label?: string | undefined };
type Records = Pick<DesignDoc, 'nodes'> & Partial<Pick<DesignDoc, 'segments' | 'areas' | 'phaseGroups'>>;

const labelOf = (r: Named): string | undefined => {
  const t = r.label?.trim();
  return t ? t : undefined;
};

/**
 * A function naming any record of `doc` (node, segment, area, phase group) by id: its label, `label (id)` when
 * another record has the same label, else the id itself. Unknown ids are returned as they are.
 *
 * @example const name = namer(doc); name('n1') // → 'in'
 */
export function namer(doc: Records): (id: string) => string {
  const all: Named[] = [...doc.nodes, ...(doc.segments ?? []), ...(doc.areas ?? []) as Named[], ...(doc.phaseGroups ?? []).map((g) => ({ id: g.id, label: g.name }))];
  const uses = new Map<string, number>();
  for (const r of all) { const l = labelOf(r); if (l !== undefined) uses.set(l, (uses.get(l) ?? 0) + 1); }
  const names = new Map<string, string>();
  for (const r of all) {
    if (names.has(r.id)) continue;
    const l = labelOf(r);
    names.set(r.id, l === undefined ? r.id : (uses.get(l) ?? 0) > 1 && l !== r.id ? `${l} (${r.id})` : l);
  }
  return (id: string) => names.get(id) ?? id;
}

/** The name of one record of `doc` (see `namer`; build a namer once when naming many). */
export function nameOf(doc: Records, id: string): string {
  return namer(doc)(id);
}

/**
 * The node a person means by `ref`: a node id, else the one node whose label is `ref` (labels compared without
 * surrounding spaces). Undefined when nothing matches or the label is shared (then only the id says which).
 */
export function nodeByName(doc: Pick<DesignDoc, 'nodes'>, ref: string): string | undefined {
  if (doc.nodes.some((n) => n.id === ref)) return ref;
  const want = ref.trim();
  const hits = doc.nodes.filter((n) => labelOf(n) === want);
  return hits.length === 1 ? hits[0]!.id : undefined;
}

/** The ports of `doc` as people know them, for messages: "in, out 1, out 2". */
export function portNamesText(doc: Pick<DesignDoc, 'nodes'>): string {
  const name = namer(doc);
  return doc.nodes.filter((n) => n.kind === 'port').map((n) => name(n.id)).join(', ');
}

/**
 * An S-parameter named with its ports: `S21 (out ← in)` for a transmission, `S11 (in)` for a reflection. `names`
 * are the port names in response order. With more than nine ports the indices are separated (`S10,2`) so they
 * read unambiguously.
 */
export function sParameterName(i: number, j: number, names: readonly string[]): string {
  const sep = names.length > 9 ? ',' : '';
  const s = `S${i + 1}${sep}${j + 1}`;
  const a = names[i] ?? String(i + 1), b = names[j] ?? String(j + 1);
  return i === j ? `${s} (${a})` : `${s} (${a} ← ${b})`;
}
