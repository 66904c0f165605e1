/**
 * The dependency rule, checked on source text (no build needed):
 *  - core/ imports only relative core files and the allowed pure packages; no Node built-ins, DOM, Electron or Svelte;
 *  - renderer/ never imports electron, Node built-ins or cli/;
 *  - cli/ and electron/ never import renderer/;
 *  - inside core, a lower layer never imports a higher one (CORE_LAYERS order).
 * Used by `npm run lint` and by test/unit/dependency-rule.test.ts.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve, dirname, sep } from 'node:path';

/** Pure, DOM-free packages core/ may use. */
export const CORE_ALLOWED_PACKAGES = ['valibot', 'clipper2-wasm', 'dxf-writer', 'pdf-lib', '@pdf-lib/fontkit'];

/** Core folders from the fundamentals up: a folder may import its own and lower ones only. */
export const CORE_LAYERS = ['util', 'units', 'substrate', 'line', 'section', 'discontinuity', 'geometry', 'design', 'layout', 'network', 'yield', 'blocks', 'toolpath', 'export', 'pipeline', 'api'];

const FORBIDDEN_IN_CORE_GLOBALS = /\b(document|window|localStorage|sessionStorage|navigator|require|process|__dirname|Buffer)\s*[.(\[]/;

export interface Violation { file: string; line: number; message: string }

function walk(dir: string, out: string[] = []): string[] {
  let entries: string[] = [];
  try { entries = readdirSync(dir); } catch { return out; }
  for (const name of entries) {
    if (name === 'node_modules' || name.startsWith('.')) continue;
    const p = join(dir, name);
    if (statSync(p).isDirectory()) walk(p, out);
    else if (/\.(ts|svelte|mjs|js)$/.test(name) && !name.endsWith('.d.ts')) out.push(p);
  }
  return out;
}

const IMPORT_RE = /(?:^|\n)\s*(?:import|export)\s[^'"`;]*?from\s*['"]([^'"]+)['"]|(?:^|\n)\s*import\s*['"]([^'"]+)['"]|\bimport\(\s*['"]([^'"]+)['"]\s*\)/g;

function importsOf(text: string): { spec: string; line: number }[] {
  const found: { spec: string; line: number }[] = [];
  for (const m of text.matchAll(IMPORT_RE)) {
    const spec = m[1] ?? m[2] ?? m[3];
    if (!spec) continue;
    const line = text.slice(0, (m.index ?? 0) + m[0].length).split('\n').length;
    found.push({ spec, line });
  }
  return found;
}

function packageName(spec: string): string {
  const parts = spec.split('/');
  return spec.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0]!;
}

function coreLayer(root: string, file: string): string | null {
  const rel = relative(join(root, 'core'), file);
  if (rel.startsWith('..')) return null;
  const first = rel.split(sep)[0]!;
  return rel.includes(sep) ? first : 'api';
}

export function checkDependencyRule(root: string): Violation[] {
  root = resolve(root);
  const v: Violation[] = [];
  const add = (file: string, line: number, message: string) => v.push({ file: relative(root, file), line, message });

  for (const file of walk(join(root, 'core'))) {
    if (file.endsWith('.test.ts')) add(file, 1, 'tests live under test/, not core/');
    const text = readFileSync(file, 'utf8');
    const layer = coreLayer(root, file)!;
    for (const { spec, line } of importsOf(text)) {
      if (spec.startsWith('.')) {
        const target = resolve(dirname(file), spec);
        const targetRel = relative(join(root, 'core'), target);
        if (targetRel.startsWith('..')) { add(file, line, `core imports '${spec}' from outside core/`); continue; }
        const targetLayer = targetRel.includes(sep) ? targetRel.split(sep)[0]! : 'api';
        const a = CORE_LAYERS.indexOf(layer), b = CORE_LAYERS.indexOf(targetLayer);
        if (a >= 0 && b >= 0 && b > a) add(file, line, `core/${layer} may not import the higher layer core/${targetLayer} ('${spec}')`);
        continue;
      }
      if (spec.startsWith('node:') || ['fs', 'path', 'os', 'child_process', 'crypto', 'url', 'util', 'worker_threads'].includes(spec)) {
        add(file, line, `core may not import the Node built-in '${spec}' (keep I/O in cli/ or electron/)`);
      } else if (!CORE_ALLOWED_PACKAGES.includes(packageName(spec))) {
        add(file, line, `core may not import '${spec}'; allowed packages: ${CORE_ALLOWED_PACKAGES.join(', ')}`);
      }
    }
    text.split('\n').forEach((l, i) => {
      const code = l.replace(/\/\/.*$/, '');
      if (/^\s*\*/.test(l)) return; // doc comment line
      if (FORBIDDEN_IN_CORE_GLOBALS.test(code)) add(file, i + 1, `core may not touch host globals: '${code.trim()}'`);
      if (/\bconsole\.(log|warn|error|info)\b/.test(code)) add(file, i + 1, 'core reports through returned warnings, never the console');
    });
  }
  for (const file of walk(join(root, 'renderer', 'src'))) {
    for (const { spec, line } of importsOf(readFileSync(file, 'utf8'))) {
      if (spec === 'electron' || spec.startsWith('node:')) add(file, line, `the renderer may not import '${spec}' (use the preload bridge)`);
      if (spec.includes('/cli/') || spec.includes('/electron/main')) add(file, line, `the renderer may not import '${spec}'`);
    }
  }
  for (const dir of ['cli', 'electron']) {
    for (const file of walk(join(root, dir))) {
      for (const { spec, line } of importsOf(readFileSync(file, 'utf8'))) {
        if (spec.includes('renderer/')) add(file, line, `${dir}/ may not import the renderer ('${spec}')`);
      }
    }
  }
  return v;
}
