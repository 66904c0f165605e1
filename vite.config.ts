import { defineConfig } from 'vitest/config';
import { svelte } from '@sveltejs/vite-plugin-svelte';
import { svelteTesting } from '@testing-library/svelte/vite';

// One config for the renderer build and every vitest project.
export default defineConfig({
  root: 'renderer',
  base: './', // relative asset URLs: the desktop shell serves the bundle from its own protocol
  plugins: [svelte(), svelteTesting()],
  build: { outDir: '../dist/renderer', emptyOutDir: true, target: 'es2022' },
  worker: { format: 'es' },
  server: { host: '127.0.0.1', port: 5173 },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
  test: {
    root: '.',
    // Both cores: CI runs on a two-core machine and the default (cores - 1) leaves one idle.
    maxWorkers: 2,
    projects: [
      {
        extends: true,
        test: {
          name: 'core',
          root: '.',
          include: ['test/unit/**/*.test.ts', 'test/reference/**/*.test.ts', 'test/cli/**/*.test.ts', 'test/electron/**/*.test.ts', 'test/fuzz/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          setupFiles: ['test/setup/fast-check-seed.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'dom',
          root: '.',
          include: ['test/component/**/*.test.ts'],
          environment: 'happy-dom',
          testTimeout: 60_000,
          setupFiles: ['test/setup/fast-check-seed.ts'],
        },
      },
    ],
  },
});
