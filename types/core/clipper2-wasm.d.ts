/**
 * clipper2-wasm 0.4.0 points its `types` field at a file it does not ship; the factory's real declarations are in
 * dist/clipper2z.d.ts. This ambient module gives the ES entry (the one that loads in Node, Vite and workers) that type.
 */
declare module 'clipper2-wasm/dist/es/clipper2z.js' {
  import type { Clipper2ZFactoryFunction } from 'clipper2-wasm/dist/clipper2z';
  const factory: Clipper2ZFactoryFunction;
  export default factory;
}
