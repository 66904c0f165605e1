/**
 * `stripwright section`: the 2-D field solution of one cross-section (core/section solveSection, the same function
 * the app's cross-section view and the as-made sizing tables call). Prints Z0, εeff, C and L per length with their
 * own error estimates; with --spacing, the even and odd modes of the pair.
 */
import { parseArgs } from 'node:util';
import { solveSection, parseQuantity, InputError, DEFAULT_COPPER_T, type SectionSpec, type SectionMode } from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { degreesOption } from '../numbers.ts';

const MU0 = 1.25663706212e-6;

const USAGE = `Usage: stripwright section --er N --h LEN --width LEN [--t LEN] [--gap LEN [--ground-width LEN] [--sides both|left|right] [--floating]]
                          [--trench-depth LEN [--trench-angle DEG]] [--cover ER,LEN] [--etch-angle DEG] [--lid LEN]
                          [--spacing LEN] [--fineness N] [--json]

Solves the line's cross-section as made (quasi-static 2-D field solution, finite differences on a graded grid,
two grid levels and Richardson extrapolation) and prints Z0, εeff, C and L per length with each one's estimated
error. Values take units: 1.6mm, 62mil, 35um, 1oz.

  --er N               substrate relative permittivity
  --h LEN              substrate height
  --width LEN          strip width at its foot
  --t LEN              copper thickness (default 35 µm; 0 = thin sheet)
  --gap LEN            side copper on both sides at this gap, stitched to ground (wide unless --ground-width)
  --ground-width LEN   width of each side copper strip
  --sides S            both (default), left or right
  --floating           side copper unconnected (zero net charge) instead of stitched
  --trench-depth LEN   groove cut into the substrate in every gap
  --trench-angle DEG   the groove is a V of this included angle (a V-bit); straight walls without it
  --cover ER,LEN       solder mask or conformal coat, e.g. 3.5,25um
  --etch-angle DEG     copper side-wall angle to the substrate (90 = vertical, default)
  --lid LEN            grounded lid at this height above the ground plane
  --spacing LEN        a second strip at this edge-to-edge spacing: even and odd modes
  --fineness N         grid fineness (default 1; 2 = cells half the size, about 4× the time)
  --json               one JSON object, SI numbers

Examples:
  stripwright section --er 4.4 --h 1.6mm --width 3mm --gap 0.3mm --json
  stripwright section --er 3.66 --h 0.508mm --width 1.1mm --spacing 0.3mm --cover 3.5,25um`;

const OPTIONS = {
  er: { type: 'string' }, h: { type: 'string' }, width: { type: 'string' }, t: { type: 'string' },
  gap: { type: 'string' }, 'ground-width': { type: 'string' }, sides: { type: 'string' }, floating: { type: 'boolean' },
  'trench-depth': { type: 'string' }, 'trench-angle': { type: 'string' }, cover: { type: 'string' }, 'etch-angle': { type: 'string' },
  lid: { type: 'string' }, spacing: { type: 'string' }, fineness: { type: 'string' }, json: { type: 'boolean' },
} as const;

type Values = { [K in keyof typeof OPTIONS]?: (typeof OPTIONS)[K]['type'] extends 'boolean' ? boolean : string };

/** The cross-section the flags describe (units parsed by core/units). */
export function specFromFlags(v: Values): SectionSpec {
  for (const k of ['er', 'h', 'width'] as const) if (v[k] === undefined) throw new UsageError(`--${k} is needed`);
  const spec: SectionSpec = {
    er: parseQuantity(v.er!, 'ratio', 'er'), h: parseQuantity(v.h!, 'length', 'h'), width: parseQuantity(v.width!, 'length', 'width'),
    t: v.t !== undefined ? parseQuantity(v.t, 'length', 't') : DEFAULT_COPPER_T,
  };
  if (v.gap !== undefined) {
    const sides = v.sides ?? 'both';
    if (sides !== 'both' && sides !== 'left' && sides !== 'right') throw new InputError('bad-choice', 'sides', 'both, left or right', JSON.stringify(sides));
    spec.side = {
      gap: parseQuantity(v.gap, 'length', 'gap'),
      width: v['ground-width'] !== undefined ? parseQuantity(v['ground-width'], 'length', 'ground-width') : Infinity,
      sides, connection: v.floating ? 'floating' : 'stitched',
    };
  } else if (v['ground-width'] !== undefined || v.floating || v.sides !== undefined) {
    throw new UsageError('--ground-width, --sides and --floating describe side copper: give --gap too');
  }
  if (v['trench-depth'] !== undefined) {
    spec.trench = { depth: parseQuantity(v['trench-depth'], 'length', 'trench-depth') };
    if (v['trench-angle'] !== undefined) spec.trench.angleDeg = degreesOption('trench-angle', v['trench-angle'], { min: -360, max: 360 });
  }
  if (v.cover !== undefined) {
    const [er, th] = v.cover.split(',');
    if (er === undefined || th === undefined) throw new InputError('bad-unit', 'cover', 'ER,THICKNESS, e.g. 3.5,25um', JSON.stringify(v.cover));
    spec.cover = { er: parseQuantity(er, 'ratio', 'cover'), thickness: parseQuantity(th, 'length', 'cover') };
  }
  if (v['etch-angle'] !== undefined) spec.etchAngleDeg = degreesOption('etch-angle', v['etch-angle'], { min: -360, max: 360 });
  if (v.lid !== undefined) spec.lid = parseQuantity(v.lid, 'length', 'lid');
  if (v.spacing !== undefined) spec.spacing = parseQuantity(v.spacing, 'length', 'spacing');
  return spec;
}

function modeJson(m: SectionMode) {
  return {
    z0_ohm: m.z0, eps_eff: m.epsEff, c_f_per_m: m.c, l_h_per_m: m.l, c_air_f_per_m: m.cAir,
    error: { z0_rel: m.error.z0, eps_eff_rel: m.error.epsEff, c_rel: m.error.c, l_rel: m.error.cAir },
    // Wheeler's rule: αc = Rs·∂L/∂n/(2·μ0·Z0); per ohm of surface resistance (multiply by Rs(f)·roughness factor).
    alpha_c_np_per_m_per_ohm: m.dLdn > 0 ? m.dLdn / (2 * MU0 * m.z0) : null,
  };
}

function text(m: SectionMode): string {
  const pct = (x: number) => `±${(x * 100).toFixed(2)} %`;
  return [
    `${m.mode === 'single' ? 'line' : `${m.mode} mode`}:`,
    `  Z0      ${m.z0.toFixed(3)} Ω   (${pct(m.error.z0)})`,
    `  εeff    ${m.epsEff.toFixed(4)}     (${pct(m.error.epsEff)})`,
    `  C       ${(m.c * 1e12).toFixed(3)} pF/m (${pct(m.error.c)})`,
    `  L       ${(m.l * 1e9).toFixed(3)} nH/m (${pct(m.error.cAir)})`,
  ].join('\n');
}

export const sectionCommand: CliCommand = {
  name: 'section',
  summary: 'solve a line\'s cross-section as made (side copper, trench, cover, lid; pairs): Z0, εeff, C, L',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values } = parseArgs({ args: argv, options: OPTIONS, strict: true, allowPositionals: false });
    try {
      const spec = specFromFlags(values);
      const fineness = values.fineness !== undefined ? parseQuantity(values.fineness, 'ratio', 'fineness') : 1;
      if (!(fineness >= 0.5 && fineness <= 4)) throw new InputError('out-of-range', 'fineness', 'a fineness from 0.5 to 4', values.fineness ?? '');
      const r = solveSection(spec, { fineness });
      const warnings = r.warnings.map((w) => w.message);
      if (values.json) {
        const out = r.modes.length === 1
          ? { ...modeJson(r.modes[0]!), warnings }
          : { even: modeJson(r.modes[0]!), odd: modeJson(r.modes[1]!), warnings };
        io.out(JSON.stringify(out, null, 2));
      } else {
        io.out([...r.modes.map(text), ...warnings.map((w) => `note: ${w}`)].join('\n'));
      }
      return 0;
    } catch (e) {
      if (e instanceof UsageError) throw e;
      if (e instanceof InputError) { io.err(`stripwright section: ${e.message}`); return 1; }
      throw e;
    }
  },
};
