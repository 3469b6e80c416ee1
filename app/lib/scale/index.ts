/**
 * The scale engine: pure TypeScript, runs in the browser and on the server.
 * See README.md in this folder for the rounding rule, the legibility defaults and the API.
 */
export * from "./compute";
export * from "./schema";
export * from "./format";
export * from "./legibility";
export * from "./numbering";
export * from "./warnings";
export * from "./ruler";
export * from "../units";
export { prepareRoute, positionsAt, positionsInto, positionAt, segmentLength, CHORD_LIMIT_M, type PreparedRoute, type RoutePosition, type RoutePositions } from "../geo/route";
export { geodesicInverse, geodesicDirect, type InverseResult, type DirectResult } from "../geo/geodesic";
export { parseGeoJsonRoute, parseGpxRoute, MAX_ROUTE_VERTICES, type RouteParseResult, type RouteIssue } from "../geo/parse";

import { computeScale, type ScaleResult } from "./compute";
import { parseScaleRequest, type ValidationError } from "./schema";

/** Validate and compute in one call: 200 with the result, or 400 with the validation error. */
export function scaleFromJson(
  body: unknown,
): { status: 200; body: ScaleResult } | { status: 400; body: { error: ValidationError } } {
  const parsed = parseScaleRequest(body);
  if (!parsed.ok) return { status: 400, body: { error: parsed.error } };
  return { status: 200, body: computeScale(parsed.request, { route: parsed.route }) };
}
