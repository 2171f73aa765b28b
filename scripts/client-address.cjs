/**
 * Loaded into every app server process (node --require) before Next starts: it decides, where
 * the connection arrives, which address a request comes from, and leaves exactly that one in
 * X-Forwarded-For for the app (sign-in and password-reset limits count per address).
 *
 * A client can send any X-Forwarded-For it likes, and Next passes a client's header through
 * unchanged, so the header is believed only as far as TRUSTED_PROXY_HOPS proxies in front
 * of the app vouch for it: with 0 the connection's own address counts; with N the Nth entry
 * from the end, the one the outermost trusted proxy appended.
 */
const http = require("node:http");

const trustedHops = Math.max(0, Math.min(5, Number.parseInt(process.env.TRUSTED_PROXY_HOPS ?? "0", 10) || 0));

function clientAddress(request) {
  const own = request.socket?.remoteAddress ?? "unknown";
  if (trustedHops === 0) return own;
  const header = request.headers["x-forwarded-for"];
  const hops = (Array.isArray(header) ? header.join(",") : (header ?? "")).split(",").map((hop) => hop.trim()).filter(Boolean);
  // Fewer entries than trusted proxies: the request skipped them, so its own address counts.
  return hops.length >= trustedHops ? hops[hops.length - trustedHops] : own;
}

const emit = http.Server.prototype.emit;
http.Server.prototype.emit = function emitWithClientAddress(event, request, ...rest) {
  if (event === "request" && request && request.headers) request.headers["x-forwarded-for"] = clientAddress(request);
  return emit.call(this, event, request, ...rest);
};
