/**
 * Stripwright core: the pure TypeScript library under every face (renderer, CLI, desktop shell).
 * No DOM, Node built-ins, Electron or Svelte here; see DEVELOPERS.md for the layer order.
 */
export * from './util/errors.ts';
export * from './util/warnings.ts';
export * from './units/index.ts';
export * from './substrate/index.ts';
export * from './line/index.ts';
export * from './section/index.ts';
export * from './discontinuity/index.ts';
export * from './geometry/index.ts';
export * from './design/index.ts';
export * from './layout/index.ts';
export * from './network/index.ts';
export * from './yield/index.ts';
export * from './blocks/index.ts';
export * from './toolpath/index.ts';
export * from './export/index.ts';
export * from './pipeline/index.ts';
