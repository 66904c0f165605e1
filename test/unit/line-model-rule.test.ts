/**
 * The project's own rule (DEVELOPERS.md, "Adding a cross-section"): everything that turns copper into a line asks the
 * line-model interface (core/line/line-model.ts), never a model module. Outside core/line no module imports a
 * microstrip or coupled-microstrip model file (type-only imports excepted: they call nothing), and none imports a
 * model's entry function through the line layer's index either. The checker is tried on planted violations first,
 * so the rule test can fail.
 *
 * Justified exceptions (each named with its reason; keep this list short):
 *  - core/blocks/common.ts `couplingAtGap`: only words in an error message (the tightest coupling the tool's
 *    narrowest gap allows, from the coupled statics) when a coupler block is refused; no line enters a design by it.
 *  - cli/commands/line.ts and cli/commands/line-coupled.ts: the line calculator commands, whose job is to print the
 *    models' own full results (thresholds, model names, every warning) for one strip or one pair.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve, dirname } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = resolve(import.meta.dirname, '..', '..');

/** Model modules of core/line: one published method each, or the analysis and synthesis chained over them. */
const MODEL_FILES = new Set([
  'analyze.ts', 'synthesize.ts', 'model.ts', 'made-line.ts', 'term-tables.ts', 'line-constants.ts', 'electrical-length.ts',
  'closed-form-synthesis.ts', 'hammerstad-jensen-1980.ts', 'hammerstad-jensen-1980-dispersion.ts', 'kirschning-jansen-1982.ts',
  'jansen-kirschning-1983.ts', 'wheeler-incremental-inductance.ts', 'current-distribution-loss.ts',
  'hammerstad-bekkadal-roughness.ts', 'filling-factor-dielectric-loss.ts',
  'coupled.ts', 'coupled-synthesis.ts', 'coupled-losses.ts', 'kirschning-jansen-1984-coupled.ts', 'getsinger-1973-coupled-dispersion.ts',
]);

/** The models' entry functions, as the line layer's index re-exports them. */
const MODEL_ENTRIES = new Set([
  'analyzeLine', 'analyzeLines', 'synthesizeLine', 'lineConstants', 'groupDelayPerM', 'microstripColumns', 'microstripMode',
  'hammerstadJensenStatic', 'hjZ01', 'hjEpsEff', 'kirschningJansenEpsEff', 'jansenKirschningZ0', 'currentDistributionAlphaC',
  'hammerstad1975WidthRatio', 'wheeler1977WidthRatio',
  'analyzeCoupled', 'synthesizeCoupled', 'coupledLine', 'coupledInto', 'coupledNumbers', 'couplingAtGap', 'kjCoupledStatic',
  'kjStatic', 'getsingerEpsEff',
]);

/** file (relative to the root) → entries it may import, with the reason in the header above. */
const EXCEPTIONS: Record<string, readonly string[]> = {
  'core/blocks/common.ts': ['couplingAtGap'],
  'cli/commands/line.ts': ['analyzeLine', 'synthesizeLine'],
  'cli/commands/line-coupled.ts': ['coupledLine'],
};

const SCANNED = ['core', 'cli', 'renderer/src', 'electron', 'bridge'];
const LINE_DIR = join(ROOT, 'core', 'line');

interface Finding { file: string; what: string }

const IMPORT = /import\s+(type\s+)?(\{[^}]*\}|\*\s+as\s+\w+|\w+)?\s*(?:,\s*(\{[^}]*\}))?\s*(?:from\s+)?['"]([^'"]+)['"]/g;

/** The rule's violations in one source text at `file` (a path relative to the root). */
export function violations(file: string, text: string): Finding[] {
  const abs = join(ROOT, file);
  if (abs.startsWith(LINE_DIR + '/')) return [];
  const out: Finding[] = [];
  const allowed = new Set(EXCEPTIONS[file] ?? []);
  for (const m of text.matchAll(IMPORT)) {
    const typeOnly = m[1] !== undefined;
    const spec = m[4]!;
    if (!spec.startsWith('.')) continue;
    const target = resolve(dirname(abs), spec);
    const inLine = dirname(target) === LINE_DIR;
    const coreEntry = target === join(ROOT, 'core', 'index.ts');
    if (!inLine && !coreEntry) continue;
    const base = target.slice(LINE_DIR.length + 1);
    if (inLine && MODEL_FILES.has(base) && !typeOnly) out.push({ file, what: `imports the model module core/line/${base}` });
    if (typeOnly) continue;
    const names = [m[2], m[3]].filter((x): x is string => !!x && x.startsWith('{'))
      .flatMap((b) => b.slice(1, -1).split(',')).map((n) => n.trim()).filter((n) => n && !n.startsWith('type '))
      .map((n) => n.split(/\s+as\s+/)[0]!.trim());
    for (const n of names) if (MODEL_ENTRIES.has(n) && !allowed.has(n)) out.push({ file, what: `imports the model entry ${n}` });
  }
  return out;
}

function sources(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (name === 'node_modules' || name.startsWith('.')) continue;
    if (statSync(p).isDirectory()) out.push(...sources(p));
    else if (/\.(ts|svelte)$/.test(name) && !name.endsWith('.d.ts')) out.push(p);
  }
  return out;
}

describe('no module outside core/line asks a line model behind the interface', () => {
  it('the checker catches each kind of violation (planted sources)', () => {
    expect(violations('core/layout/x.ts', "import { analyzeCoupled } from '../line/index.ts';\n").map((f) => f.what)).toEqual(['imports the model entry analyzeCoupled']);
    expect(violations('core/yield/x.ts', "import { analyzeLines, type LineOptions } from '../line/analyze.ts';\n").map((f) => f.what))
      .toEqual(['imports the model module core/line/analyze.ts', 'imports the model entry analyzeLines']);
    expect(violations('core/blocks/x.ts', "import {\n  lineModels,\n  synthesizeLine as s,\n} from '../line/index.ts';\n").map((f) => f.what)).toEqual(['imports the model entry synthesizeLine']);
    expect(violations('renderer/src/x.ts', "import { coupledLine } from '../../core/index.ts';\n").map((f) => f.what)).toEqual(['imports the model entry coupledLine']);
    // Allowed: the interface, type-only imports, and anything inside core/line itself.
    expect(violations('core/layout/x.ts', "import { lineModels, pairAt, stripColumns } from '../line/index.ts';\nimport type { CoupledResult } from '../line/coupled-types.ts';\nimport type { LineResult } from '../line/analyze.ts';\n")).toEqual([]);
    expect(violations('core/line/line-model.ts', "import { analyzeCoupled } from './coupled.ts';\n")).toEqual([]);
    // An exception covers its own file and names only.
    expect(violations('core/blocks/common.ts', "import { couplingAtGap } from '../line/index.ts';\n")).toEqual([]);
    expect(violations('core/blocks/common.ts', "import { couplingAtGap, analyzeLine } from '../line/index.ts';\n").map((f) => f.what)).toEqual(['imports the model entry analyzeLine']);
  });

  it('holds for every source file of the core and the faces', () => {
    const found: Finding[] = [];
    for (const top of SCANNED) {
      const dir = join(ROOT, top);
      for (const abs of sources(dir)) found.push(...violations(relative(ROOT, abs), readFileSync(abs, 'utf8')));
    }
    expect(found).toEqual([]);
  });

  it('every listed exception is still needed (a stale exception is removed, not kept)', () => {
    for (const [file, names] of Object.entries(EXCEPTIONS)) {
      const text = readFileSync(join(ROOT, file), 'utf8');
      for (const n of names) expect(new RegExp(`\\b${n}\\b`).test(text), `${file} no longer uses ${n}`).toBe(true);
    }
  });
});
