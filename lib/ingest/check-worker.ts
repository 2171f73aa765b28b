/**
 * The second thread's side of checking a large file (lib/ingest/check-thread.ts): it checks
 * one file's later part at a time, its bytes arriving in messages while they download.
 */
import { parentPort } from "node:worker_threads";
import { checkPart } from "./check-part";
import { partBuffers, type PartRequest } from "./checked-part";
import { ChunkQueue } from "./chunk-queue";

export type ToCheckThread =
  | { kind: "start"; job: number; request: PartRequest }
  | { kind: "bytes"; job: number; bytes: Uint8Array }
  | { kind: "end"; job: number }
  | { kind: "drop"; job: number };

const port = parentPort!;
let current: { job: number; bytes: ChunkQueue<Uint8Array> } | null = null;

port.on("message", (message: ToCheckThread) => {
  if (message.kind === "start") {
    const job = message.job;
    const bytes = new ChunkQueue<Uint8Array>();
    current = { job, bytes };
    const finished = () => {
      // Bytes still arriving for a part already refused are not kept.
      if (current?.job === job) current = null;
    };
    checkPart(message.request, bytes).then(
      (outcome) => {
        finished();
        port.postMessage({ kind: "done", job, outcome }, "part" in outcome ? partBuffers(outcome.part) : []);
      },
      (error: Error) => {
        finished();
        port.postMessage({ kind: "failed", job, message: error?.message ?? String(error) });
      },
    );
    return;
  }
  if (current?.job !== message.job) return;
  if (message.kind === "bytes") current.bytes.push(message.bytes);
  else if (message.kind === "end") current.bytes.end();
  else current.bytes.fail(new Error("the file was refused on its first part"));
});
