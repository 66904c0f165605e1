/**
 * `stripwright tune DESIGN [--goals TARGETS.json] [--vary SEG[+SEG]:QUANTITY:MIN:MAX | BLOCK@PARAM:MIN:MAX ...] [--seed N] --out FILE`:
 * varies lengths, widths or impedances of pieces, or parameters of placed blocks, within their ranges until the goals
 * are met as well as they can be (core/blocks `tuneWithBlocks`, the function behind the app's tuning), and writes the
 * tuned design.
 */
import { parseArgs } from 'node:util';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import * as v from 'valibot';
import { InputError, parseDesign, serializeDesign, tuneWithBlocks, defaultVariables, targetSchema, type TuneGoal, type TuneVariable, type TuneQuantity, type Target } from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { writeOutputFile } from '../files.ts';

const USAGE = `Usage: stripwright tune DESIGN [--goals TARGETS.json] [--vary SEG[+SEG]:QUANTITY:MIN:MAX | BLOCK@PARAM:MIN:MAX ...] [--seed N] [--points N] --out FILE

Varies quantities of DESIGN's pieces within their ranges until its goals are met as well as they can be (a seeded
simplex search over the band sweep), prints a before/after table, and writes the tuned design to FILE. The same
seed gives the same result.

Options:
  --goals FILE   a JSON list of targets (the design file's target records), each with an optional "weight"
                 (default 1); default: the design's own targets
  --vary V       a variable: segment ids joined by +, a quantity (degrees, length (m), z0 (Ω), width (m) or
                 value (a part's Ω, F or H)) and its range, e.g. arma1+armb1:degrees:60:120; or a number
                 parameter of a placed block in SI units (the block is re-generated at every step), e.g.
                 b1@ratioDb:-3:3 or b1@z0:45:55 (the parameter as \`stripwright block KIND --help\` names it,
                 with or without dashes); repeat for more.
                 Default: every line set in degrees varies its degrees ±30 % and its impedance ±20 %
  --seed N       seed of the search, 0 to 4294967295 (default 1)
  --points N     sweep points across the band (default 201)
  --out FILE     where to write the tuned design

Exit status: 0 written; 1 the design or goals are invalid; 2 a bad command line.

Example:
  stripwright tune assets/examples/wilkinson-2g45.json --seed 3 --out tuned.json`;

const QUANTITIES: TuneQuantity[] = ['degrees', 'length', 'z0', 'width', 'value'];

function parseVary(text: string): TuneVariable {
  if (text.includes('@')) {
    const m = /^([^@:]+)@([A-Za-z-]+):([^:]+):([^:]+)$/.exec(text);
    if (!m) throw new UsageError(`--vary expects BLOCK@PARAM:MIN:MAX for a block parameter, got '${text}'`);
    const min = Number(m[3]), max = Number(m[4]);
    if (!Number.isFinite(min) || !Number.isFinite(max) || !(max > min)) throw new UsageError(`--vary range must be MIN < MAX, got '${m[3]}:${m[4]}'`);
    // The option spelling (ratio-db) names the same parameter as the spec key (ratioDb).
    const param = m[2]!.replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());
    return { block: m[1]!, param, min, max };
  }
  const parts = text.split(':');
  if (parts.length !== 4) throw new UsageError(`--vary expects SEG[+SEG]:QUANTITY:MIN:MAX, got '${text}'`);
  const [segs, q, lo, hi] = parts as [string, string, string, string];
  if (!QUANTITIES.includes(q as TuneQuantity)) throw new UsageError(`--vary quantity must be one of ${QUANTITIES.join(', ')}, got '${q}'`);
  const min = Number(lo), max = Number(hi);
  if (!Number.isFinite(min) || !Number.isFinite(max) || !(min > 0) || !(max > min)) throw new UsageError(`--vary range must be 0 < MIN < MAX, got '${lo}:${hi}'`);
  return { segments: segs.split('+').filter(Boolean), quantity: q as TuneQuantity, min, max };
}

function readGoals(text: string, file: string): TuneGoal[] {
  let raw: unknown;
  try { raw = JSON.parse(text); } catch (e) { throw new InputError('bad-file', file, 'a JSON list of targets', (e as Error).message); }
  if (!Array.isArray(raw)) throw new InputError('bad-file', file, 'a JSON list of targets', typeof raw);
  return raw.map((t, i) => {
    const r = v.safeParse(targetSchema, t);
    if (!r.success) throw new InputError('bad-file', `${file}[${i}]`, 'a target record (id, figure, ports or group, band, limit)', JSON.stringify(t).slice(0, 120));
    const weight = (t as { weight?: unknown }).weight ?? 1;
    if (typeof weight !== 'number' || !(weight > 0)) throw new InputError('bad-file', `${file}[${i}].weight`, 'a weight above 0', JSON.stringify(weight));
    return { target: r.output as Target, weight };
  });
}

const fmt = (x: number) => (Math.abs(x) >= 1e-2 && Math.abs(x) < 1e5 ? x.toFixed(3) : x.toPrecision(4));

export const tuneCommand: CliCommand = {
  name: 'tune',
  summary: 'Vary lengths and widths of pieces, or block parameters, until the design meets its goals (seeded search)',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({
      args: argv, allowPositionals: true, strict: true,
      options: { goals: { type: 'string' }, vary: { type: 'string', multiple: true }, seed: { type: 'string' }, points: { type: 'string' }, out: { type: 'string' } },
    });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the DESIGN file' : `give one DESIGN file, got ${positionals.length}`);
    if (!values.out) throw new UsageError('give the output file with --out FILE');
    const seed = values.seed === undefined ? 1 : Number(values.seed);
    if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw new UsageError(`--seed expects a whole number from 0 to 4294967295, got '${values.seed}'`);
    const points = values.points === undefined ? 201 : Number(values.points);
    if (!Number.isInteger(points) || points < 2 || points > 100_001) throw new UsageError(`--points expects a whole number from 2 to 100001, got '${values.points}'`);
    const vary = (values.vary ?? []).map(parseVary);
    const name = positionals[0]!;
    const read = (file: string): string | null => {
      try { return readFileSync(resolve(io.cwd, file), 'utf8'); } catch (e) {
        io.err(`stripwright tune: cannot read ${file}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`);
        return null;
      }
    };
    const src = read(name);
    if (src === null) return 1;
    const parsed = parseDesign(src, { complete: true });
    if (!parsed.ok) {
      io.err(`stripwright tune: ${name} is not a valid design:`);
      for (const i of parsed.errors) io.err(`  ${i.message}`);
      return 1;
    }
    try {
      let goals: TuneGoal[] | undefined;
      if (values.goals) {
        const g = read(values.goals);
        if (g === null) return 1;
        goals = readGoals(g, values.goals);
      }
      const variables = vary.length ? vary : defaultVariables(parsed.doc);
      const r = await tuneWithBlocks(parsed.doc, { variables, seed, points, ...(goals ? { goals } : {}) });
      await writeOutputFile(resolve(io.cwd, values.out), serializeDesign(r.doc));
      io.out(`seed ${r.seed}: ${r.evaluations} evaluations (${r.stopped}); cost ${fmt(r.costBefore)} → ${fmt(r.costAfter)}`);
      io.out('variable'.padEnd(32) + 'before'.padStart(12) + 'after'.padStart(12));
      for (const x of r.variables) io.out(x.name.padEnd(32) + fmt(x.before).padStart(12) + fmt(x.after).padStart(12));
      io.out('goal'.padEnd(44) + 'before'.padStart(12) + 'after'.padStart(12));
      r.before.results.forEach((b, i) => {
        const a = r.after.results[i]!;
        io.out(b.name.slice(0, 43).padEnd(44) + `${fmt(b.worst.value)}${b.pass ? '' : '!'}`.padStart(12) + `${fmt(a.worst.value)}${a.pass ? '' : '!'}`.padStart(12));
      });
      for (const p of r.layoutProblems) io.out(`note: ${p} (redraw the loop to the new lengths)`);
      io.out(`wrote ${values.out}`);
      return 0;
    } catch (e) {
      if (e instanceof InputError) { io.err(`stripwright tune: ${name}: ${e.message}`); return 1; }
      throw e;
    }
  },
};
