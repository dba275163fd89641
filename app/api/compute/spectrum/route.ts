import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { computeSpectrumSchema } from "@/lib/contracts/compute";
import { computeNow } from "@/lib/lab-runs/compute-now";

/**
 * POST /api/compute/spectrum (any signed-in caller or API token) → ComputeResultBody. The body is a
 * spectrum lab run's payload; a small one is computed at once, a larger one refused with 413
 * payload_too_large and a pointer to POST /api/runs (lib/contracts/compute.ts has the limits).
 */
export const POST = apiRoute(async (request) => {
  await requireCaller(request);
  const payload = await readJson(request, computeSpectrumSchema);
  return json(computeNow("spectrum", payload));
});
