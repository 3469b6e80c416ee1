/**
 * POST /api/scale — the scale engine as a JSON resource route. The domain logic lives in
 * app/lib/scale; this module reads the body (with a size limit), validates and answers.
 */
import type { Route } from "./+types/api.scale";
import { computeScale, parseScaleRequest } from "~/lib/scale";
import { DEPTH_MESSAGE, nestingExceeds } from "~/lib/geo/parse";
import { MAX_GEOJSON_DEPTH } from "~/lib/limits";
import { BodyTooLargeError, jsonError, jsonResponse, readBodyBytes, jsonOnError } from "#server/http.server.ts";

/** Largest accepted request body: 5 MB. */
export const MAX_BODY_BYTES = 5 * 1024 * 1024;

const ALLOW_POST = { Allow: "POST" };

function invalid(status: number, message: string, extra: Record<string, string> = {}): Response {
  return jsonError(status, message, extra, []);
}

async function actionBody({ request }: Route.ActionArgs) {
  if (request.method !== "POST") {
    return invalid(405, `Method ${request.method} is not allowed; POST a JSON scale request.`, ALLOW_POST);
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8").decode(await readBodyBytes(request, MAX_BODY_BYTES));
  } catch (err) {
    if (err instanceof BodyTooLargeError) {
      return invalid(413, `The request body is larger than ${MAX_BODY_BYTES / (1024 * 1024)} MB. Simplify the route (fewer vertices) or send fewer markers.`);
    }
    return invalid(400, "The request body could not be read.");
  }
  if (text.trim() === "") {
    return invalid(400, "The request body is empty; send a JSON scale request.");
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch (err) {
    return invalid(400, `The request body is not valid JSON: ${(err as Error).message}`);
  }
  if (nestingExceeds(body, MAX_GEOJSON_DEPTH)) return invalid(400, `route: ${DEPTH_MESSAGE}`);
  const parsed = parseScaleRequest(body);
  if (!parsed.ok) return jsonResponse(400, { error: parsed.error });
  try {
    return jsonResponse(200, computeScale(parsed.request, { route: parsed.route }));
  } catch (err) {
    return invalid(400, (err as Error).message);
  }
}

export function loader(_args: Route.LoaderArgs) {
  return invalid(405, "Use POST with a JSON scale request; GET is not supported on /api/scale.", ALLOW_POST);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const action = jsonOnError(actionBody);
