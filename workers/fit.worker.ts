/// <reference lib="webworker" />
// Fit web worker: exposes FitWorkerApi (lib/fit/worker-api.ts) through comlink.
import { expose } from "comlink";
import { createFitWorkerApi } from "../lib/fit/worker-api";

expose(createFitWorkerApi());
