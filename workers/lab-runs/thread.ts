/*
 * One compute thread of a lab-run worker (worker_threads): computes the chunks the worker's main
 * thread sends with the same lib/physics code as the browser, and posts the columns back as
 * transferred buffers. The payload is parsed once per run and kept while chunks of it arrive.
 */
import { parentPort } from "node:worker_threads";
import { runKindHandler, type ChunkOutput, type RunChunk } from "@/lib/lab-runs/kinds";

export interface ChunkTask {
  runId: string;
  kind: string;
  payload: unknown;
  chunk: RunChunk;
}

export type ChunkReply = { ok: true; output: ChunkOutput } | { ok: false; name: string; message: string };

let cached: { runId: string; payload: unknown } | null = null;

parentPort?.on("message", (task: ChunkTask) => {
  try {
    const handler = runKindHandler(task.kind);
    if (!handler) throw new Error(`unknown run kind ${task.kind}`);
    if (cached?.runId !== task.runId) cached = { runId: task.runId, payload: handler.payloadSchema.parse(task.payload) };
    const output = handler.compute(cached.payload, task.chunk);
    const transfer = [
      ...Object.values(output.columns).map((c) => c.buffer as ArrayBuffer),
      ...(output.flags ? [output.flags.buffer as ArrayBuffer] : []),
    ];
    parentPort!.postMessage({ ok: true, output } satisfies ChunkReply, transfer);
  } catch (error) {
    const e = error instanceof Error ? error : new Error(String(error));
    parentPort!.postMessage({ ok: false, name: e.name, message: e.message } satisfies ChunkReply);
  }
});
