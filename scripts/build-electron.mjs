// Bundle the Electron main process and preload as CommonJS (the preload must be CJS under sandbox: true).
import { build } from 'esbuild';
await build({
  entryPoints: { main: 'electron/main.ts', preload: 'electron/preload.ts' },
  outdir: 'dist-electron',
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  external: ['electron'],
  outExtension: { '.js': '.cjs' },
  logLevel: 'warning',
});
