// Bundle the CLI (cli/main.ts + core/) into dist-cli/stripwright.mjs; packages stay external (clipper2-wasm loads its .wasm from node_modules).
import { build } from 'esbuild';
await build({
  entryPoints: ['cli/main.ts'],
  outfile: 'dist-cli/stripwright.mjs',
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  packages: 'external',
  logLevel: 'warning',
  banner: { js: '// Built by scripts/build-cli.mjs from cli/ and core/. Do not edit.' },
});
