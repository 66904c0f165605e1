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
import { gridLines, rulerLabel, rulerSteps, UNIT_METRES, type LengthUnit } from './grid.ts';
import { hitTest, type Hit } from './hit.ts';
import { regionsPath } from './paths.ts';
import { commonShift, driftMm, less, placeMark, placeMarkMm, translateText } from './drift.ts';

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
  /** Press count of this click (2 for the second press of a double-click). */
  clicks: number;
}

export interface BoardCallbacks {
  onPointer(e: BoardPointer): void;
  onView?(v: View): void;
}

export interface BoardOptions { unit: LengthUnit; snapStep: number }

export interface Preview { run?: Vec2[]; box?: Box; ghost?: Vec2 | null; /** Live length and angle of the piece being drawn, shown beside its end. */ measure?: { at: Vec2; text: string } }

const PICK_PX = 6;
const RULER_PX = 22;
const mm = (v: number) => v * 1000;

/** Sets a class only when it differs (an unchanged write still makes the browser restyle the element). */
function setClass(el: SvgElement, c: string): void {
  if (el.node.getAttribute('class') !== c) el.node.setAttribute('class', c);
}

/** Points in board mm as x, y pairs. */
function flatMm(pts: Vec2[]): number[] {
  const out = new Array<number>(pts.length * 2);
  for (let i = 0; i < pts.length; i++) { out[2 * i] = mm(pts[i]!.x); out[2 * i + 1] = mm(pts[i]!.y); }
  return out;
}

/** SVG points text of x, y pairs. */
function pairsText(flat: number[]): string {
  let t = '';
  for (let i = 0; i < flat.length; i += 2) t += (i ? ' ' : '') + flat[i] + ',' + flat[i + 1];
  return t;
}

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
  private readonly partLayer: G;
  private partKey = '';
  private readonly overlay: G;
  private readonly labelLayer: G;
  private labelKey = '';
  private readonly rulerX: Svg;
  private readonly rulerY: Svg;
  private readonly rulerCorner: Svg;
  private view: View;
  private scene: Scene = EMPTY_SCENE;
  private marks: Marks = { selected: new Set(), flagged: new Set(), hovered: null };
  private options: BoardOptions;
  /** Each piece's element: its path text as written and the copper group it sits in (null: the copper layer). */
  private pieceEls = new Map<string, { el: Path; src: ScenePiece; d: string; parent: G }>();
  /**
   * Groups of translated copper whose shift is not the drift, by the shift they draw (drift.ts); each keeps its
   * elements from move to move.
   */
  private copperGroups = new Map<Vec2, G>();
  /** The drift of this scene (the shift most translated copper shares, m), and in board mm. */
  private driftShift: Vec2 | null = null;
  private drift: { x: number; y: number } | null = null;
  /**
   * What moves with the drift is drawn in a second svg over the board, moved as a whole by a CSS transform in its
   * own compositing layer (app.css `.board-moving`): a drag then changes one style per move, and the browser
   * neither paints nor rasterises the moved copper and marks again (software raster of the whole board cost more
   * than a 60 Hz frame per move). Its world group has the board's view transform; its content is written where it
   * was when it joined (board coordinates less the drift).
   */
  private readonly moving: Svg;
  private readonly movingWorld: G;
  private readonly movingCopper: G;
  private readonly lineDrift: G;
  private readonly nodeDrift: G;
  private readonly labelDrift: G;
  private movingStyle = '';
  /** Marks: element, class, coordinates as written (x, y pairs), and whether it sits in its layer's drift group. */
  private lineEls = new Map<string, { el: SvgElement; cls: string; v: number; kind: string; unsized: boolean; pts: number[]; inDrift: boolean }>();
  /** Rises with every new set of marks: a mark's class is worked out again only then (or when its kind changes). */
  private marksV = 0;
  private nodeEls = new Map<string, { el: SvgElement; cls: string; v: number; kind: string; r: number; pts: number[]; inDrift: boolean }>();
  private portLabelEls = new Map<string, { el: SvgElement; text: string; pts: number[]; inDrift: boolean }>();
  private partValueEls: SvgElement[] = [];
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
    this.partLayer = this.world.group().addClass('parts');
    this.nodeLayer = this.world.group().addClass('nodes');
    this.labelLayer = this.root.group().addClass('labels');
    this.moving = SVG().addTo(host).addClass('board-svg board-moving').attr({ 'aria-hidden': 'true', 'data-testid': 'board-moving' });
    this.movingWorld = this.moving.group().addClass('world');
    this.movingCopper = this.movingWorld.group().addClass('copper');
    this.lineDrift = this.movingWorld.group().addClass('centrelines');
    this.nodeDrift = this.movingWorld.group().addClass('nodes');
    this.labelDrift = this.moving.group().addClass('labels');
    this.overlay = this.root.group().addClass('overlay');
    this.rulerX = SVG().addTo(host).addClass('ruler ruler-x');
    this.rulerY = SVG().addTo(host).addClass('ruler ruler-y');
    this.rulerCorner = SVG().addTo(host).addClass('ruler ruler-corner');

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
    // A double-click that ends a run must not select text (the second press's default action selects a word).
    on('mousedown', (e) => { if (e.detail > 1) e.preventDefault(); });
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
    this.drawParts();
    this.drawNodes();
    this.drawOutline();
    this.drawLabels();
  }

  /**
   * Says on the drawing which design revision its centrelines show and which its copper comes from
   * (`data-revision`, `data-copper-revision`): two attributes, so tests and the frame benchmark can tell when an edit
   * reached the screen without timing anything inside the app.
   */
  stamp(revision: number, copperRevision: number | null): void {
    this.root.attr({ 'data-revision': revision, 'data-copper-revision': copperRevision ?? -1 });
  }

  setMarks(m: Marks): void {
    this.marks = m;
    this.marksV++;
    for (const [id, { el }] of this.pieceEls) {
      el.attr('class', this.pieceClass(id));
    }
    this.drawLines();
    this.drawParts();
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
    if (p.measure) {
      const s = toScreen(this.view, p.measure.at);
      const x = Math.min(Math.max(s.x + 12, 4), this.view.width - 160);
      const y = Math.min(Math.max(s.y - 12, 14), this.view.height - 6);
      this.overlay.plain(p.measure.text).attr({ x, y, 'data-testid': 'route-measure' }).addClass('measure');
    }
  }

  destroy(): void {
    this.resizeObs?.disconnect();
    for (const c of this.cleanup) c();
    this.root.remove();
    this.moving.remove();
    this.rulerX.remove();
    this.rulerY.remove();
    this.rulerCorner.remove();
    this.host.classList.remove('board-host');
  }

  // ---- drawing ------------------------------------------------------------------------------------------------

  private pieceClass(id: string): string {
    const c = ['piece'];
    if (this.marks.selected.has(id)) c.push('selected');
    if (this.marks.flagged.has(id)) c.push('flagged');
    if (this.marks.near?.has(id)) c.push('near');
    if (this.marks.hovered === id) c.push('hovered');
    return c.join(' ');
  }

  /**
   * Copper: an element per piece, touched only where its copper changed. A piece the live layout translated (`by`)
   * is drawn as its base path text inside a group moved by `by` (drift.ts), so a drag sets one transform per move
   * for all the copper it carries instead of ~300 new path texts.
   */
  private drawPieces(): void {
    const seen = new Set<string>();
    // The marks follow the shift most of the copper shares (a drag's whole moved subtree): the drift.
    this.driftShift = commonShift(this.scene.pieces);
    this.drift = driftMm(this.driftShift);
    const groups = new Map<Vec2, G>();
    const claimed = new Set<G>();
    const groupFor = (by: Vec2, was: G | null): G => {
      if (by === this.driftShift) return this.movingCopper;
      let g = groups.get(by);
      if (g) return g;
      // The group these elements sat in moves on with them (one transform), unless another shift took it already.
      g = was && was !== this.movingCopper && was !== this.copperLayer && !claimed.has(was) ? was : this.copperLayer.group().addClass('shifted');
      claimed.add(g);
      groups.set(by, g);
      g.node.setAttribute('transform', translateText(driftMm(by)!));
      return g;
    };
    for (const p of this.scene.pieces) {
      seen.add(p.id);
      const have = this.pieceEls.get(p.id);
      // The worker sends each piece's path text ready-made, so comparing is all the main thread does.
      const d = p.d ?? regionsPath(p.regions);
      const parent = p.by ? groupFor(p.by, have?.parent ?? null) : this.copperLayer;
      if (have) {
        // Touch the DOM only where the copper moved. The path text goes straight to the attribute: svg.js's plot()
        // would parse it into segments and print it again, for every moved piece of a drag.
        if (have.d !== d) { have.el.node.setAttribute('d', d); have.d = d; }
        if (have.parent !== parent) { parent.node.appendChild(have.el.node); have.parent = parent; }
        have.src = p;
        continue;
      }
      const el = parent.path().attr({ class: this.pieceClass(p.id), 'fill-rule': 'evenodd', 'data-piece': p.id });
      el.node.setAttribute('d', d);
      this.pieceEls.set(p.id, { el, src: p, d, parent });
    }
    for (const [id, { el }] of this.pieceEls) if (!seen.has(id)) { el.remove(); this.pieceEls.delete(id); }
    for (const g of this.copperGroups.values()) if (!claimed.has(g)) g.remove();
    this.copperGroups = groups;
    this.placeMoving();
  }

  /** The moving svg's CSS transform: the drift in screen pixels (none without a drift). */
  private placeMoving(): void {
    const t = this.driftShift;
    const v = this.view;
    const style = t ? `translate(${t.x * v.scale}px, ${-t.y * v.scale}px)` : '';
    if (style === this.movingStyle) return;
    this.movingStyle = style;
    (this.moving.node as unknown as SVGSVGElement).style.transform = style;
    // The drift in board mm at full precision (the style's text is rounded), for tests that check where it lands.
    this.moving.node.setAttribute('data-drift-mm', t ? `${t.x * 1000} ${t.y * 1000}` : '');
  }

  /**
   * Centrelines: one polyline per segment, written only when it moved otherwise than with the drift (drift.ts); one
   * that moved with it joins the drift group as it was written.
   */
  private drawLines(): void {
    const seen = new Set<string>();
    for (const s of this.scene.segments) {
      const pts = s.centreline && s.centreline.length >= 2 ? s.centreline : [s.a, s.b];
      const unsized = !s.centreline;
      seen.add(s.id);
      const have = this.lineEls.get(s.id);
      // The class changes only with the marks, the kind or sizing: kept from the last draw otherwise.
      const c = have && have.v === this.marksV && have.kind === s.kind && have.unsized === unsized ? have.cls : this.lineClass(s.id, s.kind, unsized);
      const place = have ? placeMarkMm(pts, have.pts, have.inDrift, this.drift) : 'write';
      if (have && (place === 'drift' || place === 'stay')) {
        if (c !== have.cls) setClass(have.el, c);
        Object.assign(have, { cls: c, v: this.marksV, kind: s.kind, unsized });
        if (place === 'drift' && !have.inDrift) { this.lineDrift.node.appendChild(have.el.node); have.inDrift = true; }
        continue;
      }
      const into = place === 'write-drift';
      const flat = less(flatMm(pts), into ? this.drift : null);
      const text = pairsText(flat);
      if (have) {
        have.el.node.setAttribute('points', text);
        setClass(have.el, c);
        if (have.inDrift !== into) (into ? this.lineDrift : this.lineLayer).node.appendChild(have.el.node);
        Object.assign(have, { cls: c, v: this.marksV, kind: s.kind, unsized, pts: flat, inDrift: into });
        continue;
      }
      const el = this.lineLayer.polyline().attr({ class: c, 'data-seg': s.id });
      el.node.setAttribute('points', text);
      this.lineEls.set(s.id, { el, cls: c, v: this.marksV, kind: s.kind, unsized, pts: flat, inDrift: false });
    }
    for (const [id, { el }] of this.lineEls) if (!seen.has(id)) { el.remove(); this.lineEls.delete(id); }
  }

  private nodeClass(id: string, kind: string): string {
    const cls = ['node', `node-${kind}`];
    if (this.marks.selected.has(id)) cls.push('selected');
    if (this.marks.flagged.has(id)) cls.push('flagged');
    if (this.marks.hovered === id) cls.push('hovered');
    return cls.join(' ');
  }

  private lineClass(id: string, kind: string, unsized: boolean): string {
    const cls = ['cl', `cl-${kind}`];
    if (this.marks.selected.has(id)) cls.push('selected');
    if (this.marks.flagged.has(id)) cls.push('flagged');
    if (this.marks.near?.has(id)) cls.push('near');
    if (this.marks.hovered === id) cls.push('hovered');
    if (unsized) cls.push('unsized');
    return cls.join(' ');
  }

  /** Lumped parts: a body between the pads, turned along the line (world space, mm). */
  private drawParts(): void {
    const parts = this.scene.segments.filter((s) => s.part);
    const key = parts.map((s) => `${s.id}:${s.a.x},${s.a.y},${s.b.x},${s.b.y}:${s.part!.size}:${this.marks.selected.has(s.id) ? 1 : 0}`).join(';');
    if (key === this.partKey) return;
    this.partKey = key;
    this.partLayer.clear();
    for (const s of parts) {
      const p = s.part!;
      const mid = { x: mm((s.a.x + s.b.x) / 2), y: mm((s.a.y + s.b.y) / 2) };
      const ang = (Math.atan2(s.b.y - s.a.y, s.b.x - s.a.x) * 180) / Math.PI;
      const L = mm(p.body.along), W = mm(p.body.across);
      this.partLayer.rect(L, W).move(mid.x - L / 2, mid.y - W / 2)
        .attr({ transform: `rotate(${ang} ${mid.x} ${mid.y})`, 'data-part': s.id, class: this.marks.selected.has(s.id) ? 'part-body selected' : 'part-body' });
    }
  }

  /**
   * Node marks at a constant screen size, each written only when it moved otherwise than with the drift (as the
   * centrelines); a circle moves in place, other shapes are made again.
   */
  private drawNodes(): void {
    const seen = new Set<string>();
    // Node marks keep a constant screen size: radius in mm from pixels at the current zoom.
    const r = mm(5 / this.view.scale);
    for (const n of this.scene.nodes) {
      seen.add(n.id);
      const have = this.nodeEls.get(n.id);
      const same = have && have.kind === n.kind && have.r === r;
      const c = have && have.v === this.marksV && same ? have.cls : this.nodeClass(n.id, n.kind);
      const one = [n.at];
      const place = same ? placeMarkMm(one, have.pts, have.inDrift, this.drift) : 'write';
      if (have && same && (place === 'drift' || place === 'stay')) {
        if (c !== have.cls) setClass(have.el, c);
        have.cls = c; have.v = this.marksV;
        if (place === 'drift' && !have.inDrift) { this.nodeDrift.node.appendChild(have.el.node); have.inDrift = true; }
        continue;
      }
      // A moved circle mark (bends, tees, ends) and a port's square take their new place in place.
      const rr = r * (n.kind === 'vertex' ? 0.7 : 1);
      if (have && same && (n.kind !== 'short')) {
        const into = place === 'write-drift';
        const at = less([mm(n.at.x), mm(n.at.y)], into ? this.drift : null);
        const [x, y] = at as [number, number];
        if (n.kind === 'port') { have.el.node.setAttribute('x', String(x - 1.2 * r)); have.el.node.setAttribute('y', String(y - 1.2 * r)); }
        else { have.el.node.setAttribute('cx', String(x)); have.el.node.setAttribute('cy', String(y)); }
        setClass(have.el, c);
        if (have.inDrift !== into) (into ? this.nodeDrift : this.nodeLayer).node.appendChild(have.el.node);
        Object.assign(have, { cls: c, v: this.marksV, pts: at, inDrift: into });
        continue;
      }
      const x = mm(n.at.x), y = mm(n.at.y);
      const at = [x, y];
      have?.el.remove();
      let el: SvgElement;
      // Positions as attributes: svg.js's center() asks the browser for a bounding box (a layout) per mark.
      if (n.kind === 'port') el = this.nodeLayer.rect(2.4 * r, 2.4 * r).attr({ x: x - 1.2 * r, y: y - 1.2 * r });
      else if (n.kind === 'short') el = this.nodeLayer.polygon([[x, y + 1.4 * r], [x + 1.4 * r, y], [x, y - 1.4 * r], [x - 1.4 * r, y]]);
      else el = this.nodeLayer.circle(2 * rr).attr({ cx: x, cy: y });
      el.attr({ class: c, 'data-node': n.id });
      this.nodeEls.set(n.id, { el, cls: c, v: this.marksV, kind: n.kind, r, pts: at, inDrift: false });
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
    // The outline changes rarely; redraw it only then, not on every scene of a drag.
    if (this.outlineDrawn === this.scene.outline) return;
    this.outlineDrawn = this.scene.outline;
    this.outlineLayer.clear();
    if (this.scene.outline && this.scene.outline.length >= 3) {
      this.outlineLayer.polygon(polyPoints(this.scene.outline)).addClass('board-outline');
    }
  }
  private outlineDrawn: Scene['outline'] | undefined = undefined;

  private applyView(): void {
    const v = this.view;
    const k = v.scale / 1000; // px per mm
    const m = `matrix(${k} 0 0 ${-k} ${v.width / 2 - mm(v.cx) * k} ${v.height / 2 + mm(v.cy) * k})`;
    this.world.attr('transform', m);
    this.movingWorld.attr('transform', m);
    this.placeMoving();
    this.drawGrid();
    this.drawNodes();
    this.drawLabels();
    this.callbacks.onView?.(v);
  }

  /** Port names in screen space (text never mirrors or scales with the board), beside each port. */
  private drawLabels(): void {
    const v = this.view;
    const ports = this.scene.nodes.filter((n) => n.kind === 'port');
    const parts = this.scene.segments.filter((s) => s.part);
    const key = `${v.cx},${v.cy},${v.scale},${v.width},${v.height}|` + ports.map((n) => `${n.id}:${n.label ?? ''}:${n.at.x},${n.at.y}`).join(';')
      + '|' + parts.map((s) => `${s.id}:${s.part!.value}:${s.a.x},${s.a.y},${s.b.x},${s.b.y}`).join(';');
    if (key === this.labelKey) return;
    this.labelKey = key;
    // Port labels are kept per port: moved with the drift (in screen px) or in place (a drag moves many ports).
    const drift = this.drift ? { x: (this.drift.x / 1000) * v.scale, y: (-this.drift.y / 1000) * v.scale } : null;
    for (const el of this.partValueEls) el.remove();
    this.partValueEls = [];
    const seen = new Set<string>();
    for (const n of ports) {
      const sp = toScreen(v, n.at);
      if (sp.x < -50 || sp.y < -20 || sp.x > v.width + 50 || sp.y > v.height + 20) continue;
      const text = n.label ?? n.id;
      const at = [sp.x + 9, sp.y - 8];
      seen.add(n.id);
      const have = this.portLabelEls.get(n.id);
      if (have && have.text === text) {
        const place = placeMark(at, have.pts, have.inDrift, drift);
        if (place === 'drift' && !have.inDrift) { this.labelDrift.node.appendChild(have.el.node); have.inDrift = true; }
        if (place === 'drift' || place === 'stay') continue;
        const into = place === 'write-drift';
        const xy = less(at, into ? drift : null);
        have.el.node.setAttribute('x', String(xy[0])); have.el.node.setAttribute('y', String(xy[1]));
        if (have.inDrift !== into) (into ? this.labelDrift : this.labelLayer).node.appendChild(have.el.node);
        Object.assign(have, { pts: xy, inDrift: into });
        continue;
      }
      have?.el.remove();
      const el = this.labelLayer.plain(text).attr({ x: at[0], y: at[1], 'data-label': n.id }).addClass('port-label');
      this.portLabelEls.set(n.id, { el, text, pts: at, inDrift: false });
    }
    for (const [id, { el }] of this.portLabelEls) if (!seen.has(id)) { el.remove(); this.portLabelEls.delete(id); }
    // Each part's value beside its body, offset across the line so it never covers the copper.
    for (const s of parts) {
      const a = toScreen(v, s.a), b = toScreen(v, s.b);
      const mx = (a.x + b.x) / 2, my = (a.y + b.y) / 2;
      const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
      const nx = -(b.y - a.y) / len, ny = (b.x - a.x) / len;
      const off = 10 + (mm(s.part!.body.across) * v.scale) / 2000;
      this.partValueEls.push(this.labelLayer.plain(`${s.part!.value}`).attr({ x: mx + nx * off, y: my + ny * off + 4, 'text-anchor': Math.abs(nx) > 0.5 ? (nx > 0 ? 'start' : 'end') : 'middle', 'data-part-value': s.id }).addClass('part-value'));
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
    this.drawRulers();
  }

  /**
   * Rulers along the top and left: labelled ticks on a 1-2-5 step of the display unit (so in mil they fall on whole
   * mil values, not on the millimetre grid), minor ticks between, and the unit in the corner where both rulers meet.
   * A label that would not fit whole inside its ruler is left out rather than clipped.
   */
  private drawRulers(): void {
    const v = this.view;
    const unit = this.options.unit;
    const { step, minor } = rulerSteps(unit, v.scale, 64);
    // The rulers lie along the board's top and left edges (app.css), each as long as the board is.
    const lenX = v.width, lenY = v.height;
    this.rulerX.clear().size(lenX, RULER_PX);
    this.rulerY.clear().size(RULER_PX, lenY);
    this.rulerCorner.clear().size(RULER_PX, RULER_PX);
    this.rulerX.rect(lenX, RULER_PX).addClass('ruler-bg');
    this.rulerY.rect(RULER_PX, lenY).addClass('ruler-bg');
    this.rulerCorner.rect(RULER_PX, RULER_PX).addClass('ruler-bg');
    this.rulerCorner.plain(unit).attr({ x: RULER_PX / 2, y: RULER_PX / 2 + 4, 'text-anchor': 'middle', 'data-testid': 'ruler-unit' }).addClass('unit-label');
    const x0 = toBoard(v, { x: 0, y: 0 }).x, x1 = toBoard(v, { x: v.width, y: 0 }).x;
    const y0 = toBoard(v, { x: 0, y: v.height }).y, y1 = toBoard(v, { x: 0, y: 0 }).y;
    // Tick positions are whole multiples of the minor step (k · minor), so each labelled one is exact in the unit.
    const per = Math.round(step / minor);
    const charPx = 6.2; // 10 px monospace (app.css .tick-label)
    for (let k = Math.ceil(x0 / minor); k * minor <= x1; k++) {
      const sx = toScreen(v, { x: k * minor, y: 0 }).x;
      const major = k % per === 0;
      this.rulerX.line(sx, RULER_PX - (major ? 8 : 4), sx, RULER_PX).addClass('tick');
      if (!major) continue;
      const text = rulerLabel(k * minor, unit, step);
      const half = (text.length * charPx) / 2;
      if (sx - half < 1 || sx + half > lenX - 1) continue;
      this.rulerX.plain(text).attr({ x: sx, y: 11, 'text-anchor': 'middle', 'data-value': String(Number(((k * minor) / UNIT_METRES[unit]).toPrecision(12))) }).addClass('tick-label');
    }
    for (let k = Math.ceil(y0 / minor); k * minor <= y1; k++) {
      const sy = toScreen(v, { x: 0, y: k * minor }).y;
      const major = k % per === 0;
      this.rulerY.line(RULER_PX - (major ? 8 : 4), sy, RULER_PX, sy).addClass('tick');
      if (!major) continue;
      const text = rulerLabel(k * minor, unit, step);
      const half = (text.length * charPx) / 2;
      if (sy - half < 1 || sy + half > lenY - 1) continue;
      // Written along the ruler (turned a quarter), so long values fit its width.
      this.rulerY.plain(text).attr({ x: 0, y: 0, 'text-anchor': 'middle', transform: `translate(11 ${sy}) rotate(-90)`, 'data-value': String(Number(((k * minor) / UNIT_METRES[unit]).toPrecision(12))) }).addClass('tick-label');
    }
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

  /** The last press, to count the presses of a double-click (pointer events do not count them). */
  private lastPress: { t: number; x: number; y: number; n: number } = { t: -1e9, x: 0, y: 0, n: 0 };

  private pressCount(type: BoardPointer['type'], e: PointerEvent | MouseEvent, screen: Vec2): number {
    if (type !== 'down') return 1;
    const p = this.lastPress;
    const again = e.timeStamp - p.t < 500 && Math.hypot(screen.x - p.x, screen.y - p.y) < 5;
    this.lastPress = { t: e.timeStamp, x: screen.x, y: screen.y, n: again ? p.n + 1 : 1 };
    return this.lastPress.n;
  }

  private pointer(type: BoardPointer['type'], e: PointerEvent | MouseEvent): void {
    const r = this.element.getBoundingClientRect();
    const screen = { x: e.clientX - r.left, y: e.clientY - r.top };
    const clicks = this.pressCount(type, e, screen);
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
      hit: hitTest(this.scene, at, tolerance), tolerance, clicks,
    });
  }
}
