// The Content-Security-Policy of pages, built per response in proxy.ts (route handlers get a fixed
// one from next.config.mjs). Pure, so the unit tests can read it.

/** A fresh nonce per page response: 16 random bytes, base64 (what CSP's nonce-source allows). */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}

/**
 * The policy of every page. Scripts run only when they carry this response's nonce (Next puts it on
 * its own scripts after reading it back from the request's CSP header); 'strict-dynamic' lets those
 * load the app's chunks. Styles: the app ships stylesheets from /_next/static and renders no style
 * attributes (progress bars and the editor's cursor are SVG widths and classes), so no 'unsafe-inline'
 * is needed; the nonce covers any <style> Next inserts itself. `next dev` evaluates code for its
 * overlay and injects unnonced styles, so dev mode relaxes both; a production build never does.
 */
export function pageCsp(nonce: string, dev = false): string {
  const directives: Record<string, string[]> = {
    "default-src": ["'self'"],
    "script-src": ["'self'", `'nonce-${nonce}'`, "'strict-dynamic'", ...(dev ? ["'unsafe-eval'"] : [])],
    "style-src": dev ? ["'self'", "'unsafe-inline'"] : ["'self'", `'nonce-${nonce}'`],
    "img-src": ["'self'", "data:", "blob:"],
    "font-src": ["'self'"],
    "connect-src": ["'self'"],
    "object-src": ["'none'"],
    "base-uri": ["'none'"],
    "frame-ancestors": ["'none'"],
    "form-action": ["'self'"],
  };
  return Object.entries(directives)
    .map(([name, sources]) => `${name} ${sources.join(" ")}`)
    .join("; ");
}
