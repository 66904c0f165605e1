/**
 * The design report: one call from a design to a printable PDF — the board at 1:1 or fitted with a scale bar, the
 * laminate and process, the piece table, the path ledger, the shop-check findings, the response plots and the Smith
 * chart, the models used with their sources and validity, what is not modelled, and the cautions.
 *
 * The app (worker job `report`) and `stripwright report` both call `designReport`. The core stays pure: the font's
 * bytes are passed in by the face (DejaVu Sans from npm `dejavu-fonts-ttf`, Bitstream Vera licence), and the polygon
 * engine must have been initialised (`await initPolygons()`) for the board and the shop check.
 */
import type { DesignDoc } from '../../design/types.ts';
import { asMadeOf } from '../../design/as-made-default.ts';
import { formatQuantity } from '../../units/index.ts';
import { sizeDesign, designPaths, checkBoard, type SizedDesign, type PathReport } from '../../layout/index.ts';
import type { Finding } from '../../layout/checks.ts';
import { netlistFromSized, sweepNetwork, bandSweep, designHash, magnitudeDb, phaseDeg, smith, wrap180, type NetworkResponse } from '../../network/index.ts';
import { InputError } from '../../util/errors.ts';
import { GREY, TRACE_COLOURS, text, type DrawItem, type Rgb } from './drawing.ts';
import { Flow, PAGE } from './flow.ts';
import { frequencyPlot, smithChart, valueRange, type PlotBox, type PlotTrace } from './plot.ts';
import { drawBoard } from './board.ts';
import { openPdf, writePdf } from './pdf.ts';
import { lineModelSources, NOT_MODELLED, CAUTIONS } from './sources.ts';

export interface ReportOptions {
  /** A TrueType font covering Ω, ε, Γ, ° (the faces pass DejaVu Sans). */
  font: Uint8Array;
  /** Who wrote it, e.g. 'stripwright 0.1.0' (in the footer and the metadata). */
  app: string;
  /** Frequencies of the response plots (default 401). */
  points?: number;
}

/** Where each plot landed, so a test can read a rendered page back against the values. */
export interface PlacedPlot {
  name: 'magnitude' | 'phase';
  /** 0-based page index. */
  page: number;
  area: PlotBox;
  xRange: [number, number];
  yRange: [number, number];
  traces: { label: string; colour: Rgb; i: number; j: number }[];
}

export interface DesignReport {
  pdf: Uint8Array;
  pages: number;
  /** The design's hash as written in the metadata. */
  hash: string;
  /** Board drawing scale (1 = full size), or null when the board could not be built. */
  boardScale: number | null;
  plots: PlacedPlot[];
  /** The response the plots show (for comparison with the app's figures). */
  response: NetworkResponse | null;
}

const mm = (m: number) => formatQuantity(m, 'length', { unit: 'mm', digits: 4 });
const fq = (f: number) => formatQuantity(f, 'frequency', { digits: 5 });
const num = (v: number, d: number) => (Math.abs(v) < 0.5 * 10 ** -d ? 0 : v).toFixed(d).replace('-', '−');

export async function designReport(doc: DesignDoc, opts: ReportOptions): Promise<DesignReport> {
  if (!(opts.font instanceof Uint8Array) || opts.font.length < 12) throw new InputError('out-of-range', 'font', 'the bytes of a TrueType font', `${opts.font?.length ?? 0} bytes`, 'pass DejaVuSans.ttf');
  const hash = designHash(doc);
  const { doc: pdf, font, measure } = await openPdf(opts.font);
  const flow = new Flow(measure, `${doc.name} · ${opts.app} · design ${hash}`);
  const sized = sizeDesign(doc);
  const portName = (id: string) => doc.nodes.find((n) => n.id === id)?.label || id;

  // ---- page 1: title, board, laminate and process
  flow.heading(`Design report: ${doc.name}`, 16);
  flow.paragraph(`f0 ${fq(doc.frequency.f0)}, band ${fq(doc.frequency.band.start)} – ${fq(doc.frequency.band.stop)}. Written by ${opts.app}; design hash ${hash}. The same design gives the same file.`, 8.5, GREY);
  if (doc.notes) flow.paragraph(doc.notes, 8.5);
  let boardScale: number | null = null;
  let findings: Finding[] = [];
  if (sized.problems.length) {
    flow.heading('Sizing problems', 11);
    for (const p of sized.problems) flow.bullet(p.message);
    findings = [];
  } else {
    const checked = checkBoard(sized);
    findings = checked.findings;
    if (checked.geometry) {
      flow.heading('Board', 11);
      const g = checked.geometry;
      const room = Math.min(flow.remaining - 80, 190);
      const drawn = drawBoard(g, flow.left, 0, flow.width, room);
      boardScale = drawn.scale;
      flow.block(drawn.height + 4, (x, y, w) => drawBoard(g, x, y, w, room).items);
    }
  }
  flow.heading('Laminate and process', 11);
  flow.table([{ title: 'quantity', share: 2 }, { title: 'value', share: 3 }], laminateRows(doc));

  // ---- pieces, paths, findings
  flow.heading('Pieces (at f0)', 11);
  flow.table([
    { title: 'piece', share: 1.3 }, { title: 'kind', share: 1 }, { title: 'Z0 Ω', share: 0.8, align: 'end' }, { title: 'width mm', share: 0.9, align: 'end' },
    { title: 'length mm', share: 0.9, align: 'end' }, { title: 'electrical °', share: 0.9, align: 'end' }, { title: 'corrections', share: 4 },
  ], sized.pieces.map((p) => [p.label || p.id, p.kind, num(p.z0, 2), num(p.width * 1000, 4), num(p.length * 1000, 4), num(p.effectiveDeg, 2), corrections(p)]), 7);
  const paths = sized.problems.length ? [] : designPaths(sized);
  flow.heading('Path ledger (at f0)', 11);
  if (!paths.length) flow.paragraph('No paths between ports.');
  for (const g of paths) pathTable(flow, g, portName);
  flow.heading('Shop check', 11);
  if (!findings.length) flow.paragraph(sized.problems.length ? 'Not run: the design cannot be sized as drawn.' : 'No findings: the copper can be made with the process given.');
  else flow.table([{ title: 'severity', share: 1 }, { title: 'finding', share: 4 }, { title: 'what to change', share: 3 }], findings.map((f) => [f.severity, f.message, f.fix]), 7);

  // ---- response
  const plots: PlacedPlot[] = [];
  let response: NetworkResponse | null = null;
  if (!sized.problems.length) {
    const net = netlistFromSized(sized, sized.lineOptions ? { line: sized.lineOptions } : {});
    response = await sweepNetwork(net, bandSweep(doc.frequency.band, doc.frequency.f0, opts.points ?? 401));
    responsePages(flow, response, net.input, doc, portName, plots);
  }

  // ---- models, limits, cautions
  flow.heading('Models used', 11);
  flow.table([{ title: 'for', share: 2 }, { title: 'published source', share: 4 }, { title: 'validity', share: 3 }], [
    ...lineModelSources(doc).map((m) => [m.what, m.source, m.validity]),
    ...correctionSources(sized).map((c) => [c.what, c.source, c.validity]),
  ], 7);
  flow.heading('Not modelled', 11);
  for (const s of NOT_MODELLED) flow.bullet(s);
  flow.heading('Cautions', 11);
  for (const s of CAUTIONS) flow.bullet(s);

  const bytes = await writePdf(pdf, font, flow.pages, {
    title: `${doc.name} — design report`, subject: `design hash ${hash}`, keywords: [`design-hash:${hash}`, `app:${opts.app}`], producer: opts.app, creator: opts.app,
  });
  return { pdf: bytes, pages: flow.pages.length, hash, boardScale, plots, response };
}

function laminateRows(doc: DesignDoc): string[][] {
  const s = doc.substrate, p = doc.process;
  const rows: string[][] = [
    ['laminate', s.preset ?? 'custom'], ['εr', `${s.er}${s.dielectricModel?.kind === 'wideband-debye' ? ` at ${fq(s.dielectricModel.fMeasure)} (wideband Debye)` : ''}`],
    ['height h', mm(s.h)], ['copper t', mm(s.t)], ['tan δ', String(s.tanDelta)],
    ['conductivity', `${formatQuantity(s.sigma, 'conductivity', { digits: 4 })}`], ['rms roughness', mm(s.roughness)],
    ['process', p.kind],
  ];
  if (p.kind === 'end-mill') rows.push(['tool diameter', mm(p.toolDiameter)], ['depth', mm(p.depth)]);
  else if (p.kind === 'v-bit') rows.push(['tip width', mm(p.tipWidth)], ['angle', `${p.angleDeg}°`], ['depth', mm(p.depth)]);
  else rows.push(['edge bias', mm(p.edgeBias)], ['smallest feature', mm(p.minFeature)]);
  rows.push(['junctions', doc.junctions ?? 'modelled'], ['sizing', asMadeOf(doc).sizing]);
  return rows;
}

function corrections(p: SizedDesign['pieces'][number]): string {
  const c = p.compensations.map((c) => `${c.model} at ${c.node}: ${c.amount_m >= 0 ? 'shortened' : 'lengthened'} ${mm(Math.abs(c.amount_m))}${c.applied ? '' : ' (advisory, not applied)'}`);
  return c.length ? c.join('; ') : '—';
}

function correctionSources(sized: SizedDesign): { what: string; source: string; validity: string }[] {
  const seen = new Map<string, { what: string; source: string; validity: string }>();
  for (const p of sized.pieces) for (const c of p.compensations) {
    if (seen.has(c.model + c.source)) continue;
    seen.set(c.model + c.source, { what: `${c.model} correction`, source: c.source, validity: c.junction ? junctionValidity(c.junction) : 'see the piece notes' });
  }
  return [...seen.values()];
}

function junctionValidity(j: unknown): string {
  const v = (j as { validity?: unknown }).validity;
  return typeof v === 'string' ? v : 'as published';
}

function pathTable(flow: Flow, g: PathReport, portName: (id: string) => string): void {
  flow.paragraph(`${g.name || 'Paths'} from ${portName(g.from)}${g.matched ? `, matched within ±${g.toleranceDeg}° (spread ${num(g.spreadDeg, 2)}°)` : ' (reported only)'}`, 8);
  flow.table([
    { title: 'to', share: 1.2 }, { title: 'length mm', share: 1, align: 'end' }, { title: 'electrical °', share: 1, align: 'end' },
    { title: 'Δφ to first °', share: 1, align: 'end' }, { title: 'wanted °', share: 0.9, align: 'end' }, { title: 'loss dB', share: 0.9, align: 'end' }, { title: 'within', share: 0.8 },
  ], g.paths.map((e) => [portName(e.to), num(e.physicalLength * 1000, 3), num(e.degAtF0, 2), num(e.phaseDiffDeg, 2), num(e.targetDeg, 1), num(e.lossDb, 3), e.withinTolerance ? 'yes' : 'NO']), 7);
}

function responsePages(flow: Flow, r: NetworkResponse, input: number, doc: DesignDoc, portName: (id: string) => string, plots: PlacedPlot[]): void {
  const P = r.ports.length;
  const pick: { i: number; j: number }[] = [{ i: input, j: input }];
  for (let i = 0; i < P && pick.length < 6; i++) if (i !== input) pick.push({ i, j: input });
  if (P === 3) { const o = [0, 1, 2].filter((k) => k !== input); pick.push({ i: o[1]!, j: o[0]! }); }
  const label = (t: { i: number; j: number }) => `S${t.i + 1}${t.j + 1} ${portName(r.ports[t.i]!.name)} ← ${portName(r.ports[t.j]!.name)}`;
  const magTraces: (PlotTrace & { i: number; j: number })[] = pick.slice(0, TRACE_COLOURS.length).map((t, k) => ({
    ...t, label: label(t), values: magnitudeDb(r, t.i, t.j), colour: TRACE_COLOURS[k]!,
  }));
  // Coincident traces (a split's equal outputs) stay visible: the later one is dashed.
  magTraces.forEach((t, k) => { if (magTraces.slice(0, k).some((u) => sameSeries(u.values, t.values))) t.dash = [1.5, 1]; });
  const marks = [{ f: doc.frequency.f0, label: 'f0' }, { f: doc.frequency.band.start, label: '' }, { f: doc.frequency.band.stop, label: '' }];
  flow.newPage();
  flow.heading('Response (simulated)', 11);
  flow.paragraph(`${r.freqs.length} frequencies from ${fq(r.freqs[0]!)} to ${fq(r.freqs[r.freqs.length - 1]!)}; ports ${r.ports.map((p, k) => `${k + 1} = ${portName(p.name)} (${p.zRef} Ω)`).join(', ')}. Power-wave S-parameters. Dashed lines: f0 and the band edges; a dashed trace lies on an earlier one.`, 8, GREY);
  const h = 78;
  const place = (name: PlacedPlot['name'], traces: typeof magTraces, yLabel: string, yRange: [number, number], yStep?: number) => {
    let placed: ReturnType<typeof frequencyPlot> | null = null;
    const page = () => flow.pages.length - 1;
    flow.block(h, (x, y, w) => { placed = frequencyPlot({ x, y, w, h: h - 4 }, r.freqs, traces, { yLabel, yRange, marks, ...(yStep ? { yStep } : {}) }); return placed.items; });
    const p = placed as unknown as ReturnType<typeof frequencyPlot>;
    plots.push({ name, page: page(), area: p.area, xRange: p.xRange, yRange: p.yRange, traces: traces.map((t) => ({ label: t.label, colour: t.colour, i: t.i, j: t.j })) });
  };
  place('magnitude', magTraces, '|S| dB', valueRange(magTraces, 10, -80));
  const phTraces = magTraces.map((t) => ({ ...t, values: phaseDeg(r, t.i, t.j).map(wrap180) }));
  place('phase', phTraces, 'phase ° (wrapped to ±180°)', [-180, 180], 60);
  flow.block(80, (x, y, w): DrawItem[] => {
    const traces = Array.from({ length: Math.min(P, TRACE_COLOURS.length) }, (_, i) => {
      const s = smith(r, i);
      return { label: `S${i + 1}${i + 1} at ${portName(r.ports[i]!.name)}`, re: s.re, im: s.im, colour: TRACE_COLOURS[i]! };
    });
    return [text(x, y + 3, 8, 'Smith chart: reflection Γ at each port, normalised to its reference', 'start', GREY), ...smithChart(x + w / 2 - 25, y + 36, 30, traces)];
  });
  void PAGE;
}

function sameSeries(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  for (let k = 0; k < a.length; k++) if (Math.abs(a[k]! - b[k]!) > 0.05) return false;
  return true;
}
