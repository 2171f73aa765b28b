/**
 * V8 heap settings of the app's worker processes. A larger young generation: server
 * rendering and file checks make many short-lived objects, and the default semi-space had
 * the collector running several times per page. Benchmarks that run app code in their own
 * process use the same settings, so they time what the served app does.
 */
export const APP_HEAP_FLAGS = ["--max-semi-space-size=64"];
