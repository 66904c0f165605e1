/**
 * `stripwright yield DESIGN --samples N --seed S [--json]`: how many boards made from the design, with its tolerances,
 * meet its targets. A thin face over core/yield `runYield` (the same function the app's yield panel runs).
 * Exit 0 with a value, 1 when no value can be produced (not a design, no targets, a draw the models refuse),
 * 2 for a bad command line.
 */
import { parseArgs } from 'node:util';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { InputError, parseDesign, runYield, MAX_SAMPLES, FIGURE_UNIT_SUFFIX, type YieldResult } from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { countOption } from '../numbers.ts';

const USAGE = `Usage: stripwright yield DESIGN [--samples N] [--seed S] [--points N] [--ranking N] [--json]

Makes N boards of DESIGN (a Stripwright design, .json) as drawn, each with the laminate, widths and part values its
tolerances draw, analyses every one in full (line models, nodal solve) and evaluates the design's targets.
Prints the yield of each target and of all together with a 95 % interval, the spread of each target's worst value,
and which tolerances matter most.

Options:
  --samples N    boards to make (default 500; 1 to ${MAX_SAMPLES})
  --seed S       seed of the random numbers, 0 to 4294967295 (default 1); the same seed gives the same result
  --points N     points of the band sweep (default 201; every target band's edges are added)
  --ranking N    boards per tolerance for the one-at-a-time ranking (default 100, 0 skips it)
  --json         one JSON object (everything but the per-board values)

Exit status: 0 a yield was estimated (whatever it is); 1 no value (not a valid design, no targets, or the models
refused a board); 2 a bad command line.

Examples:
  stripwright yield assets/examples/wilkinson-2g45.json --samples 1000 --seed 7
  stripwright yield feed.json --samples 200 --json`;

const whole = (flag: string, v: string | undefined, min: number, max: number, dflt: number): number => countOption(flag, v, min, max) ?? dflt;

const pct = (p: number) => `${(100 * p).toFixed(1)} %`;
const num = (x: number, d = 2) => x.toFixed(d);

function text(r: YieldResult): string[] {
  const out: string[] = [];
  out.push(`${r.design} — ${r.samples} boards, seed ${r.seed}`, `generator: ${r.generator}`, '');
  out.push(`Overall yield: ${pct(r.overall.yield.p)}  (95 % interval ${pct(r.overall.yield.lo)} – ${pct(r.overall.yield.hi)}, ${r.overall.passes} of ${r.samples} boards meet every target)`, '');
  out.push('Targets:');
  for (const t of r.targets) {
    const u = FIGURE_UNIT_SUFFIX[t.unit];
    out.push(`  ${t.name} — ${t.text}`);
    out.push(`    yield ${pct(t.yield.p)} (${pct(t.yield.lo)} – ${pct(t.yield.hi)}); nominal ${num(t.nominal.worst.value)}${u} (${t.nominal.pass ? 'meets' : 'MISSES'} it); made boards: mean ${num(t.stats.mean)}${u}, σ ${num(t.stats.sd, 3)}${u}, 5–95 % ${num(t.stats.p05)} … ${num(t.stats.p95)}${u}`);
  }
  if (r.ranking.entries.length) {
    out.push('', `What matters most (${r.ranking.method}; ${r.ranking.samples} boards each):`);
    for (const e of r.ranking.entries) out.push(`  ${e.quantity.padEnd(11)} ${e.scope.padEnd(6)} ${pct(e.score).padStart(8)}`);
  }
  for (const x of r.ignored) out.push(`note: tolerance ${x.quantity} not used — ${x.why}`);
  for (const w of r.warnings) if (w.severity !== 'info') out.push(`warning: ${w.message}`);
  return out;
}

export const yieldCommand: CliCommand = {
  name: 'yield',
  summary: 'Estimate how many made boards meet the design\'s targets (seeded Monte Carlo over its tolerances)',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({
      args: argv, allowPositionals: true, strict: true,
      options: { samples: { type: 'string' }, seed: { type: 'string' }, points: { type: 'string' }, ranking: { type: 'string' }, json: { type: 'boolean' } },
    });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the DESIGN file' : `give one DESIGN file, got ${positionals.length}`);
    const samples = whole('samples', values.samples, 1, MAX_SAMPLES, 500);
    const seed = whole('seed', values.seed, 0, 0xffffffff, 1);
    const points = whole('points', values.points, 2, 100_001, 201);
    const rankingSamples = whole('ranking', values.ranking, 0, MAX_SAMPLES, 100);
    const name = positionals[0]!;
    let src: string;
    try { src = readFileSync(resolve(io.cwd, name), 'utf8'); } catch (e) {
      io.err(`stripwright yield: cannot read ${name}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`);
      return 1;
    }
    const parsed = parseDesign(src, { complete: true });
    if (!parsed.ok) {
      io.err(`stripwright yield: ${name} is not a valid design:`);
      for (const i of parsed.errors) io.err(`  ${i.message}`);
      return 1;
    }
    try {
      const r = await runYield(parsed.doc, { samples, seed, points, rankingSamples });
      if (values.json) io.out(JSON.stringify({ ...r, targets: r.targets.map(({ values: _v, ...t }) => t) }, null, 2));
      else for (const l of text(r)) io.out(l);
      return 0;
    } catch (e) {
      if (e instanceof InputError) { io.err(`stripwright yield: ${name}: ${e.message}`); return 1; }
      throw e;
    }
  },
};
