import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { computeFitSchema } from "@/lib/contracts/compute";
import { fitNow } from "@/lib/lab-runs/compute-now";

/**
 * POST /api/compute/fit (any signed-in caller or API token) → { engineVersion, computeMs, result }.
 * The body is the fit's request (lib/fit/schema.ts, as the workbench and `npm run fit` send it); a
 * fit of more points than the synchronous limit is refused with 413 payload_too_large.
 */
export const POST = apiRoute(async (request) => {
  await requireCaller(request);
  const body = await readJson(request, computeFitSchema);
  return json(fitNow(body));
});
