import { apiDocument } from "~/lib/api/openapi";
import { apiRead } from "~/utils/api.server";
import type { Route } from "./+types/openapi";

// GET /api/v1/openapi.json → the OpenAPI 3.1 document. Public: it describes the API, holds no shop data.
let cached: unknown;

export function loader({ request }: Route.LoaderArgs) {
  cached ??= apiDocument(new URL(request.url).origin);
  return apiRead(request, cached, "public, max-age=300");
}
