/** One year, the least browsers' HSTS preload lists accept. */
export const HSTS_MAX_AGE_SECONDS = 31_536_000;

/**
 * The headers every response carries (next.config.ts); pages get their Content-Security-Policy,
 * with a fresh nonce, from the proxy instead (proxy.ts), so it is not among these. Browsers ignore
 * Strict-Transport-Security on plain-HTTP answers (RFC 6797 §8.1), so sending it always is
 * harmless locally and protects every later visit once a browser has seen the HTTPS site.
 */
export function securityHeaders(): { key: string; value: string }[] {
  return [
    { key: "Strict-Transport-Security", value: `max-age=${HSTS_MAX_AGE_SECONDS}; includeSubDomains` },
    { key: "X-Content-Type-Options", value: "nosniff" },
    { key: "X-Frame-Options", value: "DENY" },
    { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
    { key: "Permissions-Policy", value: "camera=(self), geolocation=(self), microphone=()" },
  ];
}
