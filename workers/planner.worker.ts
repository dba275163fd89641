/// <reference lib="webworker" />
// Planner web worker: exposes PlannerWorkerApi (lib/planner/worker-api.ts) through comlink.
import { expose } from "comlink";
import { createPlannerWorkerApi } from "../lib/planner/worker-api";

expose(createPlannerWorkerApi());
