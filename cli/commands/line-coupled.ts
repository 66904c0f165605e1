/**
 * `stripwright line --coupled`: analyse a coupled microstrip pair (--width, --spacing) or size one for a coupling
 * (--coupling-db, --z0) or for mode impedances (--z0e, --z0o). A thin face over core coupledLine.
 */
import { coupledLine, formatQuantity, parseQuantity, InputError, COUPLED_DISPERSIONS, type CoupledAsk, type CoupledDispersion, type CoupledOptions, type CoupledResult, type SubstrateSpec, type Warning } from '../../core/index.ts';
import { UsageError } from '../registry.ts';

export interface CoupledText { width?: string; spacing?: string; 'coupling-db'?: string; z0?: string; z0e?: string; z0o?: string; f?: string; dispersion?: string }

export const COUPLED_USAGE = `Coupled pair (--coupled):
  --width LEN --spacing LEN     analyse two strips of this width with this edge-to-edge gap
  --coupling-db DB --z0 OHMS    size a pair for this coupling (e.g. 10) in a system of Z0
  --z0e OHMS --z0o OHMS         size a pair for these even- and odd-mode impedances
  --f FREQ                      frequency (mode dispersion, losses); static without it
  --dispersion NAME             ${COUPLED_DISPERSIONS.join(' (default), ')}
  JSON keys: width_m, spacing_m, z0_even_ohm, z0_odd_ohm, eps_eff_even, eps_eff_odd, coupling_db, z0_system_ohm,
  f_hz, alpha_even_db_per_m, alpha_odd_db_per_m, threshold_hz, models, warnings`;

function ask(c: CoupledText): CoupledAsk {
  const geo = c.width !== undefined || c.spacing !== undefined;
  const byC = c['coupling-db'] !== undefined;
  const byModes = c.z0e !== undefined || c.z0o !== undefined;
  if ([geo, byC, byModes].filter(Boolean).length !== 1) throw new UsageError('--coupled takes one of: --width and --spacing, --coupling-db and --z0, or --z0e and --z0o');
  if (geo) {
    if (c.width === undefined || c.spacing === undefined) throw new UsageError('--coupled analysis needs both --width and --spacing');
    return { width: parseQuantity(c.width, 'length', 'width'), spacing: parseQuantity(c.spacing, 'length', 'spacing') };
  }
  if (byC) {
    if (c.z0 === undefined) throw new UsageError('--coupling-db needs the system impedance --z0');
    const db = parseQuantity(c['coupling-db']!, 'db', 'coupling-db');
    return { couplingDb: Math.abs(db), z0: parseQuantity(c.z0, 'impedance', 'z0') };
  }
  if (c.z0e === undefined || c.z0o === undefined) throw new UsageError('give both --z0e and --z0o');
  return { z0Even: parseQuantity(c.z0e, 'impedance', 'z0e'), z0Odd: parseQuantity(c.z0o, 'impedance', 'z0o') };
}

export function solveCoupled(sub: SubstrateSpec, c: CoupledText): CoupledResult {
  const opts: CoupledOptions = {};
  if (c.dispersion !== undefined) {
    if (!COUPLED_DISPERSIONS.includes(c.dispersion as CoupledDispersion)) throw new InputError('bad-choice', 'dispersion', `for --coupled, one of ${COUPLED_DISPERSIONS.join(', ')}`, JSON.stringify(c.dispersion));
    opts.dispersion = c.dispersion as CoupledDispersion;
  }
  const f = c.f === undefined ? 0 : parseQuantity(c.f, 'frequency', 'f');
  return coupledLine(sub, ask(c), f, opts);
}

const DB = 20 / Math.LN10;
function warningJson(w: Warning) { return { code: w.code, severity: w.severity, message: w.message, ...(w.source ? { source: w.source } : {}) }; }

export function coupledJson(r: CoupledResult): Record<string, unknown> {
  return {
    width_m: r.width, spacing_m: r.spacing,
    z0_even_ohm: r.even.z0, z0_odd_ohm: r.odd.z0, eps_eff_even: r.even.epsEff, eps_eff_odd: r.odd.epsEff,
    eps_eff_even_static: r.even.epsEffStatic, eps_eff_odd_static: r.odd.epsEffStatic,
    coupling_db: r.couplingDb, z0_system_ohm: r.z0System, f_hz: r.f,
    alpha_even_db_per_m: (r.even.alphaC + r.even.alphaD) * DB, alpha_odd_db_per_m: (r.odd.alphaC + r.odd.alphaD) * DB,
    threshold_hz: r.thresholds.errorAt, models: r.models, warnings: r.warnings.map(warningJson),
  };
}

export function coupledTable(r: CoupledResult, sub: SubstrateSpec): string {
  const q = formatQuantity;
  const atF = r.f > 0;
  const rows: [string, string][] = [
    ['substrate', `εr ${q(sub.er, 'ratio')}, h ${q(sub.h, 'length')}, t ${q(sub.t, 'length')}, tanδ ${q(sub.tanDelta, 'ratio')}`],
    ['strips', `width ${q(r.width, 'length')} each, gap ${q(r.spacing, 'length')} (W/h ${q(r.width / sub.h, 'ratio')}, s/h ${q(r.spacing / sub.h, 'ratio')})`],
    ['frequency', atF ? q(r.f, 'frequency') : 'static (no --f)'],
    ['Z0 even / odd', `${q(r.even.z0, 'impedance')} / ${q(r.odd.z0, 'impedance')}  (system √(Z0e·Z0o) ${q(r.z0System, 'impedance')})`],
    ['εeff even / odd', `${q(r.even.epsEff, 'ratio')} / ${q(r.odd.epsEff, 'ratio')}${atF ? ` at f (static ${q(r.even.epsEffStatic, 'ratio')} / ${q(r.odd.epsEffStatic, 'ratio')})` : ''}`],
    ['coupling', `${q(r.couplingDb, 'db')} (quarter-wave section at its centre frequency)`],
  ];
  if (atF) rows.push(['loss even / odd', `${q((r.even.alphaC + r.even.alphaD) * DB, 'db')}/m / ${q((r.odd.alphaC + r.odd.alphaD) * DB, 'db')}/m`]);
  rows.push(['mode threshold', q(r.thresholds.errorAt, 'frequency')]);
  rows.push(['models', `static Kirschning–Jansen 1984 (t = 0); ${r.models.dispersion === 'getsinger' ? 'εeff(f) Getsinger 1973 per mode (Z0e/2, 2·Z0o), mode impedances static' : 'no dispersion'}; conductor loss Wheeler's rule per mode; dielectric loss filling factor`]);
  const w = Math.max(...rows.map(([k]) => k.length));
  const lines = rows.map(([k, v]) => `  ${k.padEnd(w)}  ${v}`);
  if (r.warnings.length) { lines.push('', 'Warnings:'); for (const x of r.warnings) lines.push(`  [${x.severity}] ${x.message}`); }
  return lines.join('\n');
}
