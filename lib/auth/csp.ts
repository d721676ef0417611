// Content-Security-Policy of the pages, built per request with a fresh nonce by proxy.ts (Next 16's guide "How to set
// a Content Security Policy": Next reads the nonce from the request's CSP header and puts it on its own scripts).
//
// What remains inline, and why:
// - style-src 'unsafe-inline': React writes style="" attributes into server-rendered HTML (progress bars, chart
//   widths) and D3 sets styles on chart elements. Attributes cannot carry a nonce, and a nonce in style-src would make
//   browsers ignore 'unsafe-inline'. Styles cannot run code; scripts are what the nonce protects.
// - 'unsafe-eval' only in `next dev` (React's dev tooling evaluates code); never in production.
// Everything else is nonce-only: an inline <script> without this request's nonce does not run, and 'strict-dynamic'
// lets only scripts loaded by nonce'd scripts (Next's chunks) load more.
export function pageCsp(nonce: string, opts: { dev: boolean; https: boolean }): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(opts.https ? ['upgrade-insecure-requests'] : []),
  ].join('; ');
}

/** 128 random bits, base64 (the guide's recipe: a random UUID, base64-encoded). */
export function newNonce(): string {
  return Buffer.from(crypto.randomUUID()).toString('base64');
}

/** API answers are JSON, never documents: nothing may load or run if one is opened as a page. */
export const API_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
