import { expose } from "comlink";
import { afterEach } from "vitest";
import { SpectrumPool } from "@/lib/compute/spectrum-pool";
import { createSpectrumWorkerApi } from "@/lib/compute/worker-api";

/**
 * Pools whose "workers" are the worker API over in-process message channels (no Worker threads),
 * disposed after each test of the calling file.
 */
export function inProcessPools(): (size: number) => SpectrumPool {
  const pools: SpectrumPool[] = [];
  afterEach(() => {
    for (const p of pools.splice(0)) p.dispose();
  });
  return (size) => {
    const pool = new SpectrumPool({
      size,
      createWorker: () => {
        const { port1, port2 } = new MessageChannel();
        expose(createSpectrumWorkerApi({ chunkMs: 1 }), port2);
        return Object.assign(port1, {
          terminate: () => {
            port1.close();
            port2.close();
          },
        }) as unknown as Worker;
      },
    });
    pools.push(pool);
    return pool;
  };
}
