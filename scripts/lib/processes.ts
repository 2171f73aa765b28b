import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import net from "node:net";
import { say } from "./log";

const children: ChildProcess[] = [];
const cleanups: (() => void)[] = [];
let stopping = false;

/** A critical child's exit ends the run; a test run's fakes may be stopped and restarted by fault tests. */
export function startChild(name: string, command: string, args: string[], env: Record<string, string>, cwd: string, critical = true): ChildProcess {
  // Children write to stderr: stdout carries only what the command answers with (a summary, a JSON line).
  const child = spawn(command, args, { cwd, env: { ...process.env, ...env }, stdio: ["ignore", 2, 2], detached: true });
  children.push(child);
  child.on("exit", (code, signal) => {
    if (!stopping && critical) {
      say(`${name} stopped (${signal ?? `exit ${code}`}); shutting down`);
      shutdown(1);
    }
  });
  return child;
}

export function onShutdown(cleanup: () => void): void {
  cleanups.push(cleanup);
}

/** Stops what this run started, children first (whole process groups), then the database. */
export function shutdown(exitCode: number, finalLine?: string): never {
  stopping = true;
  for (const child of children) {
    if (child.pid && child.exitCode === null) {
      try {
        process.kill(-child.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
  }
  for (const cleanup of cleanups.reverse()) cleanup();
  // The test summary must be the very last line, after any clean-up messages.
  if (finalLine) process.stdout.write(`${finalLine}\n`);
  process.exit(exitCode);
}

export function stopChildren(): void {
  stopping = true;
  for (const child of children) {
    if (child.pid && child.exitCode === null) {
      try {
        process.kill(-child.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
  }
}

export function portOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: "127.0.0.1", port });
    socket.once("connect", () => {
      socket.destroy();
      resolve(true);
    });
    socket.once("error", () => resolve(false));
  });
}

export async function waitFor(what: string, check: () => Promise<boolean>, timeoutMs = 120_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`${what} did not come up within ${Math.round(timeoutMs / 1000)} s`);
}

export async function httpOk(url: string): Promise<boolean> {
  try {
    const response = await fetch(url, { signal: AbortSignal.timeout(5000) });
    return response.ok;
  } catch {
    return false;
  }
}

/** Stops whatever listens on these loopback ports (a test run's fakes left from an earlier run). */
export async function stopListeners(ports: number[]): Promise<void> {
  const pidsOf = () => {
    const pids = new Set<number>();
    for (const port of ports) {
      const output = spawnSync("ss", ["-ltnpH", `sport = :${port}`], { encoding: "utf8" }).stdout ?? "";
      for (const match of output.matchAll(/pid=(\d+)/g)) pids.add(Number(match[1]));
    }
    return pids;
  };
  for (const pid of pidsOf()) {
    try {
      process.kill(pid, "SIGTERM");
    } catch {
      // already gone
    }
  }
  for (let attempt = 0; attempt < 50 && pidsOf().size > 0; attempt += 1) await new Promise((resolve) => setTimeout(resolve, 100));
}
