/// <reference lib="webworker" />
// Spectrum web worker: exposes SpectrumWorkerApi (lib/compute/protocol.ts) through comlink.
import { expose } from "comlink";
import { createSpectrumWorkerApi } from "../lib/compute/worker-api";

expose(createSpectrumWorkerApi());
