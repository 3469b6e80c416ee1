// The query parameters of panels.pdf/panels.zip and signs.pdf, read over the exhibit's defaults;
// a bad value is a 400 that names the field (ExportError), a route exhibit has no panels (404).
import type { PublicationSnapshot } from "../../../app/lib/publication/types.ts";
import { MAX_PANELS, parsePanelOptions, tilePanels, type PanelOptions } from "../../../app/lib/fabrication/panels.ts";
import { parseSignOptions, type SignOptions, type SignSettings } from "../../../app/lib/fabrication/signs.ts";
import { toMetres } from "../../../app/lib/units/index.ts";
import { ExportError } from "../source.server.ts";
import { fileQuery } from "../pdf/panels.server.ts";

export const STRAIGHT_ONLY = "Print panels are for straight exhibits (walls, banners, ropes); a route exhibit has sign sheets and a trailhead board.";

/** Panel options for a snapshot, or a 400 naming the field. */
export function panelOptionsFor(snapshot: PublicationSnapshot, query: URLSearchParams): PanelOptions & { count: number } {
  if (snapshot.medium.kind !== "length") throw new ExportError(STRAIGHT_ONLY, 404);
  const medium = snapshot.medium;
  const parsed = parsePanelOptions(fileQuery(query, ["background"]), medium.panelWidth ? toMetres(medium.panelWidth) * 1000 : null);
  if (!parsed.ok) throw new ExportError(Object.values(parsed.errors).join(" "), 400);
  const count = tilePanels(snapshot.scale.totalMetres * 1000, parsed.value).length;
  if (count > MAX_PANELS) throw new ExportError(`width: ${count} panels is more than ${MAX_PANELS}; choose wider panels.`, 400);
  return { ...parsed.value, count };
}

export function signOptionsFor(snapshot: PublicationSnapshot, query: URLSearchParams, settings: SignSettings): SignOptions {
  const parsed = parseSignOptions(fileQuery(query), settings, snapshot.medium.kind === "route" ? "wayside" : "a4");
  if (!parsed.ok) throw new ExportError(Object.values(parsed.errors).join(" "), 400);
  return parsed.value;
}
