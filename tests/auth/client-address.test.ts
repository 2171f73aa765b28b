import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";

const preload = path.join(process.cwd(), "scripts/client-address.cjs");
const servers: ChildProcess[] = [];

/** A bare server with the preload, answering with the X-Forwarded-For the app would see. */
async function echoServer(trustedHops: string): Promise<string> {
  const child = spawn(
    process.execPath,
    ["--require", preload, "-e", `require("node:http").createServer((q, s) => s.end(String(q.headers["x-forwarded-for"]))).listen(0, "127.0.0.1", function () { console.log(this.address().port); });`],
    { env: { ...process.env, TRUSTED_PROXY_HOPS: trustedHops }, stdio: ["ignore", "pipe", "inherit"] },
  );
  servers.push(child);
  const port = await new Promise<string>((resolve) => child.stdout!.once("data", (chunk: Buffer) => resolve(chunk.toString().trim())));
  return `http://127.0.0.1:${port}/`;
}

const seenAs = async (url: string, forwarded?: string) => (await fetch(url, { headers: forwarded ? { "x-forwarded-for": forwarded } : {} })).text();

describe("the client address a request is counted under", () => {
  it("is the connection's own address when no proxy is trusted, whatever the client claims", async () => {
    const url = await echoServer("0");
    expect(await seenAs(url)).toBe("127.0.0.1");
    expect(await seenAs(url, "203.0.113.9")).toBe("127.0.0.1");
  });

  it("is the entry the trusted proxy appended, not the ones the client sent before it", async () => {
    const url = await echoServer("1");
    expect(await seenAs(url, "203.0.113.9, 198.51.100.4")).toBe("198.51.100.4");
    expect(await seenAs(url, "198.51.100.4")).toBe("198.51.100.4");
    // Past no proxy at all: the connection's own address.
    expect(await seenAs(url)).toBe("127.0.0.1");
  });
});

afterAll(() => {
  for (const server of servers) server.kill();
});
