// Demo scenario (invented): Marrowby Museum of the Earth's three exhibits.
//  - riverside-walk: an invented riverside path, 4,567 m on the WGS84 ellipsoid (1 m per million
//    years), pinned to ICS 2024/12, every eon, era and period base, library events, and an inset
//    for the last 10,000 years;
//  - corridor-wall: an 18 m wall, Cambrian to present, still pinned to ICS 2023/09 (so it shows
//    "needs re-check" and a real impact report);
//  - school-rope: a 46 m rope, the whole of Earth history.
import { Op } from "sequelize";
import type { Migration } from "../../migrator.ts";
import { geodesicDirect } from "../../../app/lib/geo/geodesic.ts";
import { prepareRoute } from "../../../app/lib/geo/route.ts";

export const RIVERSIDE_LENGTH_M = 4567;

/**
 * The invented riverside path: 457 legs (456 of 10 m and one of 7 m) whose direction meanders like
 * a path following a river's bends. Each leg is a geodesic of exactly its length, so the route's
 * ellipsoidal length is 4,567 m.
 */
export function riversideRoute(): [number, number][] {
  const legs = [...Array(456).fill(10), 7];
  let lat = 54.4321;
  let lon = -2.9876;
  const coords: [number, number][] = [[lon, lat]];
  legs.forEach((len, i) => {
    const bearing = 60 + 35 * Math.sin(i / 23) + 12 * Math.sin(i / 7.3);
    const next = geodesicDirect(lat, lon, bearing, len);
    lat = next.lat2;
    lon = next.lon2;
    coords.push([Number(lon.toFixed(9)), Number(lat.toFixed(9))]);
  });
  return coords;
}

/**
 * Invented elevations for the riverside path (metres, 0.1 m), one per vertex (vertex i is i × 10 m
 * along): a gentle valley floor with GPS-like jitter of a few decimetres, one climb of 9 % over
 * 160 m up the old river terrace from 1,800 m (steeper than ABA §1017 allows for that length, so
 * the slope profile has a flagged stretch), a level terrace, and a 3.5 % descent back to the river.
 */
export function riversideElevation(i: number): number {
  const d = i * 10;
  const terrace = d < 1800 ? 0 : d < 1960 ? (d - 1800) * 0.09 : d < 2400 ? 14.4 : d < 2811 ? 14.4 - (d - 2400) * 0.035 : 0;
  const valley = 38 + 2 * Math.sin(d / 400);
  const jitter = 0.3 * Math.sin(i * 2.3) * Math.cos(i * 0.7);
  return Number((valley + terrace + jitter).toFixed(1));
}

// Uses the models, bound here to the instance the migrator was given.
export const up: Migration = async ({ sequelize }) => {
  const models = await import("../../models/index.ts");
  models.initModels(sequelize);
  const { Organisation, User, ChartEdition, Interval, Exhibit, ExhibitMedium, Marker, Inset, DatedEvent } = models;
  const org = await Organisation.findOne({ where: { slug: "marrowby" } });
  const designer = await User.findOne({ where: { email: "designer@marrowby.example" } });
  if (!org || !designer) throw new Error("the Marrowby team must be seeded first");
  const e2024 = await ChartEdition.findOne({ where: { slug: "ics-2024-12" } });
  const e2023 = await ChartEdition.findOne({ where: { slug: "ics-2023-09" } });
  if (!e2024 || !e2023) throw new Error("the ICS editions must be seeded first (reference seeder)");

  const coords = riversideRoute();
  const measured = prepareRoute(coords.flat()).totalMetres;

  await sequelize.transaction(async (transaction) => {
    const bases = async (editionId: number, ranks: string[], olderMa: number, youngerMa = 0) =>
      Interval.findAll({ where: { editionId, rank: ranks, baseMa: { [Op.lte]: olderMa, [Op.gte]: youngerMa } }, order: [["chartOrder", "ASC"]], transaction });
    const make = async (e: {
      slug: string; title: string; editionId: number; older: [number, "Ma"]; mediumType: "trail" | "wall" | "rope";
      medium: Record<string, unknown>; units?: "metric" | "us";
    }) => {
      const [exhibit, created] = await Exhibit.findOrCreate({
        where: { organisationId: org.id, slug: e.slug },
        defaults: {
          organisationId: org.id, slug: e.slug, title: e.title, editionId: e.editionId,
          spanOlderValue: e.older[0], spanOlderUnit: e.older[1], spanYoungerValue: 0, spanYoungerUnit: "Ma",
          unitsPreference: e.units ?? "metric", createdById: designer.id, updatedById: designer.id,
        },
        transaction,
      });
      if (created) await ExhibitMedium.create({ exhibitId: exhibit.id, mediumType: e.mediumType, ...e.medium } as never, { transaction });
      return { exhibit, created };
    };
    // Boundaries that share an age (the Archean and the Eoarchean both begin at 4031 Ma) become one
    // marker on the coarsest interval, labelled with every name, as a sign would show them.
    const addBoundaryMarkers = async (exhibitId: number, rows: InstanceType<typeof Interval>[]) => {
      const byAge = new Map<string, InstanceType<typeof Interval>[]>();
      for (const iv of rows) byAge.set(String(Number(iv.baseMa)), [...(byAge.get(String(Number(iv.baseMa))) ?? []), iv]);
      const names = (ivs: InstanceType<typeof Interval>[]) => ivs.length === 1 ? ivs[0].name : `${ivs.slice(0, -1).map((i) => i.name).join(", ")} and ${ivs[ivs.length - 1].name}`;
      return Marker.bulkCreate(
        [...byAge.values()].map((ivs) => ({ exhibitId, kind: "boundary" as const, intervalId: ivs[0].id, datedEventId: null, ageMa: null, uncertaintyMa: null, source: null, label: `Base of the ${names(ivs)}`, decaySystemId: null })),
        { transaction },
      );
    };
    const sharedEvents = async (olderMa: number, limit: number) =>
      DatedEvent.findAll({ where: { organisationId: null, ageMa: { [Op.lte]: olderMa } }, order: [["ageMa", "DESC"]], limit, transaction });

    // riverside-walk
    const walk = await make({
      slug: "riverside-walk", title: "Riverside walk through deep time", editionId: e2024.id, older: [4567, "Ma"], mediumType: "trail",
      medium: { kind: "route", geometry: { type: "LineString", coordinates: coords.map((c, i) => [c[0], c[1], riversideElevation(i)]) }, routeLengthM: measured, routeVertexCount: coords.length, sourceName: "marrowby-riverside-path.gpx" },
    });
    if (walk.created) {
      await addBoundaryMarkers(walk.exhibit.id, await bases(e2024.id, ["eon", "era", "period"], 4567));
      const events = await sharedEvents(4567, 14);
      await Marker.bulkCreate(events.map((ev) => ({ exhibitId: walk.exhibit.id, kind: "event" as const, intervalId: null, datedEventId: ev.id, ageMa: null, uncertaintyMa: null, source: null, label: ev.name, decaySystemId: null })), { transaction });
      await Marker.create({ exhibitId: walk.exhibit.id, kind: "custom", intervalId: null, datedEventId: null, ageMa: 0.0002, uncertaintyMa: null, source: "Marrowby Museum archive (invented demo record): the riverside mill, built about 200 years ago", label: "Marrowby mill built", text: "The mill by the footbridge is about **200 years** old: a fifth of a millimetre on this walk.", decaySystemId: null }, { transaction });
      await Inset.create({ exhibitId: walk.exhibit.id, olderMa: 0.01, youngerMa: 0, magnification: 1000, label: "last 10,000 years at 1,000×" }, { transaction });
    }

    // corridor-wall: Cambrian (ICS 2023/09 base 538.8 Ma) to present on 18 m.
    const wall = await make({ slug: "corridor-wall", title: "The corridor of the Phanerozoic", editionId: e2023.id, older: [538.8, "Ma"], mediumType: "wall", medium: { kind: "length", lengthValue: 18, lengthUnit: "m", panelWidthValue: 1000, panelWidthUnit: "mm" } });
    if (wall.created) await addBoundaryMarkers(wall.exhibit.id, await bases(e2023.id, ["era", "period", "epoch"], 538.8));

    // school-rope: 46 m, the whole of Earth history.
    const rope = await make({ slug: "school-rope", title: "Earth history on a 46-metre rope", editionId: e2024.id, older: [4567, "Ma"], mediumType: "rope", medium: { kind: "length", lengthValue: 46, lengthUnit: "m" } });
    if (rope.created) {
      await addBoundaryMarkers(rope.exhibit.id, await bases(e2024.id, ["eon", "era"], 4567));
      const events = await sharedEvents(4567, 10);
      await Marker.bulkCreate(events.map((ev) => ({ exhibitId: rope.exhibit.id, kind: "event" as const, intervalId: null, datedEventId: ev.id, ageMa: null, uncertaintyMa: null, source: null, label: ev.name, decaySystemId: null })), { transaction });
    }
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`DELETE FROM exhibits WHERE slug IN ('riverside-walk', 'corridor-wall', 'school-rope') AND organisation_id = (SELECT id FROM organisations WHERE slug = 'marrowby')`);
};
