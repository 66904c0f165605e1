/**
 * Records named as the user labelled them (issue 14, fault 8): one core function (core/design/names.ts) names ports,
 * nodes and pieces for every face; ids appear only where a label is missing. The examples' own labels are the data;
 * the S-parameter index convention (S_ij: wave out of port i for a wave into port j) is that of Kurokawa 1965.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  parseDesign, namer, nodeByName, sParameterName, sizeDesign, designPaths, tracePaths, checkBoard, initPolygons,
  netlistFromSized, solveNetwork, portIndex, portLabel, writeTouchstone, type DesignDoc,
} from '../../core/index.ts';

const EX = join(import.meta.dirname, '..', '..', 'assets', 'examples');
function example(name: string): DesignDoc {
  const r = parseDesign(readFileSync(join(EX, `${name}.json`), 'utf8'));
  if (!r.ok) throw new Error(r.errors[0]!.message);
  return r.doc;
}
beforeAll(async () => { await initPolygons(); });

describe('namer', () => {
  it('gives the label, the id where there is none, and tells shared labels apart by id', () => {
    const doc = example('branchline-10g4');
    const name = namer(doc);
    expect(name('p1')).toBe('input');
    expect(name('j1')).toBe('j1'); // a junction without a label
    // Both shunt arms are labelled "shunt arm": each keeps its own name.
    expect(name('shunt1')).toBe('shunt arm (shunt1)');
    expect(name('shunt2')).toBe('shunt arm (shunt2)');
    expect(name('no-such-id')).toBe('no-such-id');
    expect(namer({ nodes: [{ id: 'n1', kind: 'junction', at: { x: 0, y: 0 }, label: '   ' }] })('n1')).toBe('n1');
  });
  it('finds a node by its id or its label; a shared label finds nothing', () => {
    const doc = example('wilkinson-2g45');
    expect(nodeByName(doc, 'output 2')).toBe('o2');
    expect(nodeByName(doc, 'o2')).toBe('o2');
    expect(nodeByName(doc, 'nobody')).toBeUndefined();
    expect(nodeByName(example('demo'), 'width step')).toBeUndefined(); // two width steps share the label
  });
  it('names S-parameters with their ports', () => {
    expect(sParameterName(1, 0, ['input', 'output 1'])).toBe('S21 (output 1 ← input)');
    expect(sParameterName(0, 0, ['input', 'output 1'])).toBe('S11 (input)');
    const ten = Array.from({ length: 10 }, (_, k) => `p${k + 1}`);
    expect(sParameterName(9, 1, ten)).toBe('S10,2 (p10 ← p2)');
  });
});

describe('every face names ports by their labels', () => {
  it('the path ledger and its advice', () => {
    const sized = sizeDesign(example('wilkinson-2g45'));
    const [rep] = designPaths(sized);
    expect(rep!.fromName).toBe('input');
    expect(rep!.paths.map((p) => p.toName)).toEqual(['output 1', 'output 2']);
    // Paths asked for by label; advice words use the labels, never the ids.
    // Asking output 2 to lead by 45° puts it out of tolerance, so the ledger gives advice.
    const ledger = tracePaths(sized, 'input', ['output 1', 'output 2'], { offsetsDeg: [0, 45] });
    expect(ledger.from).toBe('in');
    expect(ledger.name).toBe('input → output 1, output 2');
    expect(ledger.warnings.map((w) => w.message).join('\n')).toMatch(/path input → output 2 is .* from input → output 1 at f0 \(wanted 45\.0°\)/);
    for (const w of ledger.warnings) expect(w.message).not.toMatch(/\b(o1|o2)\b/);
  });
  it('the shop check', () => {
    const sized = sizeDesign(example('wilkinson-2g45'));
    const { findings } = checkBoard(sized, { lossLimitDb: 1e-6 });
    const loss = findings.find((f) => f.code === 'loss-budget')!;
    expect(loss.message).toMatch(/from input \(to output 1, output 2\)/);
    expect(loss.subjects).toContain('o1'); // selection still works by id
  });
  it('the response, port lookup and the Touchstone comment', () => {
    const sized = sizeDesign(example('wilkinson-2g45'));
    const r = solveNetwork(netlistFromSized(sized), new Float64Array([2.45e9]));
    expect(r.ports.map(portLabel)).toEqual(['input', 'output 1', 'output 2']);
    expect(portIndex(r, 'output 2')).toBe(2);
    expect(portIndex(r, 'o2')).toBe(2);
    expect(() => portIndex(r, 'output 9')).toThrow(/a port label or id \(input = in, output 1 = o1, output 2 = o2\)/);
    expect(writeTouchstone(r)).toMatch(/^! ports: 1=input \(in\) 2=output 1 \(o1\) 3=output 2 \(o2\)$/m);
  });
});
