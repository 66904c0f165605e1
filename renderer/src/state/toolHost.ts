/**
 * What the drawing tools may do to the editor (board/tools.ts ToolHost), over the editor state. The board shows
 * nodes where the layout placed them while the design keeps the drawn positions, so a point clicked relative to a
 * placed node is carried into the drawn frame by that node's offset.
 */
import type { Vec2 } from '../../../core/index.ts';
import { InputError } from '../../../core/index.ts';
import type { ToolHost, InsertKind } from '../board/tools.ts';
import { boxSelect } from '../board/hit.ts';
import type { EditorState } from './editor.svelte.ts';

export function createToolHost(ed: EditorState): ToolHost {
  const offsetOf = (nodeId: string): Vec2 => {
    const n = ed.doc.nodes.find((x) => x.id === nodeId);
    const p = ed.layout?.placed.get(nodeId);
    return n && p ? { x: p.at.x - p.pos.x, y: p.at.y - p.pos.y } : { x: 0, y: 0 };
  };
  const shift = (pts: Vec2[], o: Vec2) => pts.map((p) => ({ x: p.x + o.x, y: p.y + o.y }));
  return {
    gridStep: () => ed.gridStep,
    nodeAt: (id) => {
      const n = ed.scene.nodes.find((x) => x.id === id);
      return n ? { at: n.at, kind: n.kind } : null;
    },
    segmentEnds: (id) => {
      const s = ed.scene.segments.find((x) => x.id === id);
      if (!s) return null;
      const c = s.centreline;
      return c && c.length >= 2 ? { a: c[0]!, b: c[c.length - 1]! } : { a: s.a, b: s.b };
    },
    isSelected: (id) => ed.selection.has(id),
    select: (ids, mode) => ed.select(ids, mode),
    hover: (id, at) => { ed.hovered = id; ed.hoverAt = at; },
    beginMove: () => { ed.fieldEnd(true); try { ed.history.beginLive('Move'); } catch { /* a drag is already live */ } },
    moveBy: (d) => {
      try { ed.history.apply('selection.translate', { ids: [...ed.selection], by: d }); } catch (err) {
        ed.status = err instanceof InputError ? `Cannot move there: ${err.expected}` : String(err);
      }
    },
    endMove: (commit) => {
      if (commit) ed.history.commitLive(); else ed.history.cancelLive();
      ed.canUndo = ed.history.canUndo;
      ed.canRedo = ed.history.canRedo;
    },
    boxSelect: (box, additive) => ed.select(boxSelect(ed.scene, box), additive ? 'add' : 'replace'),
    addRun: (from, points) => {
      const before = new Set(ed.doc.segments.map((s) => s.id));
      if (ed.edit('editor.route', { from, points: shift(points, offsetOf(from)) })) {
        const made = ed.doc.segments.filter((s) => !before.has(s.id)).map((s) => s.id);
        ed.selection = new Set(made.slice(-1));
        ed.status = `Routed ${made.length} line${made.length === 1 ? '' : 's'}`;
      }
    },
    addTee: (segment, at, points) => {
      const seg = ed.doc.segments.find((s) => s.id === segment);
      const o = seg ? offsetOf(seg.a) : { x: 0, y: 0 };
      ed.edit('editor.tee', { segment, at: shift([at], o)[0], points: shift(points, o) });
    },
    addStub: (segment, at, side, end) => {
      const seg = ed.doc.segments.find((s) => s.id === segment);
      const o = seg ? offsetOf(seg.a) : { x: 0, y: 0 };
      ed.edit('editor.stub', { segment, at: shift([at], o)[0], side, end });
    },
    insert: (segment, at, kind: InsertKind) => {
      const seg = ed.doc.segments.find((s) => s.id === segment);
      const o = seg ? offsetOf(seg.a) : { x: 0, y: 0 };
      ed.edit('editor.insert', { segment, at: shift([at], o)[0], kind });
    },
    addPort: (at) => ed.edit('node.add', { at, spec: { kind: 'port' } }),
    setOutline: (points) => ed.edit('board.setOutline', { outline: points }),
    addArea: (kind, points) => {
      // Areas are stored counter-clockwise (outer rings, core/geometry/types.ts), whichever way they were clicked.
      let a2 = 0;
      for (let i = 0; i < points.length; i++) { const p = points[i]!, q = points[(i + 1) % points.length]!; a2 += p.x * q.y - q.x * p.y; }
      ed.edit('area.add', { kind, polygon: a2 < 0 ? [...points].reverse() : points }, kind === 'keep-out' ? 'Add keep-out' : 'Add ground copper');
    },
    preview: (p) => ed.board?.preview(p),
    status: (t) => { ed.status = t; },
  };
}
