/**
 * The hybrids with losses, as test/reference/blocks-lossy-skrf.test.ts defines them: in a ring the loss does not sit on
 * one path (power reaches an output both ways round), so "the ideal less the loss of its paths" is the textbook
 * hybrid whose every arm carries the loss our line model gives that arm's sized pieces:
 * - branch-line: D. M. Pozar, Microwave Engineering, 4th ed., 2012, §7.5 (series arms Z0·α, shunt arms Z0·α/β with
 *   α² + β² = 1 the through and coupled amplitudes; 90° each);
 * - rat-race: Pozar §7.8 (a ring of √2·Z0, 90°, 90°, 90° and 270° between the ports);
 * each port line a matched Z0 line with its own loss. Solved here by a small nodal solver of ideal transmission lines
 * (two-port admittances of a line, Pozar Table 4.1: Y11 = coth(γl)/Z, Y12 = −csch(γl)/Z) joined at ideal junctions,
 * independent of the core's network code; the reference test checks the same construction against scikit-rf.
 */
type C = [number, number];
const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => { const d = b[0] * b[0] + b[1] * b[1]; return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d]; };

export interface RingLine { a: string; b: string; z: number; deg: number; lossDb: number }
/** A resistor between two nodes, Ω. */
export interface RingResistor { a: string; b: string; r: number }

/** |S(to, from)| in dB of lines joined at named nodes, with ports of `z0` at `ports`. */
export function ringS(lines: RingLine[], ports: string[], z0: number, resistors: RingResistor[] = []): (to: string, from: string) => number {
  const names = [...new Set([...ports, ...lines.flatMap((l) => [l.a, l.b]), ...resistors.flatMap((r) => [r.a, r.b])])];
  const N = names.length, at = (n: string) => names.indexOf(n);
  const Y: C[][] = Array.from({ length: N }, () => Array.from({ length: N }, (): C => [0, 0]));
  for (const l of lines) {
    const a = (l.lossDb * Math.LN10) / 20, b = (l.deg * Math.PI) / 180;
    const ch: C = [Math.cosh(a) * Math.cos(b), Math.sinh(a) * Math.sin(b)], sh: C = [Math.sinh(a) * Math.cos(b), Math.cosh(a) * Math.sin(b)];
    const y11 = div(ch, mul(sh, [l.z, 0])), y12 = div([-1, 0], mul(sh, [l.z, 0]));
    const i = at(l.a), j = at(l.b);
    Y[i]![i] = add(Y[i]![i]!, y11); Y[j]![j] = add(Y[j]![j]!, y11);
    Y[i]![j] = add(Y[i]![j]!, y12); Y[j]![i] = add(Y[j]![i]!, y12);
  }
  for (const r of resistors) {
    const i = at(r.a), j = at(r.b), g: C = [1 / r.r, 0];
    Y[i]![i] = add(Y[i]![i]!, g); Y[j]![j] = add(Y[j]![j]!, g); Y[i]![j] = sub(Y[i]![j]!, g); Y[j]![i] = sub(Y[j]![i]!, g);
  }
  for (const p of ports) Y[at(p)]![at(p)] = add(Y[at(p)]![at(p)]!, [1 / z0, 0]);
  const cache = new Map<string, C[]>();
  const volts = (from: string): C[] => {
    let v = cache.get(from);
    if (!v) { const rhs: C[] = names.map((n): C => [n === from ? 2 / z0 : 0, 0]); v = solve(Y.map((r) => r.slice()), rhs); cache.set(from, v); }
    return v;
  };
  return (to, from) => { const v = volts(from)[at(to)]!; const s = to === from ? sub(v, [1, 0]) : v; return 20 * Math.log10(Math.hypot(s[0], s[1])); };
}

/** Gaussian elimination with partial pivoting (the matrices are a few nodes). */
function solve(A: C[][], b: C[]): C[] {
  const n = b.length;
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let r = k + 1; r < n; r++) if (Math.hypot(...A[r]![k]!) > Math.hypot(...A[p]![k]!)) p = r;
    [A[k], A[p]] = [A[p]!, A[k]!]; [b[k], b[p]] = [b[p]!, b[k]!];
    for (let r = k + 1; r < n; r++) {
      const f = div(A[r]![k]!, A[k]![k]!);
      for (let c = k; c < n; c++) A[r]![c] = sub(A[r]![c]!, mul(f, A[k]![c]!));
      b[r] = sub(b[r]!, mul(f, b[k]!));
    }
  }
  const x: C[] = Array.from({ length: n }, (): C => [0, 0]);
  for (let k = n - 1; k >= 0; k--) {
    let s = b[k]!;
    for (let c = k + 1; c < n; c++) s = sub(s, mul(A[k]![c]!, x[c]!));
    x[k] = div(s, A[k]![k]!);
  }
  return x;
}
