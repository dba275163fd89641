import { buildOpenApiDocument } from "@/lib/api-docs/document";
import { apiRoute, json } from "@/lib/api/route";

// Built once per server process: it depends only on the code.
let document: ReturnType<typeof buildOpenApiDocument> | null = null;

/** GET /api/openapi.json (public) → the OpenAPI 3.1 description of this API, from lib/api-docs/registry.ts. */
export const GET = apiRoute(async () => {
  document ??= buildOpenApiDocument();
  return json(document);
});
