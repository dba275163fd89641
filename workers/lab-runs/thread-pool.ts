import { Worker } from "node:worker_threads";
import type { ChunkOutput } from "@/lib/lab-runs/kinds";
import type { ChunkReply, ChunkTask } from "./thread";

/** A chunk failed inside a thread; `name` is the physics error's name (e.g. NonFiniteResultError). */
export class ChunkError extends Error {
  constructor(
    readonly errorName: string,
    message: string,
  ) {
    super(message);
    this.name = "ChunkError";
  }
}

/**
 * A fixed set of compute threads; each runs one chunk at a time. A thread that dies is replaced,
 * and the chunk it held fails (the run then fails its attempt and the queue retries it).
 */
export class ThreadPool {
  private readonly idle: Worker[] = [];
  private readonly waiting: ((w: Worker) => void)[] = [];
  private readonly all = new Set<Worker>();

  constructor(
    private readonly file: URL,
    readonly size: number,
  ) {
    for (let i = 0; i < size; i++) this.idle.push(this.spawn());
  }

  private spawn(): Worker {
    const w = new Worker(this.file);
    w.unref();
    this.all.add(w);
    return w;
  }

  private acquire(): Promise<Worker> {
    const w = this.idle.pop();
    if (w) return Promise.resolve(w);
    return new Promise((resolve) => this.waiting.push(resolve));
  }

  private release(w: Worker): void {
    const next = this.waiting.shift();
    if (next) next(w);
    else this.idle.push(w);
  }

  async run(task: ChunkTask): Promise<ChunkOutput> {
    const w = await this.acquire();
    return new Promise<ChunkOutput>((resolve, reject) => {
      const onMessage = (reply: ChunkReply) => {
        cleanup();
        this.release(w);
        if (reply.ok) resolve(reply.output);
        else reject(new ChunkError(reply.name, reply.message));
      };
      const onExit = (code: number) => {
        cleanup();
        this.all.delete(w);
        this.release(this.spawn());
        reject(new Error(`compute thread stopped (exit code ${code})`));
      };
      const cleanup = () => {
        w.off("message", onMessage);
        w.off("exit", onExit);
        w.off("error", onError);
      };
      const onError = (e: Error) => {
        cleanup();
        this.all.delete(w);
        void w.terminate();
        this.release(this.spawn());
        reject(e);
      };
      w.on("message", onMessage);
      w.on("exit", onExit);
      w.on("error", onError);
      w.postMessage(task);
    });
  }

  async close(): Promise<void> {
    await Promise.all([...this.all].map((w) => w.terminate()));
    this.all.clear();
  }
}
