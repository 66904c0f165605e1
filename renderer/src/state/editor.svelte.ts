/**
 * The editor's state: one class, because the board controller, the tools and every panel share it and a class
 * gives them one typed object to hold. Core objects (the design, the layout result) are `$state.raw`: they are
 * immutable values replaced on every edit, never deeply proxied. View values are `$derived`.
 *
 * Every edit goes through the core's History (design commands, undo by diffs); a drag is one live step.
 */
import { DESIGN_COMMANDS, History, parseDesign, serializeDesign, newDesign, copySelection, type Area, type DesignDoc, type DesignNode, type DesignSegment, type FabProcess, type JunctionChoice } from '../../../core/index.ts';
import type { Box, Region, Vec2 } from '../../../core/index.ts';
import type { SubstrateSpec } from '../../../core/index.ts';
import { InputError } from '../../../core/index.ts';
import { couponForDesign, defaultGroundClearance, smdFootprint, type CouponPlan } from '../../../core/index.ts';
import { sparamsAdmittance } from '../../../core/index.ts';
import { errorWords, namer } from '../../../core/index.ts';
import type { Scene } from '../board/scene.ts';
import type { Preview } from '../board/BoardController.ts';
import { ToolMachine, type ToolId } from '../board/tools.ts';
import { createToolHost } from './toolHost.ts';
import { boxOf } from '../board/viewport.ts';
import { UNIT_METRES, type LengthUnit } from '../board/grid.ts';
import { buildScene, scenePoints } from './scene.ts';
import type { PieceFigures } from './figures.ts';
import type { LayoutView } from './layoutView.ts';
import { applyTheme, initialTheme, type Theme } from './theme.ts';

/** What the editor needs from the board drawing (the controller, or nothing in tests). */
export interface BoardPort {
  preview(p: Preview): void;
  fit(box: Box | null): void;
  zoomBy(f: number): void;
  panScreen(dx: number, dy: number): void;
}

export interface OpenFile { path: string; name: string; modifiedMs: number | null }

export class EditorState {
  readonly history: History;
  doc = $state.raw<DesignDoc>(newDesign());
  revision = $state(0);
  savedRevision = $state(0);
  file = $state.raw<OpenFile | null>(null);
  docId = $state(makeDocId());
  selection = $state.raw<ReadonlySet<string>>(new Set());
  hovered = $state<string | null>(null);
  hoverAt = $state.raw<Vec2 | null>(null);
  tool = $state<ToolId>('pick');
  /** The path ledger shows each path's phase sensitivity to εr, h and W (the layout job then works them out). */
  showSensitivity = $state(false);
  theme = $state<Theme>('light');
  status = $state('');
  /** Sizing, geometry, paths and checks of the current revision (from the worker); null until the first result. */
  layout = $state.raw<LayoutView | null>(null);
  layoutError = $state<string | null>(null);
  /** Ids flagged by the fabrication findings (outlined in red). */
  flagged = $state.raw<ReadonlySet<string>>(new Set());
  /** Runs the shop check found side by side closer than the design's proximity limit (dashed warning edge). */
  near = $state.raw<ReadonlySet<string>>(new Set());
  canUndo = $state(false);
  canRedo = $state(false);
  /** Labels of the next undo and redo steps, for the buttons' tooltips. */
  undoLabel = $derived.by(() => { void this.revision; void this.canUndo; return this.history.undoLabels.at(-1) ?? ''; });
  redoLabel = $derived.by(() => { void this.revision; void this.canRedo; return this.history.redoLabels[0] ?? ''; });

  readonly tools: ToolMachine;
  board: BoardPort | null = null;

  /** The design as it was last opened or saved: undoing back to it is not an unsaved change. */
  private savedDoc: DesignDoc | null = null;
  dirty = $derived(this.revision !== this.savedRevision && !sameRecords(this.doc, this.savedDoc));
  /** Display units: a view setting of the app (kept in local storage), never part of the design or its undo list. */
  units = $state<LengthUnit>(initialUnits());
  /** Snap step: the design's own, else 0.1 mm or 5 mil (common practice for hand-drawn RF boards). */
  gridStep = $derived(this.doc.view?.grid ?? (this.units === 'mil' ? 5 * UNIT_METRES.mil : 0.1e-3));
  /** Ground copper left after clearing, from the last shop check, with the revision it belongs to. */
  ground = $state.raw<{ revision: number; regions: Region[] } | null>(null);
  /** Copper left after milling, from the last milling plan (Outputs), with its revision; drawn when `showMilled`. */
  milled = $state.raw<{ revision: number; regions: Region[] } | null>(null);
  /** View toggle: the board as milled drawn over the design. */
  showMilled = $state(false);
  scene = $derived<Scene>({
    ...buildScene(this.doc, this.layout, this.layout?.placed ?? null, this.ground?.regions ?? []), groundStale: this.ground?.revision !== this.revision,
    ...(this.showMilled && this.milled ? { milled: this.milled.regions, milledStale: this.milled.revision !== this.revision } : {}),
  });
  selectedSegment = $derived<DesignSegment | null>(this.single((id) => this.doc.segments.find((s) => s.id === id)));
  selectedNode = $derived<DesignNode | null>(this.single((id) => this.doc.nodes.find((n) => n.id === id)));
  selectedArea = $derived<Area | null>(this.single((id) => this.doc.areas.find((a) => a.id === id)));
  fileName = $derived(this.file?.name ?? null);
  /** The ground clearance the layout uses when an area gives none (the core's rule). */
  defaultClearance = $derived(this.layout ? defaultGroundClearance({ ...this.layout.sized, doc: this.doc }) : this.doc.substrate.h);

  constructor(doc?: DesignDoc) {
    this.history = new History(doc ?? newDesign());
    this.doc = this.history.doc;
    this.history.subscribe((d, rev) => {
      this.doc = d;
      this.revision = rev;
      this.canUndo = this.history.canUndo;
      this.canRedo = this.history.canRedo;
      // Drop selected ids that no longer exist (after delete or undo).
      if (this.selection.size) {
        const alive = new Set<string>([...d.nodes.map((n) => n.id), ...d.segments.map((s) => s.id), ...d.areas.map((a) => a.id)]);
        const kept = [...this.selection].filter((id) => alive.has(id));
        if (kept.length !== this.selection.size) this.selection = new Set(kept);
      }
    });
    this.tools = new ToolMachine(createToolHost(this));
    this.theme = initialTheme();
  }

  private single<T>(find: (id: string) => T | undefined): T | null {
    if (this.selection.size !== 1) return null;
    return find([...this.selection][0]!) ?? null;
  }

  // ---- edits ------------------------------------------------------------------------------------------------

  /** Runs a design command as one undo step; a refused edit shows its reason and changes nothing. */
  edit(id: string, args: unknown, label?: string): boolean {
    try {
      if (this.field) {
        // Typing in a field: every keystroke shows at once, and the whole entry becomes one undo step.
        if (!this.history.isLive) this.history.beginLive(label ?? DESIGN_COMMANDS.get(id)?.label ?? id);
        this.history.apply(id, args);
        this.field.changed = true;
      } else {
        this.history.apply(id, args, label);
        this.history.mark();
      }
      this.canUndo = this.history.canUndo;
      return true;
    } catch (err) {
      this.status = err instanceof InputError ? `Not done: ${errorWords(err)}` : `Not done: ${String(err)}`;
      return false;
    }
  }

  /** Rises when a drag ends: the settled design is laid out by the worker again (its copper was made live). */
  settled = $state(0);

  /** Runs several design commands as one undo step (all or nothing: a refusal undoes the ones already run). */
  editAll(steps: { id: string; args: unknown }[], label: string): boolean {
    if (steps.length === 1) return this.edit(steps[0]!.id, steps[0]!.args, label);
    this.history.beginLive(label);
    try {
      for (const s of steps) this.history.apply(s.id, s.args);
      this.history.commitLive();
      this.canUndo = this.history.canUndo;
      return true;
    } catch (err) {
      this.history.cancelLive();
      this.status = err instanceof InputError ? `Not done: ${errorWords(err)}` : `Not done: ${String(err)}`;
      return false;
    }
  }

  /** A pointer drag is in progress (a live step not opened by typing in a field): autosave waits for its end. */
  get dragging(): boolean { return this.history.isLive && this.field === null; }

  /** The field being typed in, if any (see fieldStart). */
  private field: { changed: boolean } | null = null;

  /** A quantity field got the focus: its edits gather into one undo step until fieldEnd. */
  fieldStart(): void { this.fieldEnd(true); this.field = { changed: false }; }

  /** The field lost the focus (commit) or the user pressed Esc (drop what was typed). */
  fieldEnd(commit: boolean): void {
    if (!this.field) return;
    this.field = null;
    if (this.history.isLive) { if (commit) this.history.commitLive(); else this.history.cancelLive(); }
    this.canUndo = this.history.canUndo;
    this.canRedo = this.history.canRedo;
  }

  undo(): void { this.tools.cancel(); this.fieldEnd(true); if (this.history.undo()) this.status = 'Undone'; }
  redo(): void { this.fieldEnd(true); if (this.history.redo()) this.status = 'Redone'; }

  updateSegment(id: string, spec: Record<string, unknown>): void { this.edit('segment.setSpec', { id, spec }); }

  /**
   * Makes the part or measured block `id` a measured block with the Touchstone text of `fileName` (1 or 2 ports),
   * checked the way the sweep will read it. One undo step. Returns the reason when the file is refused (the design
   * is then left as it was). A lumped part keeps its place: the block takes the part's pad pitch as its length.
   */
  useMeasuredData(id: string, fileName: string, text: string): string | null {
    const seg = this.doc.segments.find((s) => s.id === id);
    if (!seg || (seg.kind !== 'lumped' && seg.kind !== 'sparams')) return 'Select a part or a measured block first.';
    // The design's own limits (the text's size among them) are checked by the edit below; this reads the data.
    try { sparamsAdmittance(text, fileName, fileName); } catch (err) { return err instanceof Error ? err.message : String(err); }
    const length = seg.kind === 'sparams' ? seg.length : { by: 'length', length: smdFootprint(seg.size).pitch };
    const ok = this.edit('segment.setSpec', { id, spec: { kind: 'sparams', touchstone: text, name: fileName, width: seg.width, length } }, 'Use measured data');
    if (ok) this.status = `${id} now uses the measured data of ${fileName}`;
    return ok ? null : this.status;
  }

  updateNode(id: string, patch: Record<string, unknown>): void {
    const { label, ...spec } = patch;
    const args: Record<string, unknown> = { id };
    if (Object.keys(spec).length) args.spec = spec;
    if ('label' in patch) args.label = label === undefined ? null : label;
    this.edit('node.setSpec', args);
  }

  /** A phase group from one port to others (±5°, the usual default of the path report). */
  askPhaseMatch(from: string, to: string[]): void {
    const name = namer(this.doc);
    this.edit('phaseGroup.set', { from, to, toleranceDeg: 5, name: `${name(from)} → ${to.map(name).join(', ')} in phase` }, 'Ask for phase match');
  }

  rename(name: string): void { this.edit('design.setInfo', { name }, 'Rename'); }

  setEnd(id: string, kind: 'open' | 'short'): void { this.edit('node.setSpec', { id, spec: { kind } }); }

  /** Turns an open or shorted end into a port facing along its line (the line leaves the port towards its neighbour). */
  makePort(id: string): void {
    const n = this.doc.nodes.find((x) => x.id === id);
    const s = this.doc.segments.find((x) => x.a === id || x.b === id);
    const o = s && this.doc.nodes.find((x) => x.id === (s.a === id ? s.b : s.a));
    const heading = n && o ? Math.atan2(o.at.y - n.at.y, o.at.x - n.at.x) : 0;
    this.edit('node.setSpec', { id, spec: { kind: 'port', zRef: 50, heading } }, 'Make port');
  }
  setSubstrate(patch: Partial<SubstrateSpec>): void { this.edit('design.setSubstrate', { substrate: patch }); }
  setFrequency(patch: { f0?: number; band?: { start: number; stop: number } }): void { this.edit('design.setFrequency', patch); }
  setProcess(process: FabProcess): void { this.edit('design.setProcess', { process }); }
  setJunctions(junctions: JunctionChoice): void { this.edit('design.setJunctions', { junctions }); }
  setAsMade(asMade: NonNullable<DesignDoc['asMade']>): void { this.edit('design.setAsMade', { asMade }); }
  setUnits(units: LengthUnit): void {
    this.units = units;
    try { globalThis.localStorage?.setItem(UNITS_KEY, units); } catch { /* storage may be off: the setting then lasts this session */ }
  }
  setGrid(grid: number): void { this.edit('view.set', { grid }); }

  deleteSelection(): void {
    if (!this.selection.size) return;
    if (this.edit('selection.delete', { ids: [...this.selection] })) this.selection = new Set();
  }

  selectionCentre(): Vec2 | null {
    const pts: Vec2[] = [];
    const ids = this.selection;
    for (const n of this.doc.nodes) if (ids.has(n.id)) pts.push(n.at);
    for (const s of this.doc.segments) if (ids.has(s.id)) for (const e of [s.a, s.b]) { const n = this.doc.nodes.find((x) => x.id === e); if (n) pts.push(n.at); }
    for (const a of this.doc.areas) if (ids.has(a.id)) pts.push(...a.polygon);
    const b = boxOf(pts);
    return b ? { x: (b.minX + b.maxX) / 2, y: (b.minY + b.maxY) / 2 } : null;
  }

  rotateSelection(angleDeg = 90): void {
    const about = this.selectionCentre();
    if (about) this.edit('selection.rotate', { ids: [...this.selection], about, angleDeg });
  }

  mirrorSelection(axis: 'vertical' | 'horizontal' = 'vertical'): void {
    const about = this.selectionCentre();
    if (about) this.edit('selection.mirror', { ids: [...this.selection], about, axis });
  }

  nudge(dx: number, dy: number): void {
    if (this.selection.size) this.edit('selection.translate', { ids: [...this.selection], by: { x: dx * this.gridStep, y: dy * this.gridStep } });
  }

  /** Copy: the core's clipboard text, kept in the app and offered to the system clipboard. */
  clipboard: string | null = null;
  pasteCount = 0;

  copy(): boolean {
    if (!this.selection.size) return false;
    try {
      this.clipboard = copySelection(this.doc, [...this.selection]);
      this.pasteCount = 0;
      void globalThis.navigator?.clipboard?.writeText(this.clipboard).catch(() => undefined);
      this.status = `Copied ${this.selection.size} item(s)`;
      return true;
    } catch (err) {
      this.status = err instanceof InputError ? `Not copied: ${err.expected}` : String(err);
      return false;
    }
  }

  cut(): void { if (this.copy()) this.deleteSelection(); }

  paste(): void {
    if (!this.clipboard) { this.status = 'Nothing to paste: copy something first'; return; }
    this.pasteCount++;
    const step = Math.max(this.gridStep, 1e-3) * 2 * this.pasteCount;
    const before = new Set([...this.doc.nodes.map((n) => n.id), ...this.doc.segments.map((s) => s.id)]);
    if (this.edit('selection.paste', { clipboard: this.clipboard, offset: { x: step, y: -step } })) {
      this.selection = new Set([...this.doc.nodes.map((n) => n.id), ...this.doc.segments.map((s) => s.id)].filter((id) => !before.has(id)));
    }
  }

  /**
   * Adds a laminate coupon (core couponForDesign: lines sized for this design's laminate and band) below the
   * drawing, as one undo step, and selects it. Returns the plan, or the reason it was refused.
   */
  addCoupon(opts: { thru?: boolean } = {}): CouponPlan | string {
    let c: ReturnType<typeof couponForDesign>;
    try { c = couponForDesign(this.doc, { thru: opts.thru === true }); } catch (err) { return err instanceof InputError ? errorWords(err) : String(err); }
    const before = new Set([...this.doc.nodes.map((n) => n.id), ...this.doc.segments.map((s) => s.id)]);
    if (!this.edit('selection.paste', { clipboard: c.clipboard, offset: c.offset }, 'Add laminate coupon')) return this.status;
    const added = [...this.doc.nodes.map((n) => n.id), ...this.doc.segments.map((s) => s.id)].filter((id) => !before.has(id));
    this.selectAndFrame(added);
    this.status = `Laminate coupon added: ${c.plan.lines.length} lines`;
    return c.plan;
  }

  /** Makes a measured laminate the design's substrate (εr and tanδ at fMeasure, wideband Debye), as one undo step. */
  useMeasuredLaminate(er: number, tanDelta: number, fMeasure: number): boolean {
    const ok = this.edit('design.setSubstrate', { substrate: { er, tanDelta, preset: null, dielectricModel: { kind: 'wideband-debye', fMeasure } } }, 'Use measured laminate');
    if (ok) this.status = `Laminate set from the coupon: εr ${er.toPrecision(4)}, tanδ ${tanDelta.toPrecision(3)} at ${(fMeasure / 1e9).toPrecision(4)} GHz`;
    return ok;
  }

  selectAll(): void { this.selection = new Set([...this.doc.nodes.map((n) => n.id), ...this.doc.segments.map((s) => s.id), ...this.doc.areas.map((a) => a.id)]); }

  // ---- files ------------------------------------------------------------------------------------------------

  /** Replaces the document (open, new, example); history starts afresh. The caller has asked about unsaved work. */
  load(doc: DesignDoc, file: OpenFile | null): void {
    this.tools.cancel();
    this.selection = new Set();
    this.layout = null;
    this.ground = null;
    this.milled = null;
    this.flagged = new Set();
    this.near = new Set();
    this.history.reset(doc);
    this.canUndo = false;
    this.canRedo = false;
    this.savedRevision = this.history.revision;
    this.savedDoc = this.doc;
    this.file = file;
    this.docId = makeDocId();
    // Frame the new design at once from its drawn positions (not later, when the first layout lands: the view
    // must not jump under a user who has started drawing).
    this.fitAll();
  }

  /** Loads design text; returns the problems as text when it cannot be read (the current design stays). */
  loadText(text: string, file: OpenFile | null): string | null {
    const r = parseDesign(text);
    if (!r.ok) return r.errors.slice(0, 5).map((e) => `${e.path}: expected ${e.expected}, found ${e.found}`).join('\n');
    this.load(r.doc, file);
    if (r.migratedFrom !== undefined) this.status = `Opened a version ${r.migratedFrom} file; it is saved in the current format.`;
    return null;
  }

  serialize(): string { return serializeDesign({ ...this.doc, app: `stripwright ${APP_VERSION}` }); }

  markSaved(file: OpenFile): void { this.file = file; this.savedDoc = this.doc; this.savedRevision = this.revision; }

  /** The open design has never been saved as it is (e.g. restored from a recovery copy). */
  markUnsaved(): void { this.savedDoc = null; this.savedRevision = -1; }

  // ---- selection, view, tools -------------------------------------------------------------------------------

  select(ids: string[], mode: 'replace' | 'toggle' | 'add' = 'replace'): void {
    if (mode === 'replace') { this.selection = new Set(ids); return; }
    const s = new Set(this.selection);
    for (const id of ids) { if (mode === 'toggle' && s.has(id)) s.delete(id); else s.add(id); }
    this.selection = s;
  }

  /** Selects ids and zooms to them (from the piece list or a finding). */
  selectAndFrame(ids: string[]): void {
    this.select(ids);
    this.board?.fit(this.boxOfIds(ids, 2e-3));
  }

  boxOfIds(ids: string[], margin = 0): Box | null {
    const want = new Set(ids);
    const pts: Vec2[] = [];
    for (const n of this.scene.nodes) if (want.has(n.id)) pts.push(n.at);
    for (const s of this.scene.segments) if (want.has(s.id)) pts.push(...(s.centreline ?? [s.a, s.b]));
    for (const a of this.doc.areas) if (want.has(a.id)) pts.push(...a.polygon);
    const b = boxOf(pts);
    return b && { minX: b.minX - margin, minY: b.minY - margin, maxX: b.maxX + margin, maxY: b.maxY + margin };
  }

  /** Zoom to fit everything; an empty design shows 60 × 40 mm around the origin. */
  fitAll(): void {
    this.board?.fit(boxOf(scenePoints(this.doc, this.layout)) ?? { minX: -0.03, minY: -0.02, maxX: 0.03, maxY: 0.02 });
  }

  setTool(t: ToolId): void { this.tool = t; this.tools.setTool(t); }

  toggleTheme(): void { this.theme = this.theme === 'dark' ? 'light' : 'dark'; applyTheme(this.theme); }

  /** A layout result from the worker; an older revision's result is still shown until the newer one arrives. */
  applyLayout(v: LayoutView, geometryError: string | null): void {
    if (this.layout && v.revision < this.layout.revision) return;
    this.layout = v;
    const problems = v.sized.problems.map((p) => p.message);
    this.layoutError = geometryError ?? (problems.length ? problems.join('; ') : null);
  }

  layoutFailed(message: string): void { this.layoutError = message; }

  /** A node's label, or its id where it has none. */
  /** A record's name for people, the same in every face (core namer: its label, else its id). */
  nodeName(id: string): string {
    // One namer per design revision: panels name dozens of ports per revision (a drag makes one every frame).
    if (this.names?.doc !== this.doc) this.names = { doc: this.doc, name: namer(this.doc) };
    return this.names.name(id);
  }
  private names: { doc: DesignDoc; name: (id: string) => string } | null = null;

  figuresOf(id: string): PieceFigures | null { return this.layout?.figures.get(id) ?? null; }

  /** Sized copper width of the line that meets node `id`, if known. */
  lineWidthAt(id: string): number | null {
    const s = this.doc.segments.find((x) => x.a === id || x.b === id);
    const f = s ? this.figuresOf(s.id) : null;
    return f ? (s!.b === id && f.widthEnd !== undefined ? f.widthEnd : f.width) : null;
  }

  drawnLength(id: string): number {
    const s = this.scene.segments.find((x) => x.id === id);
    return s ? Math.hypot(s.b.x - s.a.x, s.b.y - s.a.y) : 1e-3;
  }

  /** App commands (menus, shortcuts, finder) are registered by the shell; the menus call them by id. */
  commandRunner: ((id: string) => void) | null = null;
  runCommand(id: string): void { this.commandRunner?.(id); }
}

export const APP_VERSION = '0.1.0';

const UNITS_KEY = 'stripwright.units';

function initialUnits(): LengthUnit {
  try { return globalThis.localStorage?.getItem(UNITS_KEY) === 'mil' ? 'mil' : 'mm'; } catch { return 'mm'; }
}

function makeDocId(): string {
  return globalThis.crypto?.randomUUID?.().slice(0, 18) ?? `doc-${Date.now().toString(36)}`;
}

/**
 * Whether two documents hold the very same records: undo restores the record objects it replaced, so comparing
 * top-level fields and list entries by identity is exact for "back to the saved state" and costs no serialising
 * (a drag of a large design asks this every frame). Anything else counts as changed.
 */
function sameRecords(a: DesignDoc, b: DesignDoc | null): boolean {
  if (b === null) return false;
  if (a === b) return true;
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  for (const k of keys) {
    const x = (a as Record<string, unknown>)[k];
    const y = (b as Record<string, unknown>)[k];
    if (x === y) continue;
    if (!Array.isArray(x) || !Array.isArray(y) || x.length !== y.length) return false;
    for (let i = 0; i < x.length; i++) if (x[i] !== y[i]) return false;
  }
  return true;
}
