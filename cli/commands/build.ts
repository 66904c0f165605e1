/**
 * `stripwright build FILE [--json]`: sizes a design, lays out its copper, traces its paths and runs the fabrication
 * checks. Prints the sized pieces (with compensations), the paths report and the findings. Exit 0 when the design
 * can be built as drawn, 1 with the errors listed when not (or the file is not a valid design), 2 for a bad command
 * line.
 */
import { parseArgs } from 'node:util';
import { resolve } from 'node:path';
import { InputError, parseDesign, namer, initPolygons, DesignPipeline, solveNetwork, designSweepSettings, evaluateTargets, targetFrequencies, targetText, proximityLimitFor, FIGURE_UNIT_SUFFIX, pairNetworkFigures } from '../../core/index.ts';
import type { Warning, PathReport, Finding, JunctionInfo, SizedDesign, JunctionChoice, TargetEvaluation } from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { DESIGN_TEXT, readInputText } from '../files.ts';
import { resultJson } from '../json.ts';
import { degreesOption, quantityOption } from '../numbers.ts';

const usage = `Usage: stripwright build FILE [options]

Sizes the design FILE (a Stripwright design, .json) at its design frequency, lays out the copper, traces the paths
between its ports (or its phase groups) and checks it against its fabrication process.

Options:
  --json              print one JSON object instead of tables
  --tolerance DEG     phase tolerance for matched paths, e.g. 5 or 5deg (default: each phase group's own, else 5°)
  --loss-limit DB     loss budget per path, e.g. 1 or 1dB (default 1 dB)
  --proximity-limit L runs closer than this get a coupling estimate: 2.5h (substrate heights) or 1mm (overrides the design's own limit, default 3h; 0 = off)
  --from PORT --to PORT[,PORT…]
                      report these paths (meant to match in phase) instead of the design's phase groups;
                      a port is named by its label or its id
  --junctions modelled|ideal
                      size tees and width steps with their published models, or as ideal junctions joined at
                      the centre, for comparison (default: the design's own setting, else modelled)

Exit status: 0 the design can be built as drawn; 1 it cannot (errors listed) or FILE is not a valid design;
2 a bad command line.

Examples:
  stripwright build assets/examples/wilkinson-2g45.json
  stripwright build feed.json --json --tolerance 2`;

/** One pipeline per process, as export keeps one: the stages of a design are sized once. */
const pipeline = new DesignPipeline();

const mm = (m: number, d = 3) => (m * 1e3).toFixed(d);

export interface BuildReport {
  ok: boolean;
  design: string;
  f0_hz: number;
  pieces: {
    id: string; kind: string; a: string; b: string; z0_ohm?: number; width_m?: number; width_b_m?: number;
    length_m: number; span_m: number; deg_at_f0: number; drawn_deg: number;
    compensations: { model: string; source: string; amount_m: number; applied: boolean; node: string; note: string; junction?: JunctionInfo }[];
    /** A coupled pair (on its first strip): the runs and mode figures the sweep uses (band start, f0, band stop). */
    pair?: PairJson;
  }[];
  /** The junction choice the design was sized with. */
  junctions: JunctionChoice;
  /** Placed nodes with their discontinuity data (bends, ends, vias, tees). */
  nodes: {
    id: string; kind: string; x_m: number; y_m: number;
    bend?: { style: string; turn_deg: number; miter_fraction?: number; miter_leg_m?: number; arc_radius_m?: number; arc_tangent_m?: number };
    open_dl_m?: number; open_c_f?: number;
    via?: { count: number; drill_m: number; l_h: number; x_ohm: number; dl_m: number };
    tee?: { main: string[]; branch: string; d1_m: [number, number]; d2_m: number; n2: number; modelled: boolean };
    step?: { wide: string; narrow: string; cs_f: number; ls_h: number; c_valid: boolean; l_valid: boolean; modelled: boolean };
  }[];
  paths: PathReport[];
  findings: Finding[];
  /** The design's targets on the nominal board (absent when it has none). */
  targets?: TargetEvaluation;
  warnings: Warning[];
}

export function buildReport(sized: SizedDesign, paths: PathReport[], findings: Finding[]): BuildReport {
  const warnings: Warning[] = [...sized.warnings];
  for (const p of sized.pieces) warnings.push(...p.warnings);
  for (const n of sized.nodes) warnings.push(...n.warnings);
  return {
    ok: !findings.some((f) => f.severity === 'error'),
    design: sized.name,
    f0_hz: sized.f0,
    junctions: sized.junctions,
    pieces: sized.pieces.map((p) => ({
      id: p.id, kind: p.kind, a: p.a, b: p.b,
      // A part or a data block has no line impedance or width: left out, never null.
      ...(Number.isFinite(p.z0) ? { z0_ohm: p.z0 } : {}), ...(Number.isFinite(p.width) ? { width_m: p.width } : {}), ...(p.widthB !== undefined ? { width_b_m: p.widthB } : {}),
      length_m: p.length, span_m: p.span, deg_at_f0: p.effectiveDeg, drawn_deg: p.deg,
      compensations: p.compensations.map((c) => ({ ...c })),
      ...pairJson(sized, p),
    })),
    nodes: sized.nodes.filter((n) => Number.isFinite(n.pos.x)).map((n) => ({
      id: n.id, kind: n.kind, x_m: n.pos.x, y_m: n.pos.y,
      ...(n.bend ? { bend: {
        style: n.bend.style.style, turn_deg: (n.bend.turn * 180) / Math.PI,
        ...(n.bend.miter ? { miter_fraction: n.bend.miter.fraction, miter_leg_m: n.bend.miter.leg } : {}),
        ...(n.bend.arc ? { arc_radius_m: n.bend.arc.radius, arc_tangent_m: n.bend.arc.tangent } : {}),
      } } : {}),
      ...(n.open ? { open_dl_m: n.open.dl, open_c_f: n.open.capacitance } : {}),
      ...(n.via ? { via: { count: n.via.count, drill_m: n.via.drill, l_h: n.via.L, x_ohm: n.via.X, dl_m: n.via.dlEquivalent } } : {}),
      ...(n.tee ? { tee: { main: [...n.tee.main], branch: n.tee.branch, d1_m: [n.tee.atF0.d1[0], n.tee.atF0.d1[1]] as [number, number], d2_m: n.tee.atF0.d2, n2: n.tee.atF0.n2, modelled: n.tee.modelled } } : {}),
      ...(n.step ? { step: { wide: n.step.wide, narrow: n.step.narrow, cs_f: n.step.Cs, ls_h: n.step.Ls, c_valid: n.step.cValid, l_valid: n.step.lValid, modelled: n.step.modelled } } : {}),
    })),
    paths, findings, warnings,
  };
}

type ModeJson = { z0_ohm: number; eps_eff: number; alpha_c_np_m: number; alpha_d_np_m: number };
interface PairJson {
  partner: string; width_m: number; gap_m: number; overlap_m: number; alone_m: { a: number; b: number; c: number; d: number };
  modes: { f_hz: number; even: ModeJson; odd: ModeJson }[];
}

/** A coupled pair's network figures in the report's units (core pairNetworkFigures), on its first strip only. */
function pairJson(sized: SizedDesign, p: SizedDesign['pieces'][number]): { pair?: PairJson } {
  const r = pairNetworkFigures(sized, p);
  if (!r) return {};
  const mode = (m: { z0: number; epsEff: number; alphaC: number; alphaD: number }): ModeJson => ({ z0_ohm: m.z0, eps_eff: m.epsEff, alpha_c_np_m: m.alphaC, alpha_d_np_m: m.alphaD });
  return { pair: { partner: r.partner, width_m: r.width, gap_m: r.gap, overlap_m: r.overlap, alone_m: r.alone, modes: r.modes.map((x) => ({ f_hz: x.f, even: mode(x.even), odd: mode(x.odd) })) } };
}

function table(rows: string[][]): string[] {
  const w = rows[0]!.map((_, i) => Math.max(...rows.map((r) => (r[i] ?? '').length)));
  return rows.map((r) => r.map((c, i) => (i === r.length - 1 ? c : c.padEnd(w[i]!))).join('  ').trimEnd());
}

/** The report as tables; `name` gives what people call a record (its label, else its id: core's namer). */
function text(rep: BuildReport, name: (id: string) => string = (id) => id): string[] {
  const out: string[] = [];
  out.push(`${rep.design} — sized at ${(rep.f0_hz / 1e9).toFixed(4)} GHz`, '');
  const rows: string[][] = [['piece', 'kind', 'Z0 Ω', 'W mm', 'L mm', 'deg', 'compensations (mm; * applied)']];
  for (const p of rep.pieces) {
    const comps = p.compensations.filter((c) => !c.junction && (c.amount_m !== 0 || !c.applied))
      .map((c) => `${c.model}${c.applied ? '*' : ''} ${mm(c.amount_m)}@${name(c.node)}`).join(', ');
    const part = p.kind === 'lumped' || p.kind === 'sparams';
    rows.push([name(p.id), p.kind, p.z0_ohm === undefined || part ? '—' : p.z0_ohm.toFixed(2),
      p.width_m === undefined ? '—' : p.width_b_m !== undefined ? `${mm(p.width_m)}→${mm(p.width_b_m)}` : mm(p.width_m),
      part ? `${mm(p.span_m)} span` : mm(p.length_m), part ? '—' : p.deg_at_f0.toFixed(1), comps]);
  }
  out.push(...table(rows));
  out.push(...junctionTable(rep, name));
  const corners = rep.nodes.filter((n) => n.bend || n.open_dl_m !== undefined || n.via);
  if (corners.length) {
    out.push('', 'Corners and ends:');
    const cr: string[][] = [['node', 'what', 'detail']];
    for (const n of corners) {
      if (n.bend) {
        const b = n.bend;
        const d = b.miter_fraction !== undefined ? `miter ${(b.miter_fraction * 100).toFixed(1)} %, legs ${mm(b.miter_leg_m!)} mm`
          : b.arc_radius_m !== undefined ? `arc R ${mm(b.arc_radius_m)} mm, tangent ${mm(b.arc_tangent_m!)} mm` : 'square corner';
        cr.push([name(n.id), `${b.turn_deg.toFixed(1)}° bend`, d]);
      }
      if (n.open_dl_m !== undefined) cr.push([name(n.id), 'open end', `Δl ${mm(n.open_dl_m)} mm, C ${(n.open_c_f! * 1e15).toFixed(1)} fF`]);
      if (n.via) cr.push([name(n.id), `${n.via.count} via(s) ⌀${mm(n.via.drill_m)} mm`, `L ${(n.via.l_h * 1e12).toFixed(1)} pH, X ${n.via.x_ohm.toFixed(2)} Ω at f0 ≙ ${mm(n.via.dl_m)} mm of line`]);
    }
    out.push(...table(cr));
  }
  for (const r of rep.paths) {
    out.push('', `Paths: ${r.name} (from ${r.fromName}${r.matched ? `, tolerance ±${r.toleranceDeg}°` : ''})`);
    const pr: string[][] = [['to', 'length mm', 'deg @f0', 'Δ deg', 'Δ band', 'delay ps', 'loss dB', 'bends', 'tees', 'S_er', 'S_h', 'S_W', '']];
    for (const e of r.paths) {
      pr.push([e.toName, mm(e.physicalLength, 2), e.degAtF0.toFixed(1), e.phaseDiffDeg.toFixed(1), `${e.phaseDiffBandDeg[0].toFixed(1)}/${e.phaseDiffBandDeg[1].toFixed(1)}`,
        (e.delay * 1e12).toFixed(1), e.lossDb.toFixed(2), String(e.bends), String(e.junctions),
        e.sensitivity.er.toFixed(3), e.sensitivity.h.toFixed(3), e.sensitivity.W.toFixed(3), !r.matched ? '' : e.withinTolerance ? 'ok' : 'OUT']);
    }
    out.push(...table(pr));
    out.push(`spread ${r.spreadDeg.toFixed(2)}°`);
  }
  if (rep.targets) {
    out.push('', 'Targets (the board as drawn, nominal laminate):');
    for (const t of rep.targets.results) {
      const u = FIGURE_UNIT_SUFFIX[t.unit];
      out.push(`  ${t.pass ? 'PASS' : 'FAIL'}  ${t.name}: worst ${t.worst.value.toFixed(2)}${u} at ${(t.worst.freq / 1e9).toFixed(4)} GHz (limit ${t.limitText}, margin ${t.margin.toFixed(2)}${u})`);
    }
  }
  out.push('');
  if (!rep.findings.length) out.push('Findings: none');
  else {
    out.push('Findings:');
    for (const f of rep.findings) out.push(`  ${f.severity.toUpperCase().padEnd(7)} ${f.code}: ${f.message}`, `          → ${f.fix}`);
  }
  const notes = rep.warnings.filter((w) => w.severity !== 'info');
  if (notes.length) {
    out.push('', 'Model warnings:');
    for (const w of notes) out.push(`  ${w.subjects?.length ? `[${w.subjects.join(', ')}] ` : ''}${w.message}`);
  }
  out.push('', rep.ok ? 'Result: can be built as drawn.' : `Result: ${rep.findings.filter((f) => f.severity === 'error').length} error(s) — fix them before building.`);
  return out;
}

/** Every junction as each piece meets it: model, whether it is in the sweep, validity and what it leaves at f0. */
function junctionTable(rep: BuildReport, name: (id: string) => string): string[] {
  const rows: string[][] = [['piece', 'at', 'junction', 'role', 'shift mm', 'in sweep', 'residual at f0', 'validity']];
  for (const p of rep.pieces) {
    for (const c of p.compensations) {
      const j = c.junction;
      if (!j) continue;
      const res = j.residual ? `${j.residual.phaseDeg.toFixed(2)}°, ${j.residual.reflectionDb <= -399 ? '—' : `${j.residual.reflectionDb.toFixed(1)} dB`}` : 'not estimated';
      rows.push([name(p.id), name(c.node), `${j.kind} (${c.source.split(',')[0]})`, j.role, c.model === 'tee-planes' ? mm(-c.amount_m) : '—', j.modelled ? 'yes' : 'no (ideal)', res, `${j.inRange ? '' : 'OUT: '}${j.validity}`]);
    }
  }
  if (rows.length === 1) return [];
  return ['', `Junctions (${rep.junctions}; shift = reference plane from the junction centre, residual = phase and reflection the lengths leave):`, ...table(rows)];
}

export const buildCommand: CliCommand = {
  name: 'build',
  summary: 'Size a design, lay out its copper, report paths and phase, and check it for fabrication',
  usage,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({
      args: argv, allowPositionals: true, strict: true,
      options: { json: { type: 'boolean' }, junctions: { type: 'string' }, tolerance: { type: 'string' }, 'loss-limit': { type: 'string' }, 'proximity-limit': { type: 'string' }, from: { type: 'string' }, to: { type: 'string' } },
    });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the design FILE to build' : `give one design FILE, got ${positionals.length}`);
    const tolerance = degreesOption('tolerance', values.tolerance, { min: 0, max: 180, minExclusive: true });
    const lossLimit = quantityOption('loss-limit', values['loss-limit'], 'db', { min: 0, max: 1000, minExclusive: true });
    const junctions = values.junctions?.toLowerCase();
    if (junctions !== undefined && junctions !== 'modelled' && junctions !== 'ideal') throw new UsageError(`--junctions must be modelled or ideal, not '${values.junctions}'`);
    if ((values.from === undefined) !== (values.to === undefined)) throw new UsageError('give --from and --to together, e.g. --from in --to out1,out2');
    const toList = values.to?.split(',').map((x) => x.trim()).filter((x) => x !== '');
    if (toList && toList.length === 0) throw new UsageError('--to needs at least one port id');
    const name = positionals[0]!;
    const read = await readInputText(resolve(io.cwd, name), name, DESIGN_TEXT, 'a design file (.json)');
    if (!read.ok) { io.err(`stripwright build: ${read.message}`); return 1; }
    const text0 = read.text;
    const parsed = parseDesign(text0);
    if (!parsed.ok) {
      if (values.json) io.out(resultJson({ ok: false, design: name, errors: parsed.errors }, 2));
      else { io.err(`stripwright build: ${name} is not a valid design:`); for (const i of parsed.errors) io.err(`  ${i.message}`); }
      return 1;
    }
    try {
      await initPolygons();
      // The core pipeline's stages, the same export uses: build and export cannot disagree on a design.
      // The design's own proximity limit, unless --proximity-limit overrides it (one core reader for both).
      const near = { proximityLimit: proximityLimitFor(parsed.doc, values['proximity-limit'], '--proximity-limit') };
      const { sized, paths, findings } = pipeline.check(parsed.doc, {
        ...(junctions ? { junctions } : {}), ...(tolerance !== undefined ? { toleranceDeg: tolerance } : {}), ...near,
        ...(lossLimit !== undefined ? { lossLimitDb: lossLimit } : {}), ...(values.from !== undefined && toList ? { from: values.from, to: toList } : {}),
      });
      const rep = buildReport(sized, paths, findings);
      rep.warnings.unshift(...parsed.warnings);
      // Targets need the network; a layout with problems has none (its errors are in the findings already).
      const targets = sized.problems.length ? null : nominalTargets(sized);
      if (targets) rep.targets = targets;
      if (values.json) io.out(resultJson(rep, 2));
      else {
        for (const l of text(rep, namer(parsed.doc))) io.out(l);
        if (!rep.ok) io.err(`stripwright build: ${name} cannot be built as drawn (see the errors above)`);
      }
      return rep.ok ? 0 : 1;
    } catch (e) {
      if (e instanceof InputError) {
        if (values.json) io.out(resultJson({ ok: false, design: name, errors: [{ field: e.field, expected: e.expected, got: e.got, message: e.message }] }, 2));
        else io.err(`stripwright build: ${name}: ${e.message}`);
        return 1;
      }
      throw e;
    }
  },
};

/** The design's targets evaluated on its nominal sweep (its own sweep settings, else the band at 201 points; every target band edge added), as the app does. */
function nominalTargets(sized: SizedDesign): TargetEvaluation | null {
  const doc = sized.doc;
  if (!doc.targets?.length) return null;
  const freqs = targetFrequencies(designSweepSettings(doc), doc.targets);
  const ev = evaluateTargets(solveNetwork(pipeline.netlist(doc), freqs), doc);
  const name = namer(doc);
  return { ...ev, results: ev.results.map((r, i) => {
    const plain = targetText(doc.targets[i]!), shown = targetText(doc.targets[i]!, name);
    return { ...r, name: r.name === plain ? shown : `${r.name} (${shown})` };
  }) };
}
