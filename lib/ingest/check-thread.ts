import { Worker } from "node:worker_threads";
import type { PartOutcome, PartRequest } from "./checked-part";
import type { ToCheckThread } from "./check-worker";

type FromCheckThread = { kind: "done"; job: number; outcome: PartOutcome } | { kind: "failed"; job: number; message: string };

/** A file's later part on its way to the second thread; the outcome arrives once the part ends. */
export interface PartJob {
  /** The part's bytes, in order. */
  send(bytes: Uint8Array): void;
  end(): void;
  /** The file was refused on its first part: the answer is no longer wanted. */
  drop(): void;
  outcome: Promise<PartOutcome>;
}

/** After this many failures the thread is given up, and files are checked on one thread. */
const MAX_FAILURES = 3;

let thread: Worker | null = null;
let failures = 0;
/** The job the thread is working on (one at a time), until it answers for it. */
let activeJob: number | null = null;
let nextJob = 1;
const waiting = new Map<number, { resolve: (outcome: PartOutcome) => void; reject: (error: Error) => void }>();

function threadFailed(error: Error): void {
  failures += 1;
  process.stderr.write(`[hoebench] the file-checking thread failed (${error.message}); files are checked on one thread meanwhile\n`);
  thread = null;
  activeJob = null;
  for (const pending of waiting.values()) pending.reject(error);
  waiting.clear();
}

function checkThread(): Worker | null {
  if (thread || failures >= MAX_FAILURES) return thread;
  // In the app, the bundler builds the thread's module (the URL form tells it to); run from
  // source (scripts, tests), the thread needs a TypeScript loader of its own. The bundle keeps
  // import.meta.url pointing at the source, so Next's own marker tells the two apart.
  const fromSource = !process.env.NEXT_RUNTIME;
  let started: Worker;
  try {
    started = new Worker(new URL("./check-worker.ts", import.meta.url), {
      execArgv: fromSource ? ["--require", "tsx/cjs"] : [],
    });
  } catch (error) {
    threadFailed(error as Error);
    return null;
  }
  started.unref();
  started.on("message", (message: FromCheckThread) => {
    // A thread given up on has had its jobs failed already.
    if (thread !== started) return;
    if (message.job === activeJob) activeJob = null;
    const pending = waiting.get(message.job);
    waiting.delete(message.job);
    if (!pending) return;
    if (message.kind === "done") pending.resolve(message.outcome);
    else pending.reject(new Error(message.message));
  });
  started.on("error", (error) => threadFailed(error));
  started.on("messageerror", (error) => {
    threadFailed(error);
    void started.terminate();
  });
  started.on("exit", (code) => {
    if (thread === started) threadFailed(new Error(`it stopped with code ${code}`));
  });
  thread = started;
  return thread;
}

/**
 * Whether large files are being checked on two threads: "idle" before the first large file
 * (the thread starts with it), "running" once started, "failed" after it could not run (files
 * are then checked on one thread; the server log says why).
 */
export function checkThreadState(): "idle" | "running" | "failed" {
  if (thread) return "running";
  return failures > 0 ? "failed" : "idle";
}

/**
 * The second thread for one file's later part, or null when it is checking another file (or
 * cannot run): the caller then checks the whole file itself.
 */
export function claimCheckThread(request: PartRequest): PartJob | null {
  if (activeJob !== null) return null;
  const worker = checkThread();
  if (!worker) return null;
  const job = nextJob++;
  activeJob = job;
  const outcome = new Promise<PartOutcome>((resolve, reject) => waiting.set(job, { resolve, reject }));
  outcome.catch(() => {});
  const post = (message: ToCheckThread, transfer: ArrayBuffer[] = []) => worker.postMessage(message, transfer);
  post({ kind: "start", job, request });
  return {
    send(bytes) {
      // A copy the thread owns (a Buffer's slice() would share, and the transfer would empty, the pool it came from).
      const copy = new Uint8Array(bytes);
      post({ kind: "bytes", job, bytes: copy }, [copy.buffer as ArrayBuffer]);
    },
    end: () => post({ kind: "end", job }),
    drop() {
      post({ kind: "drop", job });
      waiting.get(job)?.reject(new Error("dropped"));
      waiting.delete(job);
    },
    outcome,
  };
}
