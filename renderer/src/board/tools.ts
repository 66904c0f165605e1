/**
 * The drawing tools as a small state machine over board pointer events. It knows nothing about Svelte or the
 * design file: it asks its host (the editor state) to select, move, and commit edits, and tells the host what to
 * show as a preview. Every committed edit is one call to the host, so it is one undo step.
 */
import type { Box, Vec2 } from '../../../core/index.ts';
import type { BoardPointer, Preview } from './BoardController.ts';
import { headingRuleFor, projectOnSegment, snapHeading, snapToGrid } from './snap.ts';

/** Our own tool names; the keys are the ones shown in the tool strip. */
export type ToolId = 'pick' | 'route' | 'tee' | 'stub-open' | 'stub-short' | 'step' | 'taper' | 'part' | 'port' | 'outline' | 'ground' | 'keepout';

export const TOOLS: { id: ToolId; label: string; key: string; hint: string }[] = [
  { id: 'pick', label: 'Pick', key: 'V', hint: 'Click to select, drag to move, drag on empty board to select a box' },
  { id: 'route', label: 'Route', key: 'R', hint: 'Click a port, an open end, a corner or a line, then each corner; end on a line to join it with a tee; double-click or Enter ends, Esc drops' },
  { id: 'tee', label: 'Tee', key: 'T', hint: 'Click a line or a corner to branch it, then click the corners of the branch' },
  { id: 'stub-open', label: 'Open stub', key: 'O', hint: 'Click a run where the open stub hangs; the side follows the cursor' },
  { id: 'stub-short', label: 'Shorted stub', key: 'S', hint: 'Click a run where the shorted stub hangs; it ends in a via' },
  { id: 'step', label: 'Width step', key: 'W', hint: 'Click a run where its width changes: the side from the click to the nearer end takes the new width' },
  { id: 'taper', label: 'Taper', key: 'A', hint: 'Click a run to insert a taper' },
  { id: 'part', label: 'Part', key: 'L', hint: 'Click a run to insert a lumped part (resistor, capacitor, inductor)' },
  { id: 'port', label: 'Port', key: 'P', hint: 'Click to place a port' },
  { id: 'outline', label: 'Board edge', key: 'B', hint: 'Click the corners of the board edge; double-click or Enter closes it' },
  { id: 'ground', label: 'Ground copper', key: 'G', hint: 'Click the corners of an area kept as ground copper (cleared around the network); Enter closes it' },
  { id: 'keepout', label: 'Keep-out', key: 'K', hint: 'Click the corners of an area where no copper may go; Enter closes it' },
];

export type InsertKind = 'step' | 'taper' | 'part';

/** Where a run ends when it is not left open: on a line (a tee is made there) or on a node. */
export type RunEnd = { segment: string } | { node: string } | null;

/** What the tools need from the editor. */
export interface ToolHost {
  gridStep(): number;
  nodeAt(id: string): { at: Vec2; kind: string; degree: number } | null;
  /** A length in the display unit, for the live readout while drawing. */
  formatLength(m: number): string;
  segmentEnds(id: string): { a: Vec2; b: Vec2 } | null;
  isSelected(id: string): boolean;
  select(ids: string[], mode: 'replace' | 'toggle' | 'add'): void;
  hover(id: string | null, at: Vec2): void;
  /** Live move of the selection (no undo step until endMove). */
  beginMove(): void;
  moveBy(delta: Vec2): void;
  endMove(commit: boolean): void;
  boxSelect(box: Box, additive: boolean): void;
  addRun(from: string, points: Vec2[], end: RunEnd): void;
  addTee(segment: string, at: Vec2, points: Vec2[], end: RunEnd): void;
  addStub(segment: string, at: Vec2, side: 1 | -1, end: 'open' | 'short'): void;
  insert(segment: string, at: Vec2, kind: InsertKind): void;
  addPort(at: Vec2): void;
  setOutline(points: Vec2[]): void;
  addArea(kind: 'ground-copper' | 'keep-out', points: Vec2[]): void;
  preview(p: Preview): void;
  status(text: string): void;
}

type Gesture =
  | { kind: 'idle' }
  | { kind: 'press'; at: Vec2; hitId: string | null; additive: boolean }
  | { kind: 'moving'; last: Vec2; origin: Vec2 }
  | { kind: 'boxing'; from: Vec2; to: Vec2; additive: boolean }
  | { kind: 'routing'; from: string; tee: { segment: string; at: Vec2 } | null; points: Vec2[]; end?: RunEnd }
  | { kind: 'outlining'; points: Vec2[] };

/** Pixels the pointer must travel before a press becomes a drag. */
const DRAG_PX = 3;

export class ToolMachine {
  private tool: ToolId = 'pick';
  private g: Gesture = { kind: 'idle' };
  private pressScreen: Vec2 = { x: 0, y: 0 };
  /** The last press ended a run (a double-click's second press then starts nothing). */
  private endedByPress = false;

  constructor(private readonly host: ToolHost) {}

  get current(): ToolId { return this.tool; }
  get busy(): boolean { return this.g.kind === 'routing' || this.g.kind === 'outlining'; }

  setTool(t: ToolId): void {
    this.cancel();
    this.tool = t;
    this.host.status(TOOLS.find((x) => x.id === t)?.hint ?? '');
  }

  /** Esc: drop the run or edge being drawn (nothing was committed yet), or end a drag unchanged. */
  cancel(): void {
    if (this.g.kind === 'moving') this.host.endMove(false);
    this.g = { kind: 'idle' };
    this.host.preview({});
  }

  /** Enter: finish the run or board edge being drawn. */
  finish(): void {
    const g = this.g;
    if (g.kind === 'routing') {
      const pts = dedupe(g.points);
      if (pts.length > 0) {
        if (g.tee) this.host.addTee(g.tee.segment, g.tee.at, pts, g.end ?? null);
        else this.host.addRun(g.from, pts, g.end ?? null);
      }
    } else if (g.kind === 'outlining') {
      const pts = dedupe(g.points);
      if (pts.length < 3) this.host.status('An outline needs at least three corners');
      else if (this.tool === 'ground') this.host.addArea('ground-copper', pts);
      else if (this.tool === 'keepout') this.host.addArea('keep-out', pts);
      else this.host.setOutline(pts);
    }
    this.g = { kind: 'idle' };
    this.host.preview({});
  }

  handle(e: BoardPointer): void {
    if (e.button === 2 && e.type === 'down') { if (this.busy) this.finish(); return; }
    switch (this.tool) {
      case 'pick': return this.pick(e);
      case 'route': case 'tee': return this.route(e);
      case 'outline': case 'ground': case 'keepout': return this.outline(e);
      default: return this.place(e);
    }
  }

  private anchorOf(g: Extract<Gesture, { kind: 'routing' }>): Vec2 | null {
    if (g.points.length) return g.points[g.points.length - 1];
    if (g.tee) return g.tee.at;
    return this.host.nodeAt(g.from)?.at ?? null;
  }

  private pick(e: BoardPointer): void {
    const g = this.g;
    const step = this.host.gridStep();
    if (e.type === 'down' && e.button === 0) {
      const id = e.hit?.id ?? null;
      this.pressScreen = e.screen;
      this.g = { kind: 'press', at: e.at, hitId: id, additive: e.shiftKey || e.ctrlKey };
      if (id && !this.host.isSelected(id) && !(e.shiftKey || e.ctrlKey)) this.host.select([id], 'replace');
      return;
    }
    if (e.type === 'move') {
      if (g.kind === 'press') {
        if (Math.hypot(e.screen.x - this.pressScreen.x, e.screen.y - this.pressScreen.y) < DRAG_PX) return;
        if (g.hitId) {
          if (!this.host.isSelected(g.hitId)) this.host.select([g.hitId], g.additive ? 'add' : 'replace');
          this.host.beginMove();
          const origin = snapToGrid(g.at, step);
          this.g = { kind: 'moving', origin, last: origin };
        } else {
          this.g = { kind: 'boxing', from: g.at, to: e.at, additive: g.additive };
        }
      }
      const h = this.g;
      if (h.kind === 'moving') {
        const to = snapToGrid(e.at, step);
        const d = { x: to.x - h.last.x, y: to.y - h.last.y };
        if (d.x !== 0 || d.y !== 0) { this.host.moveBy(d); this.g = { ...h, last: to }; }
      } else if (h.kind === 'boxing') {
        this.g = { ...h, to: e.at };
        this.host.preview({ box: boxFrom(h.from, e.at) });
      } else if (h.kind === 'idle') {
        this.host.hover(e.hit?.id ?? null, e.at);
      }
      return;
    }
    if (e.type === 'up' || e.type === 'leave') {
      if (g.kind === 'press' && e.type === 'up') {
        if (g.hitId) this.host.select([g.hitId], g.additive ? 'toggle' : 'replace');
        else if (!g.additive) this.host.select([], 'replace');
      } else if (g.kind === 'moving') {
        this.host.endMove(true);
      } else if (g.kind === 'boxing') {
        this.host.boxSelect(boxFrom(g.from, e.at), g.additive);
        this.host.preview({});
      }
      if (e.type === 'leave') this.host.hover(null, e.at);
      if (g.kind !== 'idle') this.g = { kind: 'idle' };
    }
  }

  private route(e: BoardPointer): void {
    const g = this.g;
    const step = this.host.gridStep();
    if (g.kind === 'routing') return this.routing(g, e, step);
    if (e.type === 'move') { this.host.hover(e.hit?.id ?? null, e.at); this.host.preview({ ghost: snapToGrid(e.at, step) }); return; }
    if (e.type !== 'down' || e.button !== 0) return;
    // The second press of a double-click that just ended a run must not start another one.
    const afterEnd = this.endedByPress;
    this.endedByPress = false;
    if (afterEnd && e.clicks > 1) return;
    const hit = e.hit;
    if (hit?.kind === 'node') {
      const n = this.host.nodeAt(hit.id);
      if (!n) return;
      if (this.isFull(hit.id)) {
        this.host.status(n.kind === 'port' ? 'A port takes one line: start from the open end or a corner of its run, or from the line itself' : 'This tee already has four lines');
        return;
      }
      this.g = { kind: 'routing', from: hit.id, tee: null, points: [] };
      // The start's hover tip must not follow the pointer while drawing.
      this.host.hover(null, e.at);
      this.host.status('Click each corner; end on a line to join it with a tee; double-click, right-click or Enter ends the run, Esc drops it');
      return;
    }
    if (hit?.kind === 'segment') {
      const ends = this.host.segmentEnds(hit.id);
      if (!ends) return;
      const at = snapOnto(ends, e.at, step);
      this.g = { kind: 'routing', from: hit.id, tee: { segment: hit.id, at }, points: [] };
      this.host.hover(null, e.at);
      this.host.status('Click the corners of the branch; double-click, right-click or Enter ends it');
      return;
    }
    this.host.status(this.tool === 'route' ? 'A run starts at a port, an open end, a corner or a line: click one of those' : 'A tee goes on a line or a corner: click one');
  }

  /** Where the pointer would end the run on existing copper: a line (a tee there) or a node, else null. */
  private landing(g: Extract<Gesture, { kind: 'routing' }>, e: BoardPointer, step: number): { at: Vec2; end: RunEnd } | null {
    const hit = e.hit;
    if (hit?.kind === 'node' && hit.id !== g.from) {
      const n = this.host.nodeAt(hit.id);
      return n ? { at: n.at, end: { node: hit.id } } : null;
    }
    if (hit?.kind === 'segment' && hit.id !== g.tee?.segment) {
      const ends = this.host.segmentEnds(hit.id);
      return ends ? { at: snapOnto(ends, e.at, step), end: { segment: hit.id } } : null;
    }
    return null;
  }

  private routing(g: Extract<Gesture, { kind: 'routing' }>, e: BoardPointer, step: number): void {
    const anchor = this.anchorOf(g);
    if (!anchor) { this.cancel(); return; }
    const land = this.landing(g, e, step);
    const next = land?.at ?? snapHeading(anchor, e.at, headingRuleFor(e), step);
    if (e.type === 'down' && e.button === 0 && land && 'node' in (land.end ?? {}) && this.isFull((land.end as { node: string }).node)) {
      // Ending on a node with no room would refuse the whole run: keep drawing and say why.
      this.host.status('That node has no room for another line: end on a line, an open end or a corner, or press Enter to end here');
      return;
    }
    if (e.type === 'move') {
      // Pointer coordinates keep following the pointer; no hover tip while drawing.
      this.host.hover(null, e.at);
      this.host.preview({ run: [...this.startPoints(g), next], ghost: next, measure: this.measure(anchor, next, land) });
    } else if (e.type === 'down' && e.button === 0) {
      const same = Math.hypot(next.x - anchor.x, next.y - anchor.y) < 1e-9;
      if (same) { this.finish(); this.endedByPress = true; return; }
      this.g = { ...g, points: [...g.points, next], ...(land ? { end: land.end } : {}) };
      if (land) { this.finish(); this.endedByPress = true; return; }
      this.host.preview({ run: [...this.startPoints(this.g as typeof g)], ghost: next });
    } else if (e.type === 'dblclick') {
      this.finish();
    }
  }

  private isFull(id: string): boolean {
    const n = this.host.nodeAt(id);
    return !!n && ((n.kind === 'port' && n.degree >= 1) || (n.kind === 'junction' && n.degree >= 4));
  }

  /** The live readout of the piece being drawn: its length in the display unit and its direction (0° = +x, counter-clockwise). */
  private measure(from: Vec2, to: Vec2, land: { end: RunEnd } | null): { at: Vec2; text: string } {
    const len = Math.hypot(to.x - from.x, to.y - from.y);
    let deg = (Math.atan2(to.y - from.y, to.x - from.x) * 180) / Math.PI;
    if (deg < 0) deg += 360;
    const joins = land?.end && 'segment' in land.end ? ' · tee here' : land?.end ? ' · join' : '';
    return { at: to, text: `${this.host.formatLength(len)} · ${deg.toFixed(1)}°${joins}` };
  }

  private startPoints(g: Extract<Gesture, { kind: 'routing' }>): Vec2[] {
    const start = g.tee ? g.tee.at : this.host.nodeAt(g.from)?.at;
    return start ? [start, ...g.points] : [...g.points];
  }

  private outline(e: BoardPointer): void {
    const step = this.host.gridStep();
    const p = snapToGrid(e.at, step);
    const g = this.g;
    if (e.type === 'move') {
      this.host.preview({ run: g.kind === 'outlining' ? [...g.points, p, g.points[0]] : [], ghost: p });
    } else if (e.type === 'down' && e.button === 0) {
      if (g.kind === 'outlining') {
        const first = g.points[0];
        if (g.points.length >= 3 && Math.hypot(p.x - first.x, p.y - first.y) < e.tolerance) { this.finish(); return; }
        this.g = { kind: 'outlining', points: [...g.points, p] };
      } else {
        this.g = { kind: 'outlining', points: [p] };
        this.host.status('Click the next corner; click the first corner, double-click or press Enter to close it');
      }
    } else if (e.type === 'dblclick' && g.kind === 'outlining') {
      this.finish();
    }
  }

  private place(e: BoardPointer): void {
    const step = this.host.gridStep();
    if (e.type === 'move') { this.host.hover(e.hit?.id ?? null, e.at); this.host.preview({ ghost: snapToGrid(e.at, step) }); return; }
    if (e.type !== 'down' || e.button !== 0) return;
    if (this.tool === 'port') { this.host.addPort(snapToGrid(e.at, step)); return; }
    if (e.hit?.kind !== 'segment') { this.host.status('Click on a run to place this piece'); return; }
    const ends = this.host.segmentEnds(e.hit.id);
    if (!ends) return;
    const at = snapOnto(ends, e.at, step);
    if (this.tool === 'stub-open' || this.tool === 'stub-short') {
      // Side: which side of the run the cursor is on (sign of the cross product).
      const cross = (ends.b.x - ends.a.x) * (e.at.y - ends.a.y) - (ends.b.y - ends.a.y) * (e.at.x - ends.a.x);
      this.host.addStub(e.hit.id, at, cross >= 0 ? 1 : -1, this.tool === 'stub-open' ? 'open' : 'short');
      return;
    }
    this.host.insert(e.hit.id, at, this.tool as InsertKind);
  }
}

function boxFrom(a: Vec2, b: Vec2): Box {
  return { minX: Math.min(a.x, b.x), minY: Math.min(a.y, b.y), maxX: Math.max(a.x, b.x), maxY: Math.max(a.y, b.y) };
}

/** A point on segment ab near p, snapped to the grid along the segment when the segment lies on an axis. */
function snapOnto(ends: { a: Vec2; b: Vec2 }, p: Vec2, step: number): Vec2 {
  const proj = projectOnSegment(p, ends.a, ends.b);
  const len = Math.hypot(ends.b.x - ends.a.x, ends.b.y - ends.a.y);
  if (step > 0 && len > 0) {
    // Keep the split off the ends by a grid step so both halves have length.
    const s = Math.min(Math.max(Math.round((proj.t * len) / step) * step, Math.min(step, len / 2)), len - Math.min(step, len / 2));
    const t = s / len;
    return { x: ends.a.x + t * (ends.b.x - ends.a.x), y: ends.a.y + t * (ends.b.y - ends.a.y) };
  }
  return proj.at;
}

function dedupe(pts: Vec2[]): Vec2[] {
  const out: Vec2[] = [];
  for (const p of pts) {
    const q = out[out.length - 1];
    if (!q || Math.hypot(p.x - q.x, p.y - q.y) > 1e-12) out.push(p);
  }
  return out;
}
