// points.gpx: GPX 1.1 (https://www.topografix.com/GPX/1/1/) for handheld GPS units and phone apps.
// One `wpt` per marker (a short name such as "07 Cambrian", the full label, age and source in
// `desc`, `ele` where the route has elevations, a `link` to the marker's visitor page when
// published) and the route as one `trk`. Coordinates are written exactly as the schedule CSV writes
// them (7 decimals). Every text goes through one writer (`el`) that escapes it and drops characters
// XML 1.0 cannot carry, so no label or source can break the document.
import type { PublicationSnapshot } from "../publication/types";
import { DRAFT_NOTICE, exhibitPageUrl, markerDescription, markerPageUrl, placedMarkers, statusLine, waypointName, type CrewFileOptions } from "./common";
import { bboxOf } from "./geojson";

export const GPX_NAMESPACE = "http://www.topografix.com/GPX/1/1";
const XSI = "http://www.w3.org/2001/XMLSchema-instance";

/** Markup made by `el` (already escaped). Plain strings given to `el` are always text. */
class Markup {
  constructor(readonly text: string) {}
}

// Characters outside XML 1.0's Char production (controls other than tab/newline/return, lone surrogates, U+FFFE/U+FFFF).
// eslint-disable-next-line no-control-regex
const NOT_XML_CHAR = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** Text or attribute value, escaped for XML (both quote kinds, so it is safe in either place). */
export function escapeXml(value: string): string {
  return value
    .replace(NOT_XML_CHAR, "")
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&apos;");
}

type Child = Markup | string | null | undefined | false;

/** An element: attributes with null/undefined values are left out; string children are escaped text. */
function el(name: string, attrs: Record<string, string | null | undefined>, ...children: Child[]): Markup {
  const a = Object.entries(attrs)
    .filter((e): e is [string, string] => e[1] != null)
    .map(([k, v]) => ` ${k}="${escapeXml(v)}"`)
    .join("");
  const body = children.map((c) => (c instanceof Markup ? c.text : c ? escapeXml(c) : "")).join("");
  return new Markup(body === "" ? `<${name}${a}/>` : `<${name}${a}>${body}</${name}>`);
}

/** Degrees as the schedule CSV writes them; GPX longitude is −180 ≤ lon < 180. */
export const latText = (lat: number) => lat.toFixed(7);
export const lonText = (lon: number) => (lon >= 180 ? lon - 360 : lon).toFixed(7);
const eleText = (e: number) => String(Number(e.toFixed(2)));

function link(href: string | null, text: string): Markup | null {
  return href ? el("link", { href }, el("text", {}, text)) : null;
}

/** The GPX 1.1 document of a route exhibit's markers and route (throws for a straight length). */
export function pointsGpx(snapshot: PublicationSnapshot, options: CrewFileOptions): string {
  const medium = snapshot.medium;
  if (medium.kind !== "route") throw new Error("pointsGpx: only route exhibits have marker points");
  const draft = options.draft || !options.publication;
  const markers = placedMarkers(snapshot);
  const largest = Math.max(0, ...snapshot.markers.map((m) => m.signNumber));
  const route = medium.geometry.coordinates;
  const [minLon, minLat, maxLon, maxLat] = bboxOf([...route, ...markers.map((m) => [m.position.lon, m.position.lat])], false);
  const title = draft ? `${snapshot.exhibit.title} (${DRAFT_NOTICE})` : snapshot.exhibit.title;
  const metadata = el(
    "metadata",
    {},
    el("name", {}, title),
    el("desc", {}, [statusLine(snapshot, options), `Scale: ${snapshot.scale.statement.lengthPerTime}.`, `Ages: ${snapshot.edition.label}.`, ...snapshot.cautions].join(" ")),
    el("author", {}, el("name", {}, snapshot.organisation.name)),
    link(exhibitPageUrl(snapshot, options), "Visitor page"),
    draft ? null : el("time", {}, options.publication!.publishedAt),
    el("keywords", {}, draft ? `${DRAFT_NOTICE}, geological time, exhibit markers` : `publication ${options.publication!.number}, geological time, exhibit markers`),
    el("bounds", { minlat: latText(minLat), minlon: lonText(minLon), maxlat: latText(maxLat), maxlon: lonText(maxLon) }),
  );
  const waypoints = markers.map((m) =>
    el(
      "wpt",
      { lat: latText(m.position.lat), lon: lonText(m.position.lon) },
      m.position.elevationMetres === null ? null : el("ele", {}, eleText(m.position.elevationMetres)),
      el("name", {}, waypointName(m, largest)),
      draft ? el("cmt", {}, DRAFT_NOTICE) : null,
      el("desc", {}, markerDescription(snapshot, m)),
      el("src", {}, draft ? `Eonscale, ${snapshot.exhibit.slug} working copy (${DRAFT_NOTICE})` : `Eonscale, ${snapshot.exhibit.slug} publication ${options.publication!.number}`),
      link(markerPageUrl(snapshot, m, options), `Sign ${m.signNumber}: ${m.label}`),
      el("type", {}, m.kind === "boundary" ? "Boundary marker" : m.kind === "event" ? "Event marker" : "Marker"),
    ),
  );
  const track = el(
    "trk",
    {},
    el("name", {}, snapshot.exhibit.title),
    el("desc", {}, `The exhibit's route, ${medium.lengthMetres.toFixed(1)} m on the WGS84 ellipsoid; the oldest age is at its ${medium.start === "older" ? "first" : "last"} point.${draft ? ` ${DRAFT_NOTICE}.` : ""}`),
    el("trkseg", {}, ...route.map((c) => el("trkpt", { lat: latText(c[1]), lon: lonText(c[0]) }, c.length >= 3 && Number.isFinite(c[2]) ? el("ele", {}, eleText(c[2])) : null))),
  );
  const gpx = el(
    "gpx",
    { version: "1.1", creator: "Eonscale", xmlns: GPX_NAMESPACE, "xmlns:xsi": XSI, "xsi:schemaLocation": `${GPX_NAMESPACE} ${GPX_NAMESPACE}/gpx.xsd` },
    metadata,
    ...waypoints,
    track,
  );
  return `<?xml version="1.0" encoding="UTF-8"?>\n${gpx.text}\n`;
}
