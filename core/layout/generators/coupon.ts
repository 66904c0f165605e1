/**
 * Generator of a laminate coupon: straight lines of one width and different lengths with identical edge launches,
 * to be made on the same sheet as the design and measured as two-ports (core/network/coupon/extract.ts turns the
 * measurements into εr and tanδ). An invented arrangement of our own.
 *
 * Why these lengths. The two-line method sees the propagation constant only through the length difference Δl of a
 * pair: the eigenvalues e^{∓γΔl} of M_j·M_i⁻¹ coincide where β·Δl = nπ and the estimate blows up near there
 * (R. B. Marks, IEEE Trans. MTT 39(7), 1991). Over a band f1–f2, β·Δl runs from θ1 = β(f1)Δl to θ2 = β(f2)Δl; the
 * worst distance from a multiple of π is min(θ1, π − θ2), largest when θ1 = π − θ2, i.e.
 *     Δl = π / (β(f1) + β(f2))                 (β from the line model, dispersion included)
 * which keeps β·Δl symmetric about 90° and at least π/(1 + f2/f1) from 0° and 180° (for a constant εe). With the
 * usual 20° limit (common practice for TRL lines) one pair covers up to f2/f1 ≈ 8; we stop at 30° (f2/f1 ≤ 5) and split wider bands into
 * geometric sub-bands, each with its own longer line sharing the shortest line as the common one (the multiline
 * arrangement). The shortest line is long enough (default 25 mm, at least 10·h) for the launches not to see each
 * other; all lines share its launches, so the error boxes cancel. An optional thru (the launches with the shortest
 * line the pads allow) can serve a through-reflect-line calibration; the extraction treats it as one more line.
 *
 * Layout: lines side by side, shortest on top, each centred on x = 0, one strip of board per line so that both
 * launches sit on the board edge; the outline is the stepped union of the strips (cut along the steps to part them).
 * Widths are fixed (`by: 'width'`) so the coupon stays as made when the design's laminate is later replaced by the
 * measured one.
 */
import type { DesignDoc, DesignNode, DesignSegment } from '../../design/types.ts';
import type { Vec2 } from '../../geometry/types.ts';
import { newDesign } from '../../design/defaults.ts';
import { copySelection } from '../../design/clipboard.ts';
import type { SubstrateSpec } from '../../substrate/types.ts';
import { validateSubstrate } from '../../substrate/validate.ts';
import { lineModels, stripAt, type LineModels, type LineOptions, type StripLineFamily } from '../../line/index.ts';
import { InputError, describe } from '../../util/errors.ts';
import type { Warning } from '../../util/warnings.ts';

export interface CouponOptions {
  /** The laminate as far as it is known (εr is the guess the lengths are sized with). */
  substrate: SubstrateSpec;
  /** Band to measure over, Hz. */
  band: { start: number; stop: number };
  /** Line impedance (default 50 Ω), synthesised at the band's geometric centre; or give `width`. */
  z0?: number;
  width?: number;
  /** Shortest line, m (default 25 mm, at least 10·h). */
  baseLength?: number;
  /** Edge-launch pad length, m (default 2 mm); its width is the line's. */
  padLength?: number;
  /** Distance between neighbouring lines, m (default 15 mm: room for an edge-launch connector body, common practice). */
  pitch?: number;
  /** Add a thru (the two launches with the shortest line between them). */
  thru?: boolean;
  /** Largest f2/f1 one pair covers (default 5, i.e. β·Δl at least 30° from 0° and 180°). */
  maxRatio?: number;
  line?: LineOptions;
  /** Line models the coupon's strips are asked of (the line-model interface; default the core's). */
  models?: LineModels;
}

export interface CouponLinePlan {
  /** Letter of the line on the board (A, B, C …; T for the thru). */
  name: string;
  /** Port-to-port length, m (launch pads included). */
  length: number;
  /** Length difference to the shortest line, m (0 for it). */
  delta: number;
  /** Sub-band this line serves with the shortest line, Hz. */
  band?: { start: number; stop: number };
  /** β·Δl with the shortest line at the ends of that sub-band, degrees. */
  phaseDeg?: [number, number];
  /** Node ids of its two ports and the segment id, in the generated design. */
  ports: [string, string];
  segment: string;
}

export interface CouponPlan {
  width: number;
  lines: CouponLinePlan[];
  /** Worst distance of the best pair's β·Δl from a multiple of 180° over the band, degrees (by the line model). */
  worstMarginDeg: number;
  padLength: number;
  warnings: Warning[];
}

function checkPositive(field: string, v: unknown, expected: string, hi: number): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || !(v > 0 && v <= hi)) {
    throw new InputError(typeof v === 'number' && Number.isFinite(v) ? 'out-of-range' : 'invalid-number', field, expected, describe(v));
  }
  return v;
}

const mm = (x: number) => `${Number((x * 1e3).toFixed(2))} mm`;

/** The stepped outline around strips (x half-length, y top, y bottom), listed top to bottom; counter-clockwise. */
function steppedOutline(strips: { half: number; top: number; bottom: number }[]): Vec2[] {
  const pts: Vec2[] = [];
  const last = strips.length - 1;
  pts.push({ x: -strips[last]!.half, y: strips[last]!.bottom });
  for (let i = last; i >= 0; i--) { pts.push({ x: strips[i]!.half, y: strips[i]!.bottom }, { x: strips[i]!.half, y: strips[i]!.top }); }
  for (let i = 0; i <= last; i++) { pts.push({ x: -strips[i]!.half, y: strips[i]!.top }, { x: -strips[i]!.half, y: strips[i]!.bottom }); }
  // Drop repeated points and points in the middle of a straight edge.
  const out: Vec2[] = [];
  for (const p of pts) { const q = out[out.length - 1]; if (!q || q.x !== p.x || q.y !== p.y) out.push(p); }
  while (out.length > 1 && out[0]!.x === out[out.length - 1]!.x && out[0]!.y === out[out.length - 1]!.y) out.pop();
  return out.filter((p, i) => {
    const a = out[(i + out.length - 1) % out.length]!, b = out[(i + 1) % out.length]!;
    return Math.abs((p.x - a.x) * (b.y - a.y) - (p.y - a.y) * (b.x - a.x)) > 1e-18;
  });
}

/** β (rad/m) of the strip at f by the line model. */
function betaAt(family: StripLineFamily, sub: SubstrateSpec, width: number, f: number, line?: LineOptions): number {
  return (2 * Math.PI * f) / 299_792_458 * Math.sqrt(stripAt(family, sub, width, f, line).epsEff);
}

/** Sizes the coupon's lines for the laminate and band. Pure; throws InputError for bad options. */
export function planCoupon(opts: CouponOptions): CouponPlan {
  const sub = validateSubstrate(opts.substrate);
  const f1 = checkPositive('band.start', opts.band?.start, 'a band start above 0 Hz', 1e12);
  const f2 = checkPositive('band.stop', opts.band?.stop, 'a band stop above the start', 1e12);
  if (!(f2 > f1 * 1.01)) throw new InputError('out-of-range', 'band.stop', `a band stop above the start (${f1} Hz) by more than 1 %`, String(f2), 'a coupon needs some bandwidth to fit over');
  const fc = Math.sqrt(f1 * f2);
  const family = (opts.models ?? lineModels).strip();
  const width = opts.width !== undefined
    ? checkPositive('width', opts.width, 'a strip width above 0 m', 0.1)
    : family.widthFor(sub, checkPositive('z0', opts.z0 ?? 50, 'an impedance above 0 Ω', 1000), fc, opts.line);
  const padLength = checkPositive('padLength', opts.padLength ?? 2e-3, 'a launch pad length above 0 m', 0.05);
  const base = checkPositive('baseLength', opts.baseLength ?? Math.max(25e-3, 10 * sub.h, 2 * padLength + 10 * sub.h), 'the shortest line length above 0 m', 1);
  if (base < 2 * padLength + 2 * width) {
    throw new InputError('out-of-range', 'baseLength', `a shortest line longer than both launch pads and a little line (${mm(2 * padLength + 2 * width)})`, mm(base));
  }
  const maxRatio = opts.maxRatio ?? 5;
  if (typeof maxRatio !== 'number' || !(maxRatio >= 1.5 && maxRatio <= 8)) throw new InputError('out-of-range', 'maxRatio', 'a band ratio per pair from 1.5 to 8', describe(maxRatio));
  const warnings: Warning[] = [];
  // The top frequency must stay quasi-TEM for the model (and the measurement) to mean anything.
  const top = stripAt(family, sub, width, f2, opts.line);
  warnings.push(...top.warnings.filter((w) => w.code === 'higher-order-mode'));
  const pairs = Math.max(1, Math.ceil(Math.log(f2 / f1) / Math.log(maxRatio) - 1e-9));
  const ratio = Math.pow(f2 / f1, 1 / pairs);
  const lines: CouponLinePlan[] = [{ name: 'A', length: base, delta: 0, ports: ['', ''], segment: '' }];
  for (let i = 0; i < pairs; i++) {
    const a = f1 * Math.pow(ratio, i), b = a * ratio;
    const ba = betaAt(family, sub, width, a, opts.line), bb = betaAt(family, sub, width, b, opts.line);
    // Rounded to 10 µm, finer than any board shop holds (common practice).
    const delta = Math.round((Math.PI / (ba + bb)) * 1e5) / 1e5;
    lines.push({ name: String.fromCharCode(66 + i), length: base + delta, delta, band: { start: a, stop: b },
      phaseDeg: [(ba * delta * 180) / Math.PI, (bb * delta * 180) / Math.PI], ports: ['', ''], segment: '' });
  }
  // Worst conditioning over the band (best pair at each frequency), on a log grid.
  let worst = 90;
  for (let k = 0; k <= 200; k++) {
    const f = f1 * Math.pow(f2 / f1, k / 200);
    const b = betaAt(family, sub, width, f, opts.line);
    let best = 0;
    for (const l of lines) {
      if (l.delta === 0) continue;
      const th = (b * l.delta) % Math.PI;
      best = Math.max(best, (Math.min(th, Math.PI - th) * 180) / Math.PI);
    }
    worst = Math.min(worst, best);
  }
  if (opts.thru) lines.push({ name: 'T', length: 2 * padLength + Math.max(2 * width, 4 * sub.h), delta: 0, ports: ['', ''], segment: '' });
  return { width, lines, worstMarginDeg: worst, padLength, warnings };
}

/**
 * A complete coupon design (its own board, labelled lines, notes on how to measure it) and the plan behind it.
 * Add it to another design with copySelection/selection.paste (one undo step), or save it as it is.
 * @example laminateCoupon({ substrate: FR4_DEFAULT, band: { start: 1e9, stop: 4e9 } }).plan.lines.map((l) => l.length)
 */
export function laminateCoupon(opts: CouponOptions): { design: DesignDoc; plan: CouponPlan } {
  const plan = planCoupon(opts);
  const pitch = checkPositive('pitch', opts.pitch ?? Math.max(15e-3, plan.width + 10 * opts.substrate.h), 'a line pitch above 0 m', 1);
  if (pitch < plan.width + 4 * opts.substrate.h) {
    throw new InputError('out-of-range', 'pitch', `a pitch of at least the width plus 4·h (${mm(plan.width + 4 * opts.substrate.h)}) so neighbouring lines do not couple`, mm(pitch));
  }
  const fc = Math.sqrt(opts.band.start * opts.band.stop);
  // Plain microstrip: the laminate fit (core/network/coupon) models the coupon's lines as microstrip.
  const design = newDesign({ name: 'Laminate coupon', substrate: opts.substrate, f0: fc, band: { ...opts.band }, asMade: { sizing: 'microstrip', sideCopper: 'stitched' } });
  // Shortest on top (the thru first if there is one), longest at the bottom.
  const order = [...plan.lines].sort((p, q) => p.length - q.length);
  const nodes: DesignNode[] = [];
  const segments: DesignSegment[] = [];
  const launch = { padWidth: plan.width, padLength: plan.padLength };
  const strips: { half: number; top: number; bottom: number }[] = [];
  order.forEach((l, i) => {
    const y = -i * pitch; const half = l.length / 2;
    const a = `${l.name.toLowerCase()}1`, b = `${l.name.toLowerCase()}2`, s = `line${l.name}`;
    const title = l.name === 'T' ? 'thru' : `line ${l.name}`;
    nodes.push({ id: a, kind: 'port', label: `${l.name}1`, zRef: 50, heading: 0, launch, at: { x: -half, y } });
    nodes.push({ id: b, kind: 'port', label: `${l.name}2`, zRef: 50, heading: Math.PI, launch, at: { x: half, y } });
    segments.push({ id: s, a, b, kind: 'line', label: `coupon ${title}, ${mm(l.length)} port to port`, width: { by: 'width', width: plan.width }, length: { by: 'length', length: l.length } });
    l.ports = [a, b]; l.segment = s;
    strips.push({ half, top: y + pitch / 2, bottom: y - pitch / 2 });
  });
  design.nodes = nodes;
  design.segments = segments;
  design.board = { outline: steppedOutline(strips) };
  const longest = plan.lines.filter((l) => l.delta > 0).map((l) =>
    `line ${l.name} is ${mm(l.delta)} longer than line A (β·Δl ${l.phaseDeg!.map((d) => Math.round(d)).join('°–')}° over ${(l.band!.start / 1e9).toPrecision(3)}–${(l.band!.stop / 1e9).toPrecision(3)} GHz)`).join('; ');
  design.notes = [
    `Laminate coupon for ${(opts.band.start / 1e9).toPrecision(3)}–${(opts.band.stop / 1e9).toPrecision(3)} GHz: lines of ${mm(plan.width)} strip with identical ${mm(plan.padLength)} edge-launch pads; ${longest}.`,
    `Sized with εr ${opts.substrate.er} (a guess); the phase difference stays at least ${Math.round(plan.worstMarginDeg)}° from 0° and 180° across the band.`,
    'Make it on the same sheet, in the same run, as the design. Fit the same connectors the same way on every line, measure each line as a two-port over the band with the same analyser settings, and save .s2p files; then open the Laminate tab (or run stripwright coupon).',
    'Test equipment: stay within the analyser\'s input power and DC limits, use ESD precautions and a torque wrench, keep connectors clean, and follow the instrument\'s manual and local rules.',
  ].join('\n');
  return { design, plan };
}

/**
 * The coupon for an existing design (its laminate and band unless given), as what `selection.paste` takes: the
 * clipboard text of the coupon's nodes and segments (its own board outline is left out: the design keeps its
 * board) and an offset that puts it below everything already drawn. Running that one command adds it as one
 * undo step in the app and in the CLI alike.
 */
export function couponForDesign(doc: DesignDoc, opts: Partial<CouponOptions> = {}): { clipboard: string; offset: Vec2; plan: CouponPlan; design: DesignDoc } {
  const { design, plan } = laminateCoupon({ ...opts, substrate: opts.substrate ?? doc.substrate, band: opts.band ?? doc.frequency.band });
  const pts: Vec2[] = [...doc.nodes.map((n) => n.at), ...(doc.board?.outline ?? []), ...doc.areas.flatMap((a) => a.polygon)];
  const ring = design.board!.outline;
  const cTop = Math.max(...ring.map((p) => p.y));
  let offset: Vec2 = { x: 0, y: 0 };
  if (pts.length > 0) {
    const minY = Math.min(...pts.map((p) => p.y));
    const midX = (Math.min(...pts.map((p) => p.x)) + Math.max(...pts.map((p) => p.x))) / 2;
    // 10 mm of clear board between the design and the coupon (room to cut them apart; common practice).
    offset = { x: Math.round(midX * 1e6) / 1e6, y: Math.round((minY - 10e-3 - cTop) * 1e6) / 1e6 };
  }
  const clipboard = copySelection(design, [...design.nodes.map((n) => n.id), ...design.segments.map((s) => s.id)]);
  return { clipboard, offset, plan, design };
}
