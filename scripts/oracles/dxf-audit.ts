/**
 * Runs scripts/oracles/audit_dxf.py (ezdxf strict load + audit) on DXF text with Debian's own python3
 * (`PATH="$(getconf PATH)"`: a pyenv/venv python3 earlier on PATH cannot import Debian's ezdxf).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface DxfAudit {
  strict: boolean; strict_error: string | null; version: string; insunits: number; measurement: number;
  audit_errors: string[]; audit_fixes: string[]; layers: string[];
  entities: { type: string; layer: string; closed?: boolean; points?: number[][]; center?: number[]; radius?: number }[];
}

const HERE = import.meta.dirname;
let dir: string | null = null;

export function ezdxfAudit(text: string, name = 'x.dxf'): { code: number | null; report: DxfAudit } {
  dir ??= mkdtempSync(join(tmpdir(), 'sw-dxf-'));
  const file = join(dir, name);
  writeFileSync(file, text);
  const path = spawnSync('getconf', ['PATH'], { encoding: 'utf8' }).stdout.trim();
  const r = spawnSync('python3', [join(HERE, 'audit_dxf.py'), file], { encoding: 'utf8', env: { ...process.env, PATH: path } });
  if (r.stdout.trim() === '') throw new Error(`audit_dxf.py gave no output: ${r.stderr}`);
  return { code: r.status, report: JSON.parse(r.stdout) as DxfAudit };
}
