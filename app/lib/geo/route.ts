/**
 * Distances and positions along a route (a polyline of lon/lat vertices) on the WGS84 ellipsoid.
 *
 * Segment lengths. A segment's two vertices are turned into Earth-centred (ECEF) coordinates; the
 * straight chord c between them is exact (no polar or antimeridian singularity), and the arc is
 * recovered from the chord as for a curve of radius R:
 *
 *     s = 2R·asin(c / 2R) = c · (1 + c²/(24R²) + 3c⁴/(640R⁴) + …)
 *
 * with R² = M·N, the Gaussian mean radius of curvature at the segment (M meridional, N prime
 * vertical). The direction-dependent radius differs from √(MN) by at most e²/2 ≈ 0.34 %, so the
 * error of the correction term is below 0.7 % of c³/(24R²): under 0.01 mm for a 10 km segment,
 * and the geodesic differs from the normal section by far less. Segments whose chord exceeds
 * CHORD_LIMIT_M (10 km) are solved exactly with geodesicInverse.
 *
 * Positions. A marker at distance d is found in the cumulative distance array (computed once,
 * Float64Array; route-search.ts). Inside a short segment (chord under 100 m, within 80° of the
 * equator: nearly every segment of a walked or drawn trail) the point comes from the segment's terms
 * (route-segment.ts): latitude and longitude as second-order functions of the distance along the
 * geodesic, from the geodesic equations of the ellipsoid — within 1e-12 degree of GeographicLib.
 * Inside any other segment under CHORD_LIMIT_M the point is interpolated along the chord — with the
 * chord fraction corrected so that it corresponds to the arc fraction on a curve of radius R — and
 * projected along the ellipsoid normal back onto the surface (Bowring's closed form, exact on the
 * surface and within 1e-15 rad a few metres off it, where a chord point lies; the longitude and
 * latitude are the first vertex's plus two small angles, geodeticNear). Inside a long segment the
 * direct geodesic problem is solved from the segment start with the exact inverse azimuth. The
 * bearing is the direction of the chord projected onto the local horizontal plane (exact for a
 * sphere, where the chord lies in the plane of the great circle) — on a short segment by its terms,
 * to 1e-12 degree — or the exact geodesic azimuth for long segments.
 *
 * Speed. For a one-off computation prepareRoute keeps only the cumulative distances (fresh memory
 * costs about as much to touch as the arithmetic on it), and placing a marker works out its
 * segment's two ends and terms again, with the same operations the lengths were measured with. A
 * route prepared for repeated queries (the composer's preview) keeps a record per vertex — its
 * distance, degrees and its segment's terms side by side, 64 bytes — and every 64th distance in a
 * small table, so a marker on a short segment costs a search in memory its placing then reads and a
 * few multiplications. Both ways give identical numbers.
 *
 * The parts: ecef.ts (ECEF both ways), route-prepare.ts (measuring), route-segment.ts (a segment's
 * terms), route-search.ts (finding a distance's segment), route-positions.ts (placing markers).
 * Import from this module.
 */
export { CHORD_LIMIT_M, SEARCH_BLOCK, VERTEX_RECORD, prepareRoute, segmentLength, type PrepareOptions, type PreparedRoute } from "./route-prepare";
export { segmentIndexAt } from "./route-search";
export { positionAt, positionsAt, positionsInto, type RoutePosition, type RoutePositions } from "./route-positions";
export { ecefToGeodetic, ecefToGeodeticNear } from "./ecef";
