/**
 * The derived figures of a design's response as one table: return loss and VSWR at every port, insertion loss and
 * group delay from the input to every output, isolation between outputs, amplitude and phase balance among each
 * phase group's outputs — each with its worst value over the design band and its value at f0. Definitions are those
 * of figures.ts; the balances are read by the same function as the targets (evaluateTarget), so the table and the
 * pass/fail column cannot disagree. A design without phase groups is read as one group: every output of the input.
 */
import type { DesignDoc, PhaseGroup, TargetFigure } from '../design/types.ts';
import type { NetworkResponse } from './response.ts';
import { groupDelay, insertionLoss, isolation, returnLoss, vswr, type Worst } from './figures.ts';
import { evaluateTarget } from './targets.ts';

export type FigureKind = 'return-loss' | 'vswr' | 'insertion-loss' | 'group-delay' | 'isolation' | 'amplitude-balance' | 'phase-balance';

export interface FigureRow {
  kind: FigureKind;
  /** Port node ids the figure is of (one port, [from, to], [a, b], or a group's outputs). */
  ports: string[];
  /** The phase group, for balances (absent for the implicit group of all outputs). */
  group?: string;
  /** 'dB', '' (VSWR), 's' (group delay) or '°'. */
  unit: 'dB' | '' | 's' | '°';
  /** Which end is worse: the smallest ('min': return loss, isolation) or the largest ('max'). */
  worse: 'min' | 'max';
  worst: Worst;
  /** Group delay only: the smallest value over the band (the spread is worst − least). */
  least?: Worst;
  /** The value at the sweep point nearest f0. */
  atF0: number;
}

export interface FigureTable {
  rows: FigureRow[];
  /** 'band' when the sweep covers the design band (worst values are over it), else 'sweep' (over the whole sweep). */
  over: 'band' | 'sweep';
  /** Isolation pairs left out of a large network (only the worst ones are listed). */
  omitted: number;
}

/** Most isolation rows listed (the worst ones); a 64-way feed has 2016 pairs of outputs. */
export const MAX_ISOLATION_ROWS = 24;

function worstOver(f: Float64Array, v: Float64Array, idx: number[], kind: 'min' | 'max'): Worst {
  let at = idx[0] ?? 0;
  for (const k of idx) if (kind === 'min' ? v[k]! < v[at]! : v[k]! > v[at]!) at = k;
  return { value: v[at] ?? 0, freq: f[at] ?? 0 };
}

function nearest(f: Float64Array, x: number): number {
  let b = 0;
  for (let k = 1; k < f.length; k++) if (Math.abs(f[k]! - x) < Math.abs(f[b]! - x)) b = k;
  return b;
}

export function figureTable(r: NetworkResponse, doc: Pick<DesignDoc, 'frequency' | 'phaseGroups'>, input: number): FigureTable {
  const f = r.freqs, P = r.ports.length, id = (i: number) => r.ports[i]!.name;
  const { start, stop } = doc.frequency.band;
  let idx: number[] = [];
  for (let k = 0; k < f.length; k++) if (f[k]! >= start * (1 - 1e-12) && f[k]! <= stop * (1 + 1e-12)) idx.push(k);
  const over = idx.length ? 'band' : 'sweep';
  if (!idx.length) idx = Array.from(f, (_, k) => k);
  const k0 = nearest(f, doc.frequency.f0);
  const rows: FigureRow[] = [];
  const row = (kind: FigureKind, ports: string[], unit: FigureRow['unit'], worse: 'min' | 'max', v: Float64Array, extra: Partial<FigureRow> = {}) =>
    rows.push({ kind, ports, unit, worse, worst: worstOver(f, v, idx, worse), atF0: v[k0] ?? 0, ...extra });
  for (let i = 0; i < P; i++) row('return-loss', [id(i)], 'dB', 'min', returnLoss(r, i));
  for (let i = 0; i < P; i++) row('vswr', [id(i)], '', 'max', vswr(r, i));
  const outs: number[] = [];
  for (let j = 0; j < P; j++) if (j !== input) outs.push(j);
  for (const j of outs) row('insertion-loss', [id(input), id(j)], 'dB', 'max', insertionLoss(r, input, j));
  for (const j of outs) {
    const gd = groupDelay(r, j, input);
    row('group-delay', [id(input), id(j)], 's', 'max', gd, { least: worstOver(f, gd, idx, 'min') });
  }
  const iso: FigureRow[] = [];
  for (let x = 0; x < outs.length; x++) for (let y = x + 1; y < outs.length; y++) {
    const v = isolation(r, outs[x]!, outs[y]!);
    iso.push({ kind: 'isolation', ports: [id(outs[x]!), id(outs[y]!)], unit: 'dB', worse: 'min', worst: worstOver(f, v, idx, 'min'), atF0: v[k0] ?? 0 });
  }
  iso.sort((a, b) => a.worst.value - b.worst.value);
  rows.push(...iso.slice(0, MAX_ISOLATION_ROWS));
  const groups: PhaseGroup[] = doc.phaseGroups.length ? doc.phaseGroups
    : outs.length >= 2 ? [{ id: '', name: 'all outputs', from: id(input), to: outs.map(id), toleranceDeg: 0 }] : [];
  const band = { start: f[idx[0]!]!, stop: f[idx[idx.length - 1]!]! };
  for (const g of groups) {
    for (const figure of ['amplitude-balance', 'phase-balance'] as const satisfies readonly TargetFigure[]) {
      // The targets' own reading of the figure: its worst point over the band against an open limit is its largest value.
      const t = { id: 'figure', figure, group: g.id, band, limit: { max: 1000 } };
      const w = evaluateTarget(r, t, { phaseGroups: groups }, 'figure');
      const atF0 = evaluateTarget(r, { ...t, band: { start: f[k0]!, stop: f[k0]! } }, { phaseGroups: groups }, 'figure').worst.value;
      rows.push({ kind: figure, ports: [...g.to], ...(g.id ? { group: g.id } : {}), unit: figure === 'amplitude-balance' ? 'dB' : '°', worse: 'max', worst: w.worst, atF0 });
    }
  }
  return { rows, over, omitted: Math.max(0, iso.length - MAX_ISOLATION_ROWS) };
}
