const loopbackHosts = new Set(["127.0.0.1", "localhost", "::1", "[::1]"]);

/** Tests wipe and rewrite data: they must never reach a database on another machine. */
export function assertLoopbackDatabase(databaseUrl: string): void {
  let host: string;
  try {
    host = new URL(databaseUrl).hostname;
  } catch {
    throw new Error("the test database URL is not a valid URL");
  }
  if (!loopbackHosts.has(host) && !/^127\.\d+\.\d+\.\d+$/.test(host)) {
    throw new Error(`refusing to run tests against a database on ${host}: only loopback databases are allowed`);
  }
}
