/**
 * The dependency rule, checked on source text (no build needed):
 *  - core/ imports only relative core files and the allowed pure packages; no Node built-ins, DOM, Electron or Svelte;
 *  - the faces (FACES below): renderer/ imports no Node built-in, no electron and nothing of electron/ or cli/;
 *    electron/ nothing of renderer/ or cli/; cli/ nothing of renderer/, no electron and of electron/ only the
 *    plain-Node files/ folder; bridge/ (the contract and text checks the renderer and the shell share) nothing of
 *    any face and no Node built-in; every face reaches the core through its public entry core/index.ts only;
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

const NODE_BUILTINS = ['assert', 'buffer', 'child_process', 'cluster', 'crypto', 'dgram', 'dns', 'events', 'fs', 'fs/promises', 'http', 'http2', 'https', 'inspector', 'module', 'net', 'os', 'path', 'perf_hooks', 'process', 'readline', 'stream', 'timers', 'tls', 'url', 'util', 'v8', 'vm', 'worker_threads', 'zlib'];

/** A Node built-in module specifier ('node:fs', 'fs', 'fs/promises'). */
export function isNodeBuiltin(spec: string): boolean {
  return spec.startsWith('node:') || NODE_BUILTINS.includes(spec);
}

/** What each face may import besides its own files: top folders it may reach, and core files other than core/index.ts. */
interface Face {
  name: string;
  dir: string[];
  /** Top folders of the project this face may import from (its own included). */
  folders: string[];
  /** Of these folders, only the paths listed may be imported (plain-Node helpers without the shell's UI). */
  onlyUnder?: Record<string, string[]>;
  /** Core files other than core/index.ts this face may import, relative to the root. */
  coreFiles?: string[];
  nodeBuiltins: boolean;
  electron: boolean;
}

export const FACES: Face[] = [
  { name: 'the renderer', dir: ['renderer', 'src'], folders: ['renderer', 'bridge', 'core', 'assets'], nodeBuiltins: false, electron: false },
  { name: 'electron/', dir: ['electron'], folders: ['electron', 'bridge', 'core'], nodeBuiltins: true, electron: true },
  { name: 'cli/', dir: ['cli'], folders: ['cli', 'bridge', 'core', 'electron'], onlyUnder: { electron: ['electron/files/'] }, nodeBuiltins: true, electron: false },
  // The shared contract imports the design limits alone (pulling the whole core into the shell's preload is not worth it).
  { name: 'bridge/', dir: ['bridge'], folders: ['bridge', 'core'], coreFiles: ['core/design/limits.ts'], nodeBuiltins: false, electron: false },
];

/** Why `spec`, imported by `file` of `face`, breaks the rule; null when it does not. */
function faceImportProblem(root: string, face: Face, file: string, spec: string): string | null {
  if (spec === 'electron' || spec.startsWith('electron/')) {
    return face.electron ? null : `${face.name} may not import '${spec}' (only electron/ talks to Electron; the page uses the preload bridge)`;
  }
  if (isNodeBuiltin(spec)) return face.nodeBuiltins ? null : `${face.name} may not import the Node built-in '${spec}' (file access goes through the shell or the CLI)`;
  if (!spec.startsWith('.')) return null; // a package: the bundlers and type-checks judge those
  const target = relative(root, resolve(dirname(file), spec)).split(sep).join('/');
  const top = target.split('/')[0]!;
  if (target.startsWith('..')) return `${face.name} may not import '${spec}' from outside the project`;
  if (top === 'core') {
    if (target === 'core/index.ts' || target === 'core' || (face.coreFiles ?? []).includes(target)) return null;
    return `${face.name} may reach the core only through its public entry core/index.ts, not '${spec}' (export what you need from core/index.ts)`;
  }
  if (!target.includes('/')) return null; // a file at the root (package.json)
  if (!face.folders.includes(top)) return `${face.name} may not import '${spec}' (${top}/ is another face; share code through bridge/ or the core)`;
  const only = face.onlyUnder?.[top];
  if (only && !only.some((a) => target.startsWith(a))) {
    return `${face.name} may not import '${spec}' (of ${top}/ only ${only.join(', ')} is plain Node without the shell's UI)`;
  }
  return null;
}

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
      if (isNodeBuiltin(spec)) {
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
  for (const face of FACES) {
    for (const file of walk(join(root, ...face.dir))) {
      for (const { spec, line } of importsOf(readFileSync(file, 'utf8'))) {
        const problem = faceImportProblem(root, face, file, spec);
        if (problem) add(file, line, problem);
      }
    }
  }
  return v;
}
