/**
 * The address a request is counted under for rate limits. The app server decides it where the
 * connection arrives and leaves exactly one entry in X-Forwarded-For (scripts/client-address.cjs,
 * TRUSTED_PROXY_HOPS); the last entry is taken so that a server started without that preload
 * (next dev) at least uses the hop nearest to it.
 */
export function clientAddressFrom(forwardedFor: string | string[] | null | undefined): string {
  const joined = Array.isArray(forwardedFor) ? forwardedFor.join(",") : (forwardedFor ?? "");
  return joined.split(",").map((hop) => hop.trim()).filter(Boolean).at(-1) ?? "unknown";
}
