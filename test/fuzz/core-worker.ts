/**
 * The worker thread of the core fuzz runs: takes one design text at a time and runs it through the loader alone
 * ('load') or through the whole pipeline as the CLI and the app do ('pipeline': load → size → paths → checks →
 * build report → every export → a sweep of a few points). Replies with what happened; the main thread's watchdog
 * stops this thread when one case runs past its time.
 */
import { parentPort } from 'node:worker_threads';
import {
  InputError, bandSweep, checkBoard, cutWidth, designPaths, initPolygons, netlistFromSized, parseDesign, sizeDesign, sweepNetwork,
  toDxf, toDxfR12, toExcellon, toGerber, toMask, toSvg, withEtchBias, withIsolation, type BoardGeometry, type PathReport,
} from '../../core/index.ts';
import { buildReport } from '../../cli/commands/build.ts';
import { INTERNAL_WORDING, LIBRARY_WORDING, NON_FINITE_TEXT, nonFinite } from './core-checks.ts';

export interface FuzzCase { id: number; kind: 'load' | 'pipeline'; text: string }
export interface FuzzOutcome {
  id: number;
  /** The last stage reached: 'refused' (loader), or the pipeline stage that refused it, or 'done'. */
  stage: string;
  /** A non-InputError exception, with its stage. */
  crash?: string;
  nonFinite: string[];
  wording: string[];
  /** User-facing messages checked. */
  messages: number;
}

const port = parentPort!;
await initPolygons();

function message(o: FuzzOutcome, text: string): void {
  o.messages++;
  if (LIBRARY_WORDING.test(text) || INTERNAL_WORDING.test(text)) o.wording.push(text.slice(0, 300));
}

/** A loader refusal names the field, what was expected, what was found and the fix (three known sentences aside). */
const ISSUE_SHAPE = /^[^\s:][^:]*: expected .+, found .+, fix: .+$/s;
function refusal(o: FuzzOutcome, text: string): void {
  message(o, text);
  if (!ISSUE_SHAPE.test(text)) o.wording.push(`not worded as field, expected, found, fix: ${text.slice(0, 300)}`);
}

async function pipeline(o: FuzzOutcome, text: string): Promise<void> {
  o.stage = 'load';
  const parsed = parseDesign(text);
  if (!parsed.ok) {
    for (const e of parsed.errors) refusal(o, e.message);
    o.stage = 'refused';
    return;
  }
  for (const w of parsed.warnings) message(o, w.message);
  const doc = parsed.doc;
  o.stage = 'size';
  const sized = sizeDesign(doc);
  for (const p of sized.problems) message(o, p.message);
  for (const p of sized.pieces) if (Number.isFinite(p.width)) o.nonFinite.push(...nonFinite({ length: p.length, span: p.span, deg: p.deg, z0: p.z0 }, `pieces.${p.id}`));
  o.stage = 'paths';
  let paths: PathReport[] = [];
  if (!sized.problems.length) paths = designPaths(sized);
  o.stage = 'checks';
  const { geometry, findings } = checkBoard(sized, { paths });
  for (const f of findings) { message(o, f.message); if (NON_FINITE_TEXT.test(f.message)) o.nonFinite.push(`finding: ${f.message.slice(0, 200)}`); }
  o.nonFinite.push(...nonFinite(findings, 'findings'));
  o.stage = 'report';
  // The CLI's JSON report: null stands for a piece that could not be sized (documented), nothing else may be missing.
  o.nonFinite.push(...nonFinite(buildReport(sized, paths, findings), 'report', { allowNull: true }));
  if (geometry) {
    o.stage = 'export';
    o.nonFinite.push(...nonFinite(geometry, 'geometry'));
    exportAll(o, geometry, doc.process);
  }
  o.stage = 'sweep';
  if (!sized.problems.length) {
    const net = netlistFromSized(sized);
    const r = await sweepNetwork(net, bandSweep(doc.frequency.band, doc.frequency.f0, 3));
    o.nonFinite.push(...nonFinite({ freqs: r.freqs, s: r.s }, 'response'));
    for (const w of [...net.warnings, ...r.warnings]) message(o, w.message);
  }
  o.stage = 'done';
}

function exportAll(o: FuzzOutcome, g: BoardGeometry, process: Parameters<typeof cutWidth>[0]): void {
  let eg = g as Parameters<typeof toSvg>[0];
  if (process.kind === 'etch' && process.edgeBias !== 0) {
    o.stage = 'etch-bias';
    const b = withEtchBias(eg, process.edgeBias);
    eg = b.geometry;
    for (const w of b.warnings) message(o, w.message);
  }
  if (process.kind === 'end-mill') {
    o.stage = 'isolation';
    const m = withIsolation(eg, cutWidth(process));
    eg = m.geometry;
    for (const w of m.warnings) message(o, w.message);
  }
  o.stage = 'export';
  const mask = toMask(eg, {});
  for (const w of mask.warnings) message(o, w.message);
  const gb = toGerber(eg, { application: 'Stripwright', version: 'fuzz' });
  const ex = toExcellon(eg, { application: 'Stripwright', version: 'fuzz' });
  const texts: [string, string][] = [['dxf', toDxf(eg)], ['dxf-r12', toDxfR12(eg)], ['svg', toSvg(eg)], ['mask', mask.svg],
    ['gerber copper', gb.copper], ['gerber bottom', gb.bottom], ['gerber profile', gb.profile], ['drill', (ex.plated ?? '') + (ex.nonPlated ?? '')]];
  for (const [name, t] of texts) {
    const m = NON_FINITE_TEXT.exec(t);
    if (m) o.nonFinite.push(`${name}: "${t.slice(Math.max(0, m.index - 40), m.index + 20)}"`);
  }
}

port.on('message', async (c: FuzzCase) => {
  const o: FuzzOutcome = { id: c.id, stage: 'start', nonFinite: [], wording: [], messages: 0 };
  try {
    if (c.kind === 'load') {
      const r = parseDesign(c.text);
      if (r.ok) for (const w of r.warnings) message(o, w.message);
      else for (const e of r.errors) refusal(o, e.message);
      o.stage = r.ok ? 'loaded' : 'refused';
    } else {
      await pipeline(o, c.text);
    }
  } catch (e) {
    if (e instanceof InputError) message(o, e.message);
    else o.crash = `${o.stage}: ${e instanceof Error ? `${e.name}: ${e.message}\n${e.stack ?? ''}`.slice(0, 1500) : String(e)}`;
  }
  port.postMessage(o);
});
port.postMessage({ ready: true });
