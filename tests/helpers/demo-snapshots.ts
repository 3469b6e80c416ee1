// Publication snapshots of the demo exhibits built without a database (from the same reference
// data the seeders read): for rendering fabrication files in the panels benchmark and for looking
// at pages. The 46 m rope can be made a banner of any length for the benchmark.
import { readFileSync } from "node:fs";
import path from "node:path";
import { computeExhibit, standardDurations } from "../../app/lib/exhibit/index.ts";
import { buildSnapshot } from "../../app/lib/publication/build.ts";
import type { PublicationSnapshot } from "../../app/lib/publication/types.ts";
import type { Interval } from "../../app/lib/timescale/types.ts";
import { riversideElevation } from "../../db/seeders/demo/2026.12.01T03.00.00.marrowby-exhibits.ts";
import { demoExhibits } from "../unit/scale/demo-exhibits.ts";

const intervals = (slug: string) => (JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../db/data/ics", `${slug}.json`), "utf8")) as { intervals: Interval[] }).intervals;

export function demoSnapshot(slug: "riverside-walk" | "corridor-wall" | "school-rope", opts: { mediumType?: "banner" } = {}): PublicationSnapshot {
  const demo = demoExhibits().find((d) => d.slug === slug)!;
  const spec = structuredClone(demo.spec);
  if (spec.medium.kind === "route") spec.medium.geometry.coordinates = (spec.medium.geometry.coordinates as number[][]).map((c, i) => [c[0], c[1], riversideElevation(i)]);
  if (opts.mediumType && spec.medium.kind === "length") spec.medium.mediumType = opts.mediumType;
  const computed = computeExhibit(spec, demo.markers, standardDurations());
  if (!computed.ok) throw new Error(computed.message);
  const editionSlug = slug === "corridor-wall" ? "ics-2023-09" : "ics-2024-12";
  return buildSnapshot({
    organisation: { slug: "marrowby", name: "Marrowby Museum of the Earth" },
    exhibit: { slug, title: { "riverside-walk": "Riverside walk through deep time", "corridor-wall": "The corridor of the Phanerozoic", "school-rope": "Deep time on a rope" }[slug], revision: 1 },
    spec,
    markers: demo.markers,
    result: computed.result,
    edition: { slug: editionSlug, label: editionSlug === "ics-2024-12" ? "ICS chart 2024/12" : "ICS chart 2023/09", source: "International Commission on Stratigraphy", licence: "CC BY 4.0" },
    intervals: intervals(editionSlug),
    html: new Map(),
    decay: new Map(),
    images: new Map(),
    signs: new Map(demo.markers.map((m, i) => [m.id, i + 1])),
    retiredSigns: [],
  });
}
