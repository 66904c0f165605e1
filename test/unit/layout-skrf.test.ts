/**
 * Path phase against Debian's scikit-rf 0.15.4 (`skrf.media.MLine`, run as an outside oracle with the system
 * python3). With t = 0 that version follows the papers for εe(f) (Kirschning & Jansen 1982, Electronics Letters 18(6); the project measured agreement within 4e-7), so the phase
 * β·l of a line agrees with our paths report to a few parts per million. Skipped, with the reason, where Debian's
 * python3-scikit-rf is not installed.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { sizeDesign } from '../../core/layout/sizing.ts';
import { tracePaths } from '../../core/layout/paths.ts';
import { design, port, line, wd, lenOf } from './layout-fixtures.ts';

const PY = `
import json, sys
import numpy as np
import skrf
from skrf.media import MLine
out = []
for c in json.loads(sys.stdin.read()):
    f = skrf.Frequency(c['f'] / 1e9, c['f'] / 1e9, 1, 'ghz')
    m = MLine(frequency=f, w=c['w'], h=c['h'], t=0, ep_r=c['er'], mu_r=1, tand=c['tand'], rho=1.72e-8, rough=0,
              diel='frequencyinvariant', disp='kirschningjansen')
    out.append(float(np.degrees(m.gamma.imag[0] * c['l'])))
print(json.dumps(out))
`;

const env = { ...process.env, PATH: spawnSync('getconf', ['PATH'], { encoding: 'utf8' }).stdout.trim() || '/usr/bin:/bin' };
const probe = spawnSync('python3', ['-c', 'import skrf'], { env, encoding: 'utf8' });
const have = probe.status === 0;

const cases = [
  { er: 4.4, h: 1.52e-3, w: 2.864e-3, f: 5e9, l: 0.1, tand: 0.002 },
  { er: 3.66, h: 0.508e-3, w: 1.1122e-3, f: 10.368e9, l: 0.037, tand: 0.0037 },
  { er: 2.2, h: 0.79e-3, w: 2.4e-3, f: 2.45e9, l: 0.21, tand: 0.001 },
  { er: 10.2, h: 0.635e-3, w: 0.6e-3, f: 8e9, l: 0.02, tand: 0.002 },
];

describe.skipIf(!have)('path phase vs scikit-rf 0.15.4 MLine (t = 0)', () => {
  it('β·l of single lines agrees to 1e-5', () => {
    const r = spawnSync('python3', ['-c', PY], { env, input: JSON.stringify(cases), encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const want = JSON.parse(r.stdout.trim().split('\n').pop()!) as number[];
    cases.forEach((c, i) => {
      const sub = { er: c.er, h: c.h, t: 0, tanDelta: c.tand, sigma: 1 / 1.72e-8, roughness: 0 };
      const s = sizeDesign(design({ substrate: sub, f0: c.f, nodes: [port('a', 0, 0), port('b', c.l, 0)], segments: [line('l', 'a', 'b', wd(c.w), lenOf(c.l))] }));
      const got = tracePaths(s, 'a', ['b'], { sensitivities: false }).paths[0]!.degAtF0;
      expect(Math.abs(got - want[i]!) / want[i]!).toBeLessThan(1e-5);
    });
  });
});
if (!have) it.skip(`scikit-rf reference: ${probe.stderr.trim().split('\n').pop() ?? 'python3-scikit-rf not installed'}`, () => {});
