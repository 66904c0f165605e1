// dxf-writer numbers DXF handles from a static counter in this module (no `exports` map, so a deep import).
// Resetting it before each drawing makes the output deterministic.
declare module 'dxf-writer/src/Handle.js' {
  const Handle: { seed: number; next(): string; peek(): string };
  export default Handle;
}
