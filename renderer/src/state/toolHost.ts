/**
 * What the drawing tools may do to the editor (board/tools.ts ToolHost), over the editor state. The board shows
 * nodes where the layout placed them while the design keeps the drawn positions, so a point clicked relative to a
 * placed node is carried into the drawn frame by that node's offset.
 */
import type { Vec2 } from '../../../core/index.ts';
import { InputError } from '../../../core/index.ts';
import type { ToolHost, InsertKind, RunEnd } from '../board/tools.ts';
import { formatQuantity } from '../../../core/index.ts';
import { boxSelect } from '../board/hit.ts';
import type { EditorState } from './editor.svelte.ts';

export function createToolHost(ed: EditorState): ToolHost {
  const offsetOf = (nodeId: string): Vec2 => {
    const n = ed.doc.nodes.find((x) => x.id === nodeId);
    const p = ed.layout?.placed.get(nodeId);
    return n && p ? { x: p.at.x - p.pos.x, y: p.at.y - p.pos.y } : { x: 0, y: 0 };
  };
  const shift = (pts: Vec2[], o: Vec2) => pts.map((p) => ({ x: p.x + o.x, y: p.y + o.y }));
  const segOffset = (id: string): Vec2 => { const seg = ed.doc.segments.find((x) => x.id === id); return seg ? offsetOf(seg.a) : { x: 0, y: 0 }; };
  // Points carried into the drawn frame by the start's offset; a last point on a line by that line's own offset.
  const place = (pts: Vec2[], o: Vec2, end: RunEnd): Vec2[] => {
    const out = shift(pts, o);
    if (end && 'segment' in end && pts.length) out[out.length - 1] = shift([pts[pts.length - 1]!], segOffset(end.segment))[0]!;
    return out;
  };
  return {
    gridStep: () => ed.gridStep,
    nodeAt: (id) => {
      const n = ed.scene.nodes.find((x) => x.id === id);
      const degree = ed.doc.segments.filter((s) => s.a === id || s.b === id).length;
      return n ? { at: n.at, kind: n.kind, degree } : null;
    },
    formatLength: (m) => formatQuantity(m, 'length', { unit: ed.units === 'mil' ? 'mil' : 'mm', digits: 4 }),
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
      ed.settled++;
      ed.canUndo = ed.history.canUndo;
      ed.canRedo = ed.history.canRedo;
    },
    boxSelect: (box, additive) => ed.select(boxSelect(ed.scene, box), additive ? 'add' : 'replace'),
    addRun: (from, points, end) => {
      const before = new Set(ed.doc.segments.map((x) => x.id));
      const o = offsetOf(from);
      if (ed.edit('run.route', { from, points: place(points, o, end), ...(end ? { onto: end } : {}) })) {
        const made = ed.doc.segments.filter((x) => !before.has(x.id)).map((x) => x.id);
        ed.selection = new Set(made.slice(-1));
        ed.status = `Routed ${made.length} line${made.length === 1 ? '' : 's'}${end && 'segment' in end ? ', joined to the line with a tee' : end ? ', joined' : ''}`;
      }
    },
    addTee: (segment, at, points, end) => {
      const o = segOffset(segment);
      ed.edit('run.tee', { segment, at: shift([at], o)[0], points: place(points, o, end), ...(end ? { onto: end } : {}) });
    },
    addStub: (segment, at, side, end) => {
      ed.edit('run.stub', { segment, at: shift([at], segOffset(segment))[0], side, end });
    },
    insert: (segment, at, kind: InsertKind) => {
      const before = new Map(ed.doc.segments.map((x) => [x.id, x]));
      if (!ed.edit('run.insert', { segment, at: shift([at], segOffset(segment))[0], kind })) return;
      if (kind === 'step') {
        // Say which side took the new width, and select it so the sheet shows it.
        const was = JSON.stringify((before.get(segment) as { width?: unknown } | undefined)?.width);
        const changed = ed.doc.segments.find((x) => x.kind === 'line' && (x.id === segment || !before.has(x.id)) && JSON.stringify(x.width) !== was);
        if (changed) {
          ed.selection = new Set([changed.id]);
          const w = changed.kind === 'line' && changed.width.by === 'z0' ? `${changed.width.z0} Ω` : 'the new width';
          ed.status = `Width step: ${ed.nodeName(changed.id)} (from ${ed.nodeName(changed.a)} to ${ed.nodeName(changed.b)}) is now ${w}; the other side keeps its width`;
        }
      }
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
