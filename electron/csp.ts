/**
 * The one Content-Security-Policy of the app. The desktop shell sends it as a response header from its custom
 * protocol; the browser fallback server (scripts/serve.ts) and the e2e tests send the very same header, so the
 * renderer is tested under the policy it ships with.
 * 'wasm-unsafe-eval' lets the polygon engine (WebAssembly) compile; nothing else may evaluate code.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');
