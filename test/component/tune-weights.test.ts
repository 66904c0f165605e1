/**
 * The Tune tab's goal weights reach the same core function as a goals file's `weight` in `stripwright tune --goals`
 * (tuneWithBlocks with weighted goals): the worker job with weights gives the core's result to the bit, all-ones
 * weights give the unweighted result, and weights that favour one goal over another change what the search settles
 * on (the weights are not ignored). Design: the Wilkinson example with its resistor detuned (our own scenario).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { tuneJob } from '../../renderer/src/worker/equalize-job.ts';
import { defaultVariables, parseDesign, tuneWithBlocks, type DesignDoc, type TuneVariable } from '../../core/index.ts';
import { initPolygons } from '../../core/geometry/index.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

const wasm = join(process.cwd(), 'node_modules/clipper2-wasm/dist/es/clipper2z.wasm');
beforeAll(async () => { await initPolygons({ locateFile: () => wasm }); });

function wilkinson(): DesignDoc {
  const r = parseDesign(exampleText('wilkinson-2g45')!);
  if (!r.ok) throw new Error('example unreadable');
  return r.doc;
}
const none = () => {};
/** The first two of the example's tunable quantities, with the ranges the Tune tab offers. */
const variables = (doc: DesignDoc): TuneVariable[] => defaultVariables(doc).slice(0, 2);

describe('goal weights in the Tune tab', () => {
  it('the job with weights is the core tune with weighted goals; ones are the default', { timeout: 300_000 }, async () => {
    const doc = wilkinson();
    const vars = variables(doc);
    expect(vars.length).toBeGreaterThan(0);
    const weights = doc.targets.map((_, i) => (i === 0 ? 5 : 1));
    const app = await tuneJob({ doc, variables: vars, seed: 3, weights }, none);
    const core = await tuneWithBlocks(doc, { variables: vars, seed: 3, goals: doc.targets.map((target, i) => ({ target, weight: weights[i]! })) });
    expect(app.variables.map((v) => v.after)).toEqual(core.variables.map((v) => v.after));
    const ones = await tuneJob({ doc, variables: vars, seed: 3, weights: doc.targets.map(() => 1) }, none);
    const plain = await tuneJob({ doc, variables: vars, seed: 3 }, none);
    expect(ones.variables.map((v) => v.after)).toEqual(plain.variables.map((v) => v.after));
  });

  it('favouring one goal changes the result', { timeout: 300_000 }, async () => {
    // The branch-line example with its arms' impedances 20 % high and 99° long (our own detuning, as in
    // test/unit/tune.test.ts): its phase-balance and amplitude-balance targets then pull the arms different ways.
    const r = parseDesign(exampleText('branchline-10g4')!);
    if (!r.ok) throw new Error('example unreadable');
    const doc: DesignDoc = { ...r.doc, segments: r.doc.segments.map((s) => (s.kind === 'line' && s.length.by === 'degrees' && s.width.by === 'z0'
      ? { ...s, width: { by: 'z0' as const, z0: s.width.z0 * 1.2 }, length: { by: 'degrees' as const, deg: 99 } } : s)) };
    expect(doc.targets.length).toBe(2);
    const vars: TuneVariable[] = [
      { segments: ['thru1', 'thru2'], quantity: 'z0', min: 28, max: 45 },
      { segments: ['shunt1', 'shunt2'], quantity: 'degrees', min: 75, max: 105 },
    ];
    const heavy = (k: number) => doc.targets.map((_, i) => (i === k ? 1000 : 0.001));
    const a = await tuneJob({ doc, variables: vars, seed: 3, weights: heavy(0) }, none);
    const b = await tuneJob({ doc, variables: vars, seed: 3, weights: heavy(1) }, none);
    expect(a.variables.map((v) => v.after)).not.toEqual(b.variables.map((v) => v.after));
  });
});
