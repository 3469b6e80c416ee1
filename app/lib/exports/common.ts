// What export files share: the draft notice, where a marker's visitor page is, the status line every
// file carries (publication, or "DRAFT — not checked"), and for the crew's files (points.geojson,
// points.gpx) the short waypoint name a handheld unit shows. Pure: no network, no database.
import type { PublicationMeta, PublicationSnapshot, SnapshotMarker } from "../publication/types";

/** Said in the metadata of every file made from the working copy (and on every PDF page). */
export const DRAFT_NOTICE = "DRAFT — not checked";

/** Longest waypoint name we write: many handheld units show 14–30 characters (common practice). */
export const WAYPOINT_NAME_MAX = 24;

export interface CrewFileOptions {
  /** Made from the working copy (not reviewed, not published). */
  draft: boolean;
  publication: PublicationMeta | null;
  /** Absolute base URL of the site, no trailing slash; marker page links need it. */
  baseUrl: string;
}

/** The visitor page of a marker (`/visit/:org/:slug/:signNumber`), only for a publication. */
export function markerPageUrl(snapshot: PublicationSnapshot, marker: SnapshotMarker, options: CrewFileOptions): string | null {
  if (options.draft || !options.publication) return null;
  return `${options.baseUrl}/visit/${encodeURIComponent(snapshot.organisation.slug)}/${encodeURIComponent(snapshot.exhibit.slug)}/${marker.signNumber}`;
}

/** The exhibit's visitor page, only for a publication. */
export function exhibitPageUrl(snapshot: PublicationSnapshot, options: CrewFileOptions): string | null {
  if (options.draft || !options.publication) return null;
  return `${options.baseUrl}/visit/${encodeURIComponent(snapshot.organisation.slug)}/${encodeURIComponent(snapshot.exhibit.slug)}`;
}

/** "Publication 3 of Riverside walk, checked against ICS 2024/12" or the draft notice with the revision. */
export function statusLine(snapshot: PublicationSnapshot, options: CrewFileOptions): string {
  if (options.draft || !options.publication) {
    return `${DRAFT_NOTICE}: working copy at revision ${snapshot.exhibit.revision}, not reviewed or published; sign numbers may change.`;
  }
  const p = options.publication;
  return `Publication ${p.number} (revision ${snapshot.exhibit.revision}, published ${p.publishedAt.slice(0, 10)}), checked against ${snapshot.edition.label}${p.approvedBy ? ` by ${p.approvedBy}` : ""}.`;
}

/** What a marker is called briefly: the last interval of "Base of the X, Y and Z", else the event or label. */
function shortLabel(marker: SnapshotMarker): string {
  if (marker.kind === "boundary") {
    const names = marker.label.replace(/^Base of (the )?/i, "").split(/, | and /);
    return names[names.length - 1].trim() || marker.label;
  }
  return (marker.kind === "event" ? marker.eventName : null) ?? marker.label;
}

/**
 * The waypoint name: the sign number, zero-padded to the width of the largest, and a short label,
 * cut at a word boundary to WAYPOINT_NAME_MAX characters: "07 Cambrian".
 */
export function waypointName(marker: SnapshotMarker, largestSignNumber: number): string {
  const digits = Math.max(2, String(largestSignNumber).length);
  const head = `${String(marker.signNumber).padStart(digits, "0")} `;
  const label = shortLabel(marker).replace(/\s+/g, " ");
  const room = WAYPOINT_NAME_MAX - head.length;
  if (label.length <= room) return head + label;
  const cut = label.slice(0, room + 1);
  const space = cut.lastIndexOf(" ");
  return head + (space > room / 2 ? cut.slice(0, space) : label.slice(0, room)).trim();
}

/** Metres to the millimetre, the schedule CSV's precision. */
export const toMillimetre = (x: number) => Number(x.toFixed(3));

/** The markers that have a place on the ground (route exhibits), in order from the start. */
export function placedMarkers(snapshot: PublicationSnapshot): (SnapshotMarker & { position: NonNullable<SnapshotMarker["position"]> })[] {
  return snapshot.markers.filter((m): m is SnapshotMarker & { position: NonNullable<SnapshotMarker["position"]> } => m.position !== null);
}

/** Where a marker is along the exhibit, as displayed: "4,028.2 m from the start" (routes start at either end). */
export function alongText(snapshot: PublicationSnapshot, marker: SnapshotMarker): string {
  const m = snapshot.medium;
  if (m.kind === "route") return `${m.start === "younger" ? marker.distance.display.fromYoungerEnd : marker.distance.display.fromOlderEnd} from the start`;
  return `${marker.distance.display.fromOlderEnd} from the older end`;
}

/** One line per marker: "Base of the Cambrian — 538.8 ± 0.6 Ma; 4,028.2 m from the start. Source: …". */
export function markerDescription(snapshot: PublicationSnapshot, marker: SnapshotMarker): string {
  return `${marker.label} — ${marker.ageText}; ${alongText(snapshot, marker)}. Source: ${marker.source}`;
}
