// The commands that create and change an exhibit. Every change goes through reviseExhibit
// (revise.server.ts): one transaction, the revision claimed first, the exhibit recomputed, audited.
import { Op, UniqueConstraintError } from "sequelize";
import { data } from "react-router";
import { boundaryNames, planCombine, type MediumInput, type NewExhibitInput, type ResolvedMarker, type RouteMediumInput, type SettingsInput } from "../../app/lib/exhibit/index.ts";
import { toYears } from "../../app/lib/units/index.ts";
import type { MediumType } from "../../app/lib/scale/legibility.ts";
import type { Interval, Rank } from "../../app/lib/timescale/types.ts";
import { ChartEdition, DecaySystem, Exhibit, ExhibitMedium, Inset, Marker } from "../../db/models/index.ts";
import { sequelize } from "../db.server.ts";
import { audit } from "../audit.server.ts";
import { eventsByIds } from "../dated-events.server.ts";
import { computeBundle, ExhibitError, intervalsWithIds, requireBundle, type ExhibitBundle } from "./load.server.ts";
import { reviseExhibit, type Actor } from "./revise.server.ts";
import { recordRevision } from "../review/revisions.server.ts";
import { cleanupAfterMarkerRemoval } from "../assets/attach.server.ts";

// ---------- creating ----------

function legibilityOf(s: SettingsInput) {
  return {
    ...(s.minVisibleMm ? { minVisibleMetres: s.minVisibleMm / 1000 } : {}),
    ...(s.minSpacingMm ? { minSpacingMetres: s.minSpacingMm / 1000 } : {}),
  };
}

function mediumColumns(medium: MediumInput, mediumType: MediumType) {
  return medium.kind === "length"
    ? { kind: "length" as const, mediumType, lengthValue: medium.lengthValue, lengthUnit: medium.lengthUnit, panelWidthValue: medium.panelWidthValue ?? null, panelWidthUnit: medium.panelWidthValue ? (medium.panelWidthUnit ?? "mm") : null, geometry: null, routeLengthM: null, routeVertexCount: null, sourceName: null }
    : { kind: "route" as const, mediumType, lengthValue: null, lengthUnit: null, panelWidthValue: null, panelWidthUnit: null, geometry: medium.geometry, routeLengthM: medium.lengthMetres, routeVertexCount: medium.vertexCount, sourceName: medium.sourceName };
}

export async function createExhibit(actor: Actor, input: NewExhibitInput) {
  // Shared editions, or the organisation's own: never another organisation's, never a draft.
  const edition = await ChartEdition.findOne({ where: { slug: input.editionSlug, status: { [Op.ne]: "draft" }, [Op.or]: [{ organisationId: null }, { organisationId: actor.organisationId }] } });
  if (!edition) throw new ExhibitError("Choose a published chart edition to pin the exhibit to.", "editionSlug");
  const slugTaken = () => new ExhibitError(`Your organisation already has an exhibit at /${input.slug}. Choose another slug.`, "slug");
  if (await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug: input.slug } })) throw slugTaken();
  // Two designers creating the same slug at once: the check above passes for both, the unique
  // index refuses the second insert, and that answer is the same as the serial one.
  return createInTransaction(actor, input, edition).catch((error: unknown) => {
    if (error instanceof UniqueConstraintError) throw slugTaken();
    throw error;
  });
}

function createInTransaction(actor: Actor, input: NewExhibitInput, edition: ChartEdition) {
  return sequelize.transaction(async (transaction) => {
    const s = input.settings;
    const exhibit = await Exhibit.create(
      {
        organisationId: actor.organisationId,
        title: s.title,
        slug: input.slug,
        editionId: edition.id,
        spanOlderValue: s.spanOlderValue,
        spanOlderUnit: s.spanOlderUnit,
        spanYoungerValue: s.spanYoungerValue,
        spanYoungerUnit: s.spanYoungerUnit,
        unitsPreference: s.unitsPreference,
        legibility: legibilityOf(s),
        createdById: actor.user.id,
        updatedById: actor.user.id,
      },
      { transaction },
    );
    await ExhibitMedium.create({ exhibitId: exhibit.id, ...mediumColumns(input.medium, s.mediumType) }, { transaction });
    const bundle = await requireBundle(actor.organisationId, input.slug, transaction);
    const computed = computeBundle(bundle);
    if (!computed.ok) throw new ExhibitError(computed.message);
    await recordRevision(bundle, actor.user.id, "create", transaction);
    await audit({ organisationId: actor.organisationId, actorId: actor.user.id, action: "exhibit.create", objectType: "exhibit", objectId: exhibit.id, details: { slug: input.slug, edition: edition.slug, medium: input.medium.kind } }, transaction);
    return exhibit;
  });
}

// ---------- changes ----------

export function updateSettings(actor: Actor, slug: string, revision: number, s: SettingsInput, medium?: MediumInput) {
  return reviseExhibit(actor, slug, revision, "settings", async (b, transaction) => {
    await b.exhibit.update(
      { title: s.title, spanOlderValue: s.spanOlderValue, spanOlderUnit: s.spanOlderUnit, spanYoungerValue: s.spanYoungerValue, spanYoungerUnit: s.spanYoungerUnit, unitsPreference: s.unitsPreference, legibility: legibilityOf(s) },
      { transaction },
    );
    if (medium) await b.medium.update(mediumColumns(medium, s.mediumType), { transaction });
    else await b.medium.update({ mediumType: s.mediumType }, { transaction });
  });
}

/** Replaces a route exhibit's route (a new GPX or GeoJSON upload); markers keep their ages and move with it. */
export function replaceRoute(actor: Actor, slug: string, revision: number, route: RouteMediumInput) {
  return reviseExhibit(actor, slug, revision, "route.replace", async (b, transaction) => {
    if (b.medium.kind !== "route") throw new ExhibitError("This exhibit is a straight length, not a route.", "routeFile");
    await b.medium.update(mediumColumns(route, b.medium.mediumType), { transaction });
    return { sourceName: route.sourceName, lengthMetres: route.lengthMetres };
  }, (r) => r);
}

/** Adds the base of one interval, or of every interval of a rank inside the span (skipping ones already there). */
export function addBoundaries(actor: Actor, slug: string, revision: number, pick: { intervalName?: string; rank?: Rank }) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "markers.add-boundaries",
    async (b, transaction) => {
      const { rowsByName } = await intervalsWithIds(b.exhibit.editionId, transaction);
      const olderMa = toYears(b.spec.spanOlder) / 1e6;
      const youngerMa = toYears(b.spec.spanYounger) / 1e6;
      let chosen: Interval[];
      if (pick.intervalName) {
        const iv = b.intervals.find((i) => i.name === pick.intervalName);
        if (!iv) throw new ExhibitError(`${pick.intervalName} is not an interval of ${b.edition.label}.`, "intervalName");
        if (iv.baseMa > olderMa + 1e-12 || iv.baseMa < youngerMa - 1e-12) {
          throw new ExhibitError(`The base of the ${iv.name} (${iv.baseMa} Ma) lies outside this exhibit's span.`, "intervalName");
        }
        chosen = [iv];
      } else {
        chosen = b.intervals.filter((i) => i.rank === pick.rank && i.baseMa <= olderMa + 1e-12 && i.baseMa >= youngerMa - 1e-12);
        if (chosen.length === 0) throw new ExhibitError(`No ${pick.rank} of ${b.edition.label} begins inside this exhibit's span.`, "rank");
      }
      // a boundary already combined into another marker ("Base of the Archean and Eoarchean") is there too
      const present = new Set(b.markers.filter((m) => m.kind === "boundary").flatMap(boundaryNames));
      const fresh = chosen.filter((iv) => !present.has(iv.name));
      if (fresh.length === 0) throw new ExhibitError(pick.intervalName ? `The base of the ${pick.intervalName} is already a marker.` : `Every ${pick.rank} base is already a marker.`, pick.intervalName ? "intervalName" : "rank");
      await Marker.bulkCreate(
        fresh.map((iv) => ({ exhibitId: b.exhibit.id, kind: "boundary" as const, intervalId: rowsByName.get(iv.name)!, datedEventId: null, ageMa: null, uncertaintyMa: null, source: null, label: `Base of the ${iv.name}`, decaySystemId: null })),
        { transaction },
      );
      return fresh.map((iv) => iv.name);
    },
    (names) => ({ intervals: names }),
  );
}

export function addEvent(actor: Actor, slug: string, revision: number, eventId: number) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "markers.add-event",
    async (b, transaction) => {
      const ev = (await eventsByIds([eventId], actor.organisationId)).get(eventId);
      if (!ev) throw new ExhibitError("That event is not in the library.", "eventId");
      if (b.markerRows.some((m) => m.datedEventId === eventId)) throw new ExhibitError(`“${ev.name}” is already a marker.`, "eventId");
      await Marker.create({ exhibitId: b.exhibit.id, kind: "event", intervalId: null, datedEventId: eventId, ageMa: null, uncertaintyMa: null, source: null, label: ev.name, decaySystemId: null }, { transaction });
      return ev.name;
    },
    (name) => ({ event: name }),
  );
}

export function addCustom(actor: Actor, slug: string, revision: number, m: { label: string; ageMa: number; uncertaintyMa: number | null; source: string; text: string }) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "markers.add-custom",
    async (b, transaction) => {
      await Marker.create({ exhibitId: b.exhibit.id, kind: "custom", intervalId: null, datedEventId: null, ageMa: m.ageMa, uncertaintyMa: m.uncertaintyMa, source: m.source, label: m.label, text: m.text, decaySystemId: null }, { transaction });
      return m.label;
    },
    (label) => ({ label }),
  );
}

async function markerOf(b: ExhibitBundle, markerId: number) {
  const row = b.markerRows.find((m) => m.id === markerId);
  if (!row) throw data({ message: "That marker is not on this exhibit." }, { status: 404 });
  return row;
}

export function editMarker(actor: Actor, slug: string, revision: number, markerId: number, label: string, text: string, decaySystemId: number | null = null) {
  return reviseExhibit(actor, slug, revision, "markers.edit", async (b, transaction) => {
    if (decaySystemId !== null && !(await DecaySystem.findByPk(decaySystemId, { transaction }))) throw new ExhibitError("That decay system is not in the library.", "decaySystemId");
    await (await markerOf(b, markerId)).update({ label, text, decaySystemId }, { transaction });
    return markerId;
  }, (id) => ({ markerId: id, decaySystemId }));
}

export function removeMarker(actor: Actor, slug: string, revision: number, markerId: number) {
  return reviseExhibit(actor, slug, revision, "markers.remove", async (b, transaction) => {
    const row = await markerOf(b, markerId);
    await cleanupAfterMarkerRemoval(row.id, transaction);
    await row.destroy({ transaction });
    return row.label;
  }, (label) => ({ markerId, label }));
}

/**
 * Combines markers of one age into one (planCombine): the kept marker takes a label naming every
 * one and their texts; the others are deleted. Revision-checked and audited like any edit.
 */
export function combineMarkers(actor: Actor, slug: string, revision: number, markerIds: number[]) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "markers.combine",
    async (b, transaction) => {
      const chosen = markerIds.map((id) => b.markers.find((m) => m.id === String(id)));
      if (chosen.some((m) => !m)) throw new ExhibitError("A marker to combine is not on this exhibit (any more); reload the page.", "markerIds");
      const plan = planCombine(chosen as ResolvedMarker[]);
      if (!plan.ok) throw new ExhibitError(plan.message, "markerIds");
      await (await markerOf(b, Number(plan.keepId))).update({ label: plan.label, text: plan.text }, { transaction });
      for (const id of plan.removeIds) await cleanupAfterMarkerRemoval(Number(id), transaction);
      await Marker.destroy({ where: { exhibitId: b.exhibit.id, id: plan.removeIds.map(Number) }, transaction });
      return plan;
    },
    (plan) => ({ kept: Number(plan.keepId), removed: plan.removeIds.map(Number), label: plan.label }),
  );
}

export function addInset(actor: Actor, slug: string, revision: number, inset: { olderMa: number; youngerMa: number; magnification: number; label: string }) {
  return reviseExhibit(actor, slug, revision, "insets.add", async (b, transaction) => {
    const olderMa = toYears(b.spec.spanOlder) / 1e6;
    const youngerMa = toYears(b.spec.spanYounger) / 1e6;
    if (inset.olderMa > olderMa + 1e-12 || inset.youngerMa < youngerMa - 1e-12) throw new ExhibitError("An inset must lie inside the exhibit's span.", "olderValue");
    await Inset.create({ exhibitId: b.exhibit.id, ...inset }, { transaction });
    return inset.label;
  }, (label) => ({ label }));
}

export function removeInset(actor: Actor, slug: string, revision: number, insetId: number) {
  return reviseExhibit(actor, slug, revision, "insets.remove", async (b, transaction) => {
    const n = await Inset.destroy({ where: { id: insetId, exhibitId: b.exhibit.id }, transaction });
    if (n === 0) throw data({ message: "That inset is not on this exhibit." }, { status: 404 });
    return insetId;
  });
}
