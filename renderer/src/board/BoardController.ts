/**
 * The board drawing: svg.js over a host element, framework-free (attached by the `board` action).
 * Layers, bottom to top: grid (screen space), world (board space in mm, one transform for pan and zoom), overlay
 * (screen space: rubber band, box selection). Pieces keep their svg element between draws and only get a new path
 * when their geometry object changes, so a drag redraws just what moved.
 */
import { SVG, type Svg, type G, type Path, type Element as SvgElement } from '@svgdotjs/svg.js';
import type { Box, Region, Vec2 } from '../../../core/index.ts';
import type { Marks, Scene, ScenePiece } from './scene.ts';
import { EMPTY_SCENE } from './scene.ts';
import { type View, fitBox, panBy, toBoard, toScreen, zoomAt } from './viewport.ts';
import { gridLines, rulerLabel, type LengthUnit } from './grid.ts';
import { hitTest, type Hit } from './hit.ts';
import { regionsPath } from './paths.ts';

export { regionsPath };

export interface BoardPointer {
  type: 'down' | 'move' | 'up' | 'leave' | 'dblclick';
  at: Vec2;
  screen: Vec2;
  button: number;
  shiftKey: boolean;
  altKey: boolean;
  ctrlKey: boolean;
  hit: Hit;
  /** Pick radius in metres at the current zoom. */
  tolerance: number;
}

export interface BoardCallbacks {
  onPointer(e: BoardPointer): void;
  onView?(v: View): void;
}

export interface BoardOptions { unit: LengthUnit; snapStep: number }

export interface Preview { run?: Vec2[]; box?: Box; ghost?: Vec2 | null }

const PICK_PX = 6;
const RULER_PX = 22;
const mm = (v: number) => v * 1000;

function polyPoints(pts: Vec2[]): [number, number][] {
  return pts.map((p) => [mm(p.x), mm(p.y)]);
}

export class BoardController {
  private readonly root: Svg;
  private readonly gridLayer: G;
  private readonly world: G;
  private readonly outlineLayer: G;
  private readonly areaLayer: G;
  private areaKey = '';
  private readonly copperLayer: G;
  private readonly milledLayer: G;
  private milledDrawn: { regions: unknown; stale: boolean } = { regions: null, stale: false };
  private readonly lineLayer: G;
  private readonly nodeLayer: G;
  private readonly drillLayer: G;
  private readonly overlay: G;
  private readonly labelLayer: G;
  private labelKey = '';
  private readonly rulerX: Svg;
  private readonly rulerY: Svg;
  private view: View;
  private scene: Scene = EMPTY_SCENE;
  private marks: Marks = { selected: new Set(), flagged: new Set(), hovered: null };
  private options: BoardOptions;
  private pieceEls = new Map<string, { el: Path; src: ScenePiece; d: string }>();
  private lineEls = new Map<string, { el: SvgElement; key: string }>();
  private nodeEls = new Map<string, { el: SvgElement; key: string }>();
  private drillKey = '';
  private panning: { x: number; y: number; id: number } | null = null;
  private spaceDown = false;
  private readonly resizeObs: ResizeObserver | null;
  private readonly cleanup: (() => void)[] = [];

  constructor(private readonly host: HTMLElement, private callbacks: BoardCallbacks, options: BoardOptions) {
    this.options = options;
    host.classList.add('board-host');
    const w = host.clientWidth || 800, h = host.clientHeight || 600;
    this.view = { cx: 0, cy: 0, scale: 8000, width: w, height: h };
    this.root = SVG().addTo(host).addClass('board-svg').attr({ 'data-testid': 'board-canvas', tabindex: 0, role: 'img', 'aria-label': 'Board drawing' });
    this.gridLayer = this.root.group().addClass('grid');
    this.world = this.root.group().addClass('world');
    this.areaLayer = this.world.group().addClass('areas');
    this.outlineLayer = this.world.group().addClass('outline');
    this.copperLayer = this.world.group().addClass('copper');
    this.milledLayer = this.world.group().addClass('milled');
    this.lineLayer = this.world.group().addClass('centrelines');
    this.drillLayer = this.world.group().addClass('drills');
    this.nodeLayer = this.world.group().addClass('nodes');
    this.labelLayer = this.root.group().addClass('labels');
    this.overlay = this.root.group().addClass('overlay');
    this.rulerX = SVG().addTo(host).addClass('ruler ruler-x');
    this.rulerY = SVG().addTo(host).addClass('ruler ruler-y');

    const el = this.root.node as unknown as SVGSVGElement;
    const on = <K extends keyof SVGSVGElementEventMap>(type: K, fn: (e: SVGSVGElementEventMap[K]) => void, opts?: AddEventListenerOptions) => {
      el.addEventListener(type, fn as EventListener, opts);
      this.cleanup.push(() => el.removeEventListener(type, fn as EventListener));
    };
    on('pointerdown', (e) => this.pointer('down', e));
    on('pointermove', (e) => this.pointer('move', e));
    on('pointerup', (e) => this.pointer('up', e));
    on('pointerleave', (e) => this.pointer('leave', e));
    on('dblclick', (e) => this.pointer('dblclick', e));
    on('wheel', (e) => this.wheel(e), { passive: false });
    on('contextmenu', (e) => e.preventDefault());
    const key = (e: KeyboardEvent) => { if (e.code === 'Space' && e.target === el) { this.spaceDown = e.type === 'keydown'; if (this.spaceDown) e.preventDefault(); } };
    el.addEventListener('keydown', key); el.addEventListener('keyup', key);
    this.cleanup.push(() => { el.removeEventListener('keydown', key); el.removeEventListener('keyup', key); });

    this.resizeObs = typeof ResizeObserver === 'function' ? new ResizeObserver(() => this.resize()) : null;
    this.resizeObs?.observe(host);
    this.applyView();
  }

  /** The svg element, for focus handling by the face. */
  get element(): SVGSVGElement { return this.root.node as unknown as SVGSVGElement; }

  getView(): View { return this.view; }

  setCallbacks(cb: BoardCallbacks): void { this.callbacks = cb; }

  setOptions(o: BoardOptions): void {
    if (o.unit === this.options.unit && o.snapStep === this.options.snapStep) return;
    this.options = o;
    this.drawGrid();
  }

  setView(v: Partial<View>): void {
    this.view = { ...this.view, ...v };
    this.applyView();
  }

  zoomBy(factor: number): void {
    this.view = zoomAt(this.view, { x: this.view.width / 2, y: this.view.height / 2 }, factor);
    this.applyView();
  }

  panScreen(dx: number, dy: number): void {
    this.view = panBy(this.view, dx, dy);
    this.applyView();
  }

  fit(box: Box | null): void {
    if (!box) return;
    this.view = fitBox(this.view, box, 48);
    this.applyView();
  }

  /** Board point under a client (window) coordinate. */
  boardAtClient(clientX: number, clientY: number): Vec2 {
    const r = this.element.getBoundingClientRect();
    return toBoard(this.view, { x: clientX - r.left, y: clientY - r.top });
  }

  screenOf(p: Vec2): Vec2 { return toScreen(this.view, p); }

  setScene(scene: Scene): void {
    this.scene = scene;
    this.drawPieces();
    this.drawLines();
    this.drawNodes();
    this.drawOutline();
    this.drawLabels();
  }

  setMarks(m: Marks): void {
    this.marks = m;
    for (const [id, { el }] of this.pieceEls) {
      el.attr('class', this.pieceClass(id));
    }
    this.drawLines();
    this.drawNodes();
    this.drawAreas();
  }

  preview(p: Preview): void {
    this.overlay.clear();
    if (p.run && p.run.length >= 2) {
      this.overlay.polyline(p.run.map((q) => { const s = toScreen(this.view, q); return [s.x, s.y] as [number, number]; })).addClass('rubber');
    }
    if (p.box) {
      const a = toScreen(this.view, { x: p.box.minX, y: p.box.maxY });
      const b = toScreen(this.view, { x: p.box.maxX, y: p.box.minY });
      this.overlay.rect(Math.max(b.x - a.x, 0), Math.max(b.y - a.y, 0)).move(a.x, a.y).addClass('lasso');
    }
    if (p.ghost) {
      const s = toScreen(this.view, p.ghost);
      this.overlay.circle(9).center(s.x, s.y).addClass('ghost');
    }
  }

  destroy(): void {
    this.resizeObs?.disconnect();
    for (const c of this.cleanup) c();
    this.root.remove();
    this.rulerX.remove();
    this.rulerY.remove();
    this.host.classList.remove('board-host');
  }

  // ---- drawing ------------------------------------------------------------------------------------------------

  private pieceClass(id: string): string {
    const c = ['piece'];
    if (this.marks.selected.has(id)) c.push('selected');
    if (this.marks.flagged.has(id)) c.push('flagged');
    if (this.marks.hovered === id) c.push('hovered');
    return c.join(' ');
  }

  private drawPieces(): void {
    const seen = new Set<string>();
    for (const p of this.scene.pieces) {
      seen.add(p.id);
      const have = this.pieceEls.get(p.id);
      if (have && have.src === p) continue;
      // The worker sends each piece's path text ready-made, so comparing is all the main thread does.
      const d = p.d ?? regionsPath(p.regions);
      if (have) {
        // A new layout result brings new objects for every piece; touch the DOM only where the copper moved.
        if (have.d !== d) { have.el.plot(d); have.d = d; }
        have.src = p;
        continue;
      }
      const el = this.copperLayer.path(d).attr({ class: this.pieceClass(p.id), 'fill-rule': 'evenodd', 'data-piece': p.id });
      this.pieceEls.set(p.id, { el, src: p, d });
    }
    for (const [id, { el }] of this.pieceEls) if (!seen.has(id)) { el.remove(); this.pieceEls.delete(id); }
  }

  /** Keeps one element per id, updating attributes only when its key (shape and class) changed. */
  private keyed(map: Map<string, { el: SvgElement; key: string }>, id: string, key: string, make: () => SvgElement, seen: Set<string>): void {
    seen.add(id);
    const have = map.get(id);
    if (have && have.key === key) return;
    have?.el.remove();
    map.set(id, { el: make(), key });
  }

  private drawLines(): void {
    const seen = new Set<string>();
    for (const s of this.scene.segments) {
      const pts = s.centreline && s.centreline.length >= 2 ? s.centreline : [s.a, s.b];
      const cls = ['cl', `cl-${s.kind}`];
      if (this.marks.selected.has(s.id)) cls.push('selected');
      if (this.marks.flagged.has(s.id)) cls.push('flagged');
      if (this.marks.hovered === s.id) cls.push('hovered');
      if (!s.centreline) cls.push('unsized');
      const points = polyPoints(pts);
      const c = cls.join(' ');
      this.keyed(this.lineEls, s.id, `${c}|${points.join(' ')}`, () => this.lineLayer.polyline(points).attr({ class: c, 'data-seg': s.id }), seen);
    }
    for (const [id, { el }] of this.lineEls) if (!seen.has(id)) { el.remove(); this.lineEls.delete(id); }
  }

  private drawNodes(): void {
    const seen = new Set<string>();
    // Node marks keep a constant screen size: radius in mm from pixels at the current zoom.
    const r = mm(5 / this.view.scale);
    for (const n of this.scene.nodes) {
      const cls = ['node', `node-${n.kind}`];
      if (this.marks.selected.has(n.id)) cls.push('selected');
      if (this.marks.flagged.has(n.id)) cls.push('flagged');
      if (this.marks.hovered === n.id) cls.push('hovered');
      const x = mm(n.at.x), y = mm(n.at.y);
      const c = cls.join(' ');
      this.keyed(this.nodeEls, n.id, `${c}|${x}|${y}|${r}`, () => {
        let el: SvgElement;
        if (n.kind === 'port') el = this.nodeLayer.rect(2.4 * r, 2.4 * r).center(x, y);
        else if (n.kind === 'short') el = this.nodeLayer.polygon([[x, y + 1.4 * r], [x + 1.4 * r, y], [x, y - 1.4 * r], [x - 1.4 * r, y]]);
        else el = this.nodeLayer.circle(2 * r * (n.kind === 'vertex' ? 0.7 : 1)).center(x, y);
        return el.attr({ class: c, 'data-node': n.id });
      }, seen);
    }
    for (const [id, { el }] of this.nodeEls) if (!seen.has(id)) { el.remove(); this.nodeEls.delete(id); }
    const drillKey = this.scene.drills.map((d) => `${d.at.x},${d.at.y},${d.diameter}`).join(';');
    if (drillKey !== this.drillKey) {
      this.drillKey = drillKey;
      this.drillLayer.clear();
      for (const d of this.scene.drills) this.drillLayer.circle(mm(d.diameter)).center(mm(d.at.x), mm(d.at.y)).addClass('drill');
    }
  }

  private drawAreas(): void {
    const sel = this.marks.selected, fl = this.marks.flagged;
    const key = this.scene.areas.map((a) => `${a.id}${a.kind}${sel.has(a.id) ? '*' : ''}${fl.has(a.id) ? '!' : ''}:${a.polygon.map((p) => `${p.x},${p.y}`).join(' ')}`).join('|')
      + `#${this.scene.groundStale ? 's' : ''}${this.scene.ground.length}:${this.scene.ground.reduce((n, r) => n + r.outer.length, 0)}`;
    if (key === this.areaKey) return;
    this.areaKey = key;
    this.areaLayer.clear();
    // Ground copper as it will be made (cleared around the network), when the last check is current.
    if (this.scene.ground.length) this.areaLayer.path(regionsPath(this.scene.ground)).attr({ class: this.scene.groundStale ? 'ground-copper stale' : 'ground-copper', 'fill-rule': 'evenodd' });
    for (const a of this.scene.areas) {
      const cls = ['area', a.kind === 'keep-out' ? 'area-keepout' : 'area-ground'];
      if (sel.has(a.id)) cls.push('selected');
      if (fl.has(a.id)) cls.push('flagged');
      this.areaLayer.polygon(polyPoints(a.polygon)).attr({ class: cls.join(' '), 'data-area': a.id });
    }
  }

  /** The board as milled over the design (copper left after the tools pass), when the scene carries it. */
  private drawMilled(): void {
    const m = this.scene.milled ?? [];
    // The worker hands a new list with every plan, so the list itself tells whether to redraw.
    const stale = !!this.scene.milledStale;
    if (this.milledDrawn.regions === (this.scene.milled ?? null) && this.milledDrawn.stale === stale) return;
    this.milledDrawn = { regions: this.scene.milled ?? null, stale };
    this.milledLayer.clear();
    if (m.length) this.milledLayer.path(regionsPath(m)).attr({ class: this.scene.milledStale ? 'milled-copper stale' : 'milled-copper', 'fill-rule': 'evenodd', 'data-testid': 'milled-overlay' });
  }

  private drawOutline(): void {
    this.drawAreas();
    this.drawMilled();
    this.outlineLayer.clear();
    if (this.scene.outline && this.scene.outline.length >= 3) {
      this.outlineLayer.polygon(polyPoints(this.scene.outline)).addClass('board-outline');
    }
  }

  private applyView(): void {
    const v = this.view;
    const k = v.scale / 1000; // px per mm
    this.world.attr('transform', `matrix(${k} 0 0 ${-k} ${v.width / 2 - mm(v.cx) * k} ${v.height / 2 + mm(v.cy) * k})`);
    this.drawGrid();
    this.drawNodes();
    this.drawLabels();
    this.callbacks.onView?.(v);
  }

  /** Port names in screen space (text never mirrors or scales with the board), beside each port. */
  private drawLabels(): void {
    const v = this.view;
    const ports = this.scene.nodes.filter((n) => n.kind === 'port');
    const key = `${v.cx},${v.cy},${v.scale},${v.width},${v.height}|` + ports.map((n) => `${n.id}:${n.label ?? ''}:${n.at.x},${n.at.y}`).join(';');
    if (key === this.labelKey) return;
    this.labelKey = key;
    this.labelLayer.clear();
    for (const n of ports) {
      const sp = toScreen(v, n.at);
      if (sp.x < -50 || sp.y < -20 || sp.x > v.width + 50 || sp.y > v.height + 20) continue;
      this.labelLayer.plain(n.label ?? n.id).attr({ x: sp.x + 9, y: sp.y - 8, 'data-label': n.id }).addClass('port-label');
    }
  }

  private drawGrid(): void {
    const v = this.view;
    this.gridLayer.clear();
    const g = gridLines(v, this.options.snapStep, this.options.unit);
    const major = g.step * 10;
    for (const x of g.xs) {
      const sx = toScreen(v, { x, y: 0 }).x;
      this.gridLayer.line(sx, 0, sx, v.height).addClass(Math.abs(Math.round(x / major) * major - x) < g.step * 1e-6 ? 'major' : 'minor');
    }
    for (const y of g.ys) {
      const sy = toScreen(v, { x: 0, y }).y;
      this.gridLayer.line(0, sy, v.width, sy).addClass(Math.abs(Math.round(y / major) * major - y) < g.step * 1e-6 ? 'major' : 'minor');
    }
    this.drawRulers(g.step);
  }

  private drawRulers(gridStep: number): void {
    const v = this.view;
    const unit = this.options.unit;
    // Label spacing of at least 60 px, in whole grid steps.
    const every = Math.max(1, Math.ceil(60 / (gridStep * v.scale)));
    const step = gridStep * every;
    this.rulerX.clear().size(v.width, RULER_PX);
    this.rulerY.clear().size(RULER_PX, v.height);
    this.rulerX.rect(v.width, RULER_PX).addClass('ruler-bg');
    this.rulerY.rect(RULER_PX, v.height).addClass('ruler-bg');
    const b = { x0: toBoard(v, { x: 0, y: 0 }).x, x1: toBoard(v, { x: v.width, y: 0 }).x, y0: toBoard(v, { x: 0, y: v.height }).y, y1: toBoard(v, { x: 0, y: 0 }).y };
    for (let i = Math.ceil(b.x0 / step); i * step <= b.x1; i++) {
      const sx = toScreen(v, { x: i * step, y: 0 }).x;
      this.rulerX.line(sx, RULER_PX - 7, sx, RULER_PX).addClass('tick');
      this.rulerX.plain(rulerLabel(i * step, unit, step)).attr({ x: sx + 3, y: 11 }).addClass('tick-label');
    }
    for (let i = Math.ceil(b.y0 / step); i * step <= b.y1; i++) {
      const sy = toScreen(v, { x: 0, y: i * step }).y;
      this.rulerY.line(RULER_PX - 7, sy, RULER_PX, sy).addClass('tick');
      this.rulerY.plain(rulerLabel(i * step, unit, step)).attr({ x: 2, y: sy - 3 }).addClass('tick-label');
    }
    this.rulerX.plain(unit).attr({ x: v.width - 26, y: 20 }).addClass('unit-label');
  }

  // ---- input --------------------------------------------------------------------------------------------------

  private resize(): void {
    const w = this.host.clientWidth, h = this.host.clientHeight;
    if (w > 0 && h > 0 && (w !== this.view.width || h !== this.view.height)) {
      this.view = { ...this.view, width: w, height: h };
      this.applyView();
    }
  }

  private wheel(e: WheelEvent): void {
    e.preventDefault();
    const r = this.element.getBoundingClientRect();
    const factor = Math.exp(-e.deltaY * (e.deltaMode === 1 ? 0.05 : 0.0015));
    this.view = zoomAt(this.view, { x: e.clientX - r.left, y: e.clientY - r.top }, factor);
    this.applyView();
  }

  private pointer(type: BoardPointer['type'], e: PointerEvent | MouseEvent): void {
    const r = this.element.getBoundingClientRect();
    const screen = { x: e.clientX - r.left, y: e.clientY - r.top };
    const id = 'pointerId' in e ? e.pointerId : 1;
    // Middle button, or left button with Space held, pans the view.
    if (type === 'down' && (e.button === 1 || (e.button === 0 && this.spaceDown))) {
      this.panning = { x: screen.x, y: screen.y, id };
      try { this.element.setPointerCapture(id); } catch { /* synthetic events carry no capturable id */ }
      e.preventDefault();
      return;
    }
    if (this.panning) {
      if (type === 'move') {
        this.view = panBy(this.view, screen.x - this.panning.x, screen.y - this.panning.y);
        this.panning = { ...this.panning, x: screen.x, y: screen.y };
        this.applyView();
      } else if (type === 'up' || type === 'leave') {
        this.panning = null;
      }
      return;
    }
    if (type === 'down') { this.element.focus({ preventScroll: true }); }
    const at = toBoard(this.view, screen);
    const tolerance = PICK_PX / this.view.scale;
    this.callbacks.onPointer({
      type, at, screen, button: e.button, shiftKey: e.shiftKey, altKey: e.altKey, ctrlKey: e.ctrlKey || e.metaKey,
      hit: hitTest(this.scene, at, tolerance), tolerance,
    });
  }
}
