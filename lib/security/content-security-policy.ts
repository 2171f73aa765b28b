/**
 * The Content-Security-Policy of every page. Scripts run only when they carry this response's
 * nonce (Next puts it on its own inline bootstrap and chunk scripts) or are loaded by such a
 * script ('strict-dynamic'); no other inline script runs. Styles may be inline (the charts set
 * theirs at run time). The browser may talk to this origin and to object storage (presigned
 * uploads), nothing else. Without a nonce (answers that are not pages) no script runs at all.
 */
export function contentSecurityPolicy(options: { storageEndpoint?: string; development: boolean; nonce?: string }): string {
  const storageOrigin = options.storageEndpoint ? new URL(options.storageEndpoint).origin : "";
  const directives: Record<string, string[]> = {
    "default-src": ["'self'"],
    "script-src": [
      "'self'",
      ...(options.nonce ? [`'nonce-${options.nonce}'`, "'strict-dynamic'"] : []),
      // The development server evaluates its hot-reload code.
      ...(options.development ? ["'unsafe-eval'"] : []),
    ],
    "style-src": ["'self'", "'unsafe-inline'"],
    "img-src": ["'self'", "data:", "blob:"],
    "font-src": ["'self'", "data:"],
    "connect-src": ["'self'", ...(storageOrigin ? [storageOrigin] : [])],
    "frame-src": ["'self'"],
    "worker-src": ["'self'", "blob:"],
    "object-src": ["'none'"],
    "base-uri": ["'self'"],
    "form-action": ["'self'"],
    "frame-ancestors": ["'none'"],
  };
  return Object.entries(directives)
    .map(([name, values]) => `${name} ${values.join(" ")}`)
    .join("; ");
}
