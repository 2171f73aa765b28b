/**
 * The Content-Security-Policy every response carries. Scripts and styles come only from
 * this origin (Next's inline bootstrap and the charts' inline styles need 'unsafe-inline');
 * the browser may talk to this origin and to object storage (presigned uploads), nothing else.
 */
export function contentSecurityPolicy(options: { storageEndpoint?: string; development: boolean }): string {
  const storageOrigin = options.storageEndpoint ? new URL(options.storageEndpoint).origin : "";
  const directives: Record<string, string[]> = {
    "default-src": ["'self'"],
    "script-src": ["'self'", "'unsafe-inline'", ...(options.development ? ["'unsafe-eval'"] : [])],
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
