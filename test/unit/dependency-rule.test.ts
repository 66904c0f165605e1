/**
 * The dependency rule (scripts/dependency-rule.ts), the project's own layering rule: the real tree holds it, and each
 * kind of violation, planted in a throw-away copy of the folder layout, is caught with a message naming it.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { checkDependencyRule } from '../../scripts/dependency-rule.ts';

/** A temp tree with the given files (path → text), plus an empty core/index.ts and core/design/limits.ts. */
function tree(files: Record<string, string>): string {
  const root = mkdtempSync(join(tmpdir(), 'sw-rule-'));
  const all = { 'core/index.ts': 'export const x = 1;\n', 'core/design/limits.ts': 'export const L = 1;\n', 'core/line/model.ts': 'export const m = 1;\n', ...files };
  for (const [p, text] of Object.entries(all)) {
    mkdirSync(dirname(join(root, p)), { recursive: true });
    writeFileSync(join(root, p), text);
  }
  return root;
}

/** The violations reported for one planted file. */
function caught(path: string, text: string): string[] {
  return checkDependencyRule(tree({ [path]: text })).filter((v) => v.file === path).map((v) => v.message);
}

describe('dependency rule', () => {
  it('holds for the project', () => {
    expect(checkDependencyRule(join(import.meta.dirname, '..', '..'))).toEqual([]);
  });

  it('catches a forbidden import, a host global and an upward import in core', () => {
    const root = mkdtempSync(join(tmpdir(), 'sw-rule-'));
    mkdirSync(join(root, 'core', 'line'), { recursive: true });
    mkdirSync(join(root, 'core', 'export'), { recursive: true });
    writeFileSync(join(root, 'core', 'export', 'x.ts'), 'export const x = 1;\n');
    writeFileSync(join(root, 'core', 'line', 'bad.ts'),
      "import { readFileSync } from 'node:fs';\nimport { x } from '../export/x.ts';\nimport { SVG } from '@svgdotjs/svg.js';\nconst d = document.body;\n");
    const messages = checkDependencyRule(root).map((v) => v.message).join('\n');
    expect(messages).toMatch(/Node built-in 'node:fs'/);
    expect(messages).toMatch(/higher layer core\/export/);
    expect(messages).toMatch(/may not import '@svgdotjs\/svg.js'/);
    expect(messages).toMatch(/host globals/);
  });

  // Each planted violation: the file, its text, and what the message must say.
  const planted: [string, string, string, RegExp][] = [
    ['renderer: a Node built-in', 'renderer/src/a.ts', "import { readFileSync } from 'node:fs';\n", /renderer may not import the Node built-in 'node:fs'/],
    ['renderer: a bare Node built-in', 'renderer/src/a.ts', "import path from 'path';\n", /Node built-in 'path'/],
    ['renderer: Electron itself', 'renderer/src/a.ts', "import { ipcRenderer } from 'electron';\n", /renderer may not import 'electron'/],
    ['renderer: the shell', 'renderer/src/a.ts', "import { x } from '../../electron/shell.ts';\n", /electron\/ is another face/],
    ['renderer: the CLI', 'renderer/src/state/a.ts', "import { x } from '../../../cli/main.ts';\n", /cli\/ is another face/],
    ['renderer (.svelte): a core file past the entry', 'renderer/src/A.svelte', "<script lang=\"ts\">\n  import { m } from '../../core/line/model.ts';\n</script>\n", /only through its public entry core\/index.ts/],
    ['electron: the renderer', 'electron/a.ts', "import { x } from '../renderer/src/App.svelte';\n", /renderer\/ is another face/],
    ['electron: the CLI', 'electron/a.ts', "import { x } from '../cli/main.ts';\n", /cli\/ is another face/],
    ['electron: a core file past the entry', 'electron/a.ts', "import { m } from '../core/line/model.ts';\n", /public entry/],
    ['cli: the renderer', 'cli/a.ts', "import { x } from '../renderer/src/state/files.ts';\n", /renderer\/ is another face/],
    ['cli: Electron itself', 'cli/a.ts', "import { app } from 'electron';\n", /cli\/ may not import 'electron'/],
    ['cli: the shell UI', 'cli/a.ts', "import { x } from '../electron/menu.ts';\n", /only electron\/files\/ is plain Node/],
    ['cli: a core file past the entry', 'cli/commands/a.ts', "import { m } from '../../core/line/model.ts';\n", /public entry/],
    ['bridge: a Node built-in', 'bridge/a.ts', "import { readFile } from 'node:fs/promises';\n", /bridge\/ may not import the Node built-in/],
    ['bridge: a face', 'bridge/a.ts', "import { x } from '../electron/shell.ts';\n", /electron\/ is another face/],
    ['bridge: Electron itself', 'bridge/a.ts', "import { ipcMain } from 'electron';\n", /bridge\/ may not import 'electron'/],
  ];
  for (const [what, path, text, re] of planted) {
    it(`catches ${what}`, () => {
      const m = caught(path, text);
      expect(m.length).toBeGreaterThan(0);
      expect(m.join('\n')).toMatch(re);
    });
  }

  it('lets each face do what it is allowed', () => {
    const ok: [string, string][] = [
      ['renderer/src/a.ts', "import { x } from '../../core/index.ts';\nimport { C } from '../../bridge/contract.ts';\nimport { mount } from 'svelte';\n"],
      ['electron/a.ts', "import { app } from 'electron';\nimport { readFile } from 'node:fs/promises';\nimport { C } from '../bridge/contract.ts';\n"],
      ['cli/a.ts', "import { readFileSync } from 'node:fs';\nimport { w } from '../electron/files/atomic-write.ts';\nimport { x } from '../core/index.ts';\n"],
      ['bridge/a.ts', "import { L } from '../core/design/limits.ts';\nimport * as v from 'valibot';\n"],
    ];
    for (const [path, text] of ok) expect(caught(path, text)).toEqual([]);
  });
});
