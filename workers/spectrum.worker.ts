/// <reference lib="webworker" />
// Spectrum web worker: exposes SpectrumWorkerApi (lib/compute/protocol.ts) through comlink.
import { expose } from "comlink";
import { createSpectrumWorkerApi, messageYield } from "../lib/compute/worker-api";

expose(createSpectrumWorkerApi({ yieldToEventLoop: messageYield() }));
