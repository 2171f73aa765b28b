import { spawn, type ChildProcess } from "node:child_process";
import net from "node:net";
import { say } from "./log";

const children: ChildProcess[] = [];
const cleanups: (() => void)[] = [];
let stopping = false;

export function startChild(name: string, command: string, args: string[], env: Record<string, string>, cwd: string): ChildProcess {
  const child = spawn(command, args, { cwd, env: { ...process.env, ...env }, stdio: ["ignore", "inherit", "inherit"], detached: true });
  children.push(child);
  child.on("exit", (code, signal) => {
    if (!stopping) {
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
export function shutdown(exitCode: number): never {
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
