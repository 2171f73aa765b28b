import "server-only";
import { processMailQueueOnce } from "@/lib/mail/queue";

interface WorkerState {
  started: boolean;
  wake?: () => void;
  lastErrorLogged: number;
}

// Next bundles a module once per route; the state lives on globalThis so there is one worker.
const holder = globalThis as unknown as { hoebenchMailWorker?: WorkerState };
const state = (holder.hoebenchMailWorker ??= { started: false, lastErrorLogged: 0 });

const POLL_MS = 2000;

/**
 * Sends queued mail in the background of this app server. It is quiet: outcomes are recorded
 * on the queue rows (the admin mail queue page shows them); only an unreachable database is
 * logged, at most once a minute.
 */
export function startMailWorker(): void {
  if (state.started) return;
  state.started = true;
  void (async () => {
    for (;;) {
      let busy = false;
      try {
        const outcome = await processMailQueueOnce();
        busy = outcome.claimed > 0 && outcome.retrying === 0;
      } catch (error) {
        if (Date.now() - state.lastErrorLogged > 60_000) {
          state.lastErrorLogged = Date.now();
          console.error("mail worker: could not read the queue", error instanceof Error ? error.message : error);
        }
      }
      if (busy) continue;
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, POLL_MS);
        timer.unref?.();
        state.wake = () => {
          clearTimeout(timer);
          resolve();
        };
      });
      state.wake = undefined;
    }
  })();
}

/** Asks this server's worker (if it runs here) to look at the queue now rather than at its next poll. */
export function wakeMailWorker(): void {
  setTimeout(() => state.wake?.(), 50).unref?.();
}
