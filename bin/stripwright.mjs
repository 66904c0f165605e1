#!/usr/bin/env node
// The installed `stripwright` command. The bundle is built by `npm ci`/`npm install` (the `prepare` script).
import { existsSync } from 'node:fs';
const bundle = new URL('../dist-cli/stripwright.mjs', import.meta.url);
if (!existsSync(bundle)) {
  process.stderr.write('stripwright: the command-line bundle is missing; run `npm run build:cli` in the project folder.\n');
  process.exit(1);
}
await import(bundle.href);
