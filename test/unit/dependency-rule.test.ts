import { describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { checkDependencyRule } from '../../scripts/dependency-rule.ts';

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
});
