import { readFileSync, writeFileSync, readdirSync } from 'node:fs';
import { parseDesign, serializeDesign } from '../core/index.ts';
const dir = 'assets/examples';
for (const f of readdirSync(dir).filter((n) => n.endsWith('.json'))) {
  const r = parseDesign(readFileSync(`${dir}/${f}`, 'utf8'));
  if (!r.ok) throw new Error(f);
  writeFileSync(`${dir}/${f}`, serializeDesign(r.doc));
  console.log(f, r.doc.version);
}
