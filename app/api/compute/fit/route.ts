import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { computeFitQuerySchema, computeFitSchema } from "@/lib/contracts/compute";
import { validationError } from "@/lib/contracts/errors";
import { fitNow } from "@/lib/lab-runs/compute-now";

/**
 * POST /api/compute/fit[?shareIntervals=true] (any signed-in caller or API token) → { engineVersion,
 * computeMs, result }, result being the fit's JSON as `npm run fit` prints it (lib/fit/output.ts).
 * The body is the fit's request (lib/fit/schema.ts, as the workbench and `npm run fit` send it); a
 * fit of more points than the synchronous limit is refused with 413 payload_too_large.
 */
export const POST = apiRoute(async (request) => {
  await requireCaller(request);
  const search = new URL(request.url).searchParams;
  const query = computeFitQuerySchema.safeParse(Object.fromEntries(search.entries()));
  if (!query.success) throw validationError(query.error);
  const body = await readJson(request, computeFitSchema);
  return json(fitNow(body, query.data));
});
