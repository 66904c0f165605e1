/**
 * The one Content-Security-Policy of the app. The desktop shell sends it as a response header from its custom
 * protocol; the browser fallback server (scripts/serve.ts) and the e2e tests send the very same header, so the
 * renderer is tested under the policy it ships with.
 * 'wasm-unsafe-eval' lets the polygon engine (WebAssembly) compile; nothing else may evaluate code. Workers come
 * from our own files only (Vite emits the compute worker as a file), images also from data: and blob: URLs (previews).
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');

/**
 * The policy sent with the compute worker's script (dedicated workers take the policy of their own response).
 * The polygon engine's generated bindings (Emscripten embind) build their call wrappers with `new Function`,
 * so the worker, and only the worker, may evaluate code. It has no DOM, may fetch only from the app itself (the .wasm file) and only
 * receives plain data messages from the page; the page itself keeps the strict policy above.
 */
export const WORKER_CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self' 'wasm-unsafe-eval' 'unsafe-eval'",
  "connect-src 'self'",
  "worker-src 'none'",
].join('; ');

/** Which policy a served file gets: worker scripts (Vite names them `*.worker-HASH.js`) get the worker policy. */
export function policyFor(path: string): string {
  return /\.worker-[\w-]+\.js$/.test(path) ? WORKER_CONTENT_SECURITY_POLICY : CONTENT_SECURITY_POLICY;
}
