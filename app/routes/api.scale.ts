/**
 * POST /api/scale — the scale engine as a JSON resource route. The domain logic lives in
 * app/lib/scale; this module reads the body (with a size limit), validates and answers.
 */
import type { Route } from "./+types/api.scale";
import { computeScale, parseScaleRequest } from "~/lib/scale";
import { BodyTooLargeError, readBodyBytes } from "#server/http.server.ts";

/** Largest accepted request body: 5 MB. */
export const MAX_BODY_BYTES = 5 * 1024 * 1024;

const JSON_HEADERS = { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "no-store" };

function json(status: number, body: unknown, extra: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { ...JSON_HEADERS, ...extra } });
}

function errorBody(message: string, issues: { path: string; message: string }[] = []) {
  return { error: { message, issues } };
}

export async function action({ request }: Route.ActionArgs) {
  if (request.method !== "POST") {
    return json(405, errorBody(`Method ${request.method} is not allowed; POST a JSON scale request.`), { Allow: "POST" });
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8").decode(await readBodyBytes(request, MAX_BODY_BYTES));
  } catch (err) {
    if (err instanceof BodyTooLargeError) {
      return json(
        413,
        errorBody(`The request body is larger than ${MAX_BODY_BYTES / (1024 * 1024)} MB. Simplify the route (fewer vertices) or send fewer markers.`),
      );
    }
    return json(400, errorBody("The request body could not be read."));
  }
  if (text.trim() === "") {
    return json(400, errorBody("The request body is empty; send a JSON scale request."));
  }
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch (err) {
    return json(400, errorBody(`The request body is not valid JSON: ${(err as Error).message}`));
  }
  const parsed = parseScaleRequest(body);
  if (!parsed.ok) return json(400, { error: parsed.error });
  try {
    return json(200, computeScale(parsed.request, { route: parsed.route }));
  } catch (err) {
    return json(400, errorBody((err as Error).message));
  }
}

export function loader(_args: Route.LoaderArgs) {
  return json(405, errorBody("Use POST with a JSON scale request; GET is not supported on /api/scale."), { Allow: "POST" });
}
