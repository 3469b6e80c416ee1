// Exhibits: loading an exhibit with its resolved markers, and every change to it. Each change runs
// in one transaction that (1) claims the next revision — refused when the form was based on an
// older one, so no one's change is lost —, (2) makes the change, (3) re-runs the scale engine on
// the result (a change that leaves markers outside the span or an invalid route rolls back), and
// (4) writes the audit event.
import { Op, type Transaction } from "sequelize";
import { data } from "react-router";
import {
  computeExhibit,
  colourAt,
  impactReport,
  metresPerYearOf,
  standardDurations,
  type ExhibitSpec,
  type InsetSpec,
  type LineStringGeometry,
  type MediumSpec,
  type ResolvedMarker,
} from "../app/lib/exhibit/index.ts";
import type { ScaleResult } from "../app/lib/scale/compute.ts";
import { toYears, type AgeUnit, type LengthUnit } from "../app/lib/units/index.ts";
import type { MediumType } from "../app/lib/scale/legibility.ts";
import type { Interval as DomainInterval, Rank } from "../app/lib/timescale/types.ts";
import { ChartEdition, DecaySystem, Exhibit, ExhibitMedium, Inset, Marker, sequelize, User } from "../db/models/index.ts";
import { howWeKnow } from "../app/lib/decay/index.ts";
import { audit } from "./audit.server.ts";
import { BodyTooLargeError, megabytes, readLimitedFormData } from "./http.server.ts";
import { currentEdition, editionIntervalRows, editionIntervals } from "./editions.server.ts";
import { eventsByIds, type LibraryEvent } from "./dated-events.server.ts";

export class ExhibitError extends Error {
  constructor(message: string, public field = "_form", public status = 400) {
    super(message);
    this.name = "ExhibitError";
  }
}

/** Another person saved first: nothing of this change was written. */
export class RevisionConflictError extends ExhibitError {
  constructor(public currentRevision: number, by: string | null, at: Date) {
    super(
      `Not saved: ${by ?? "someone"} saved a newer version of this exhibit (revision ${currentRevision}) at ${at.toISOString().slice(11, 16)} UTC, after you opened it. Their change is kept; reload the page to see it, then make your change again.`,
      "_form",
      409,
    );
    this.name = "RevisionConflictError";
  }
}

const num = (v: string | number | null | undefined) => (v == null ? null : Number(v));

export interface ExhibitBundle {
  exhibit: Exhibit;
  medium: ExhibitMedium;
  edition: ChartEdition;
  intervals: DomainInterval[];
  /** DB id → domain interval of the pinned edition. */
  intervalIds: Map<number, DomainInterval>;
  markers: ResolvedMarker[];
  markerRows: Marker[];
  insets: InsetSpec[];
  spec: ExhibitSpec;
}

async function intervalsWithIds(editionId: number, transaction?: Transaction) {
  const rows = await editionIntervalRows(editionId, transaction);
  return {
    domain: rows.map((r) => r.interval),
    ids: new Map(rows.map((r) => [r.id, r.interval])),
    rowsByName: new Map(rows.map((r) => [r.interval.name, r.id])),
  };
}

export function mediumSpecOf(m: ExhibitMedium): MediumSpec {
  if (m.kind === "route") {
    return { kind: "route", mediumType: m.mediumType, geometry: m.geometry!, lengthMetres: m.routeLengthM ?? 0, sourceName: m.sourceName };
  }
  return {
    kind: "length",
    mediumType: m.mediumType,
    length: { value: Number(m.lengthValue), unit: m.lengthUnit! },
    panelWidth: m.panelWidthValue == null ? null : { value: Number(m.panelWidthValue), unit: m.panelWidthUnit! },
  };
}

export function resolveMarkers(rows: Marker[], intervalIds: Map<number, DomainInterval>, events: Map<number, LibraryEvent>, intervals: DomainInterval[], edition: ChartEdition): ResolvedMarker[] {
  const resolved = rows.map((m) => {
    let ageMa: number;
    let uncertaintyMa: number | null = null;
    let intervalName: string | null = null;
    let intervalRank: Rank | null = null;
    let eventName: string | null = null;
    let source: string;
    let approximate = false;
    if (m.kind === "boundary") {
      const iv = intervalIds.get(m.intervalId!);
      if (!iv) throw new Error(`marker ${m.id}: interval ${m.intervalId} is not in ${edition.slug}`);
      ageMa = iv.baseMa;
      uncertaintyMa = iv.baseUncertaintyMa;
      intervalName = iv.name;
      intervalRank = iv.rank;
      approximate = iv.approximate;
      source = `${edition.label}: base of the ${iv.name}${iv.gssp ? " (GSSP)" : ""}`;
    } else if (m.kind === "event") {
      const ev = events.get(m.datedEventId!);
      if (!ev) throw new Error(`marker ${m.id}: event ${m.datedEventId} not found`);
      ageMa = ev.ageMa;
      uncertaintyMa = ev.uncertaintyMa;
      eventName = ev.name;
      source = ev.citation;
    } else {
      ageMa = Number(m.ageMa);
      uncertaintyMa = num(m.uncertaintyMa);
      source = m.source ?? "";
    }
    return { id: String(m.id), number: 0, kind: m.kind, label: m.label, text: m.text, ageMa, uncertaintyMa, intervalName, intervalRank, eventName, source, color: colourAt(intervals, ageMa), approximate };
  });
  // Numbered from the older end of the exhibit: marker 1 is the first a visitor reaches.
  resolved.sort((a, b) => b.ageMa - a.ageMa || Number(a.id) - Number(b.id));
  resolved.forEach((m, i) => (m.number = i + 1));
  return resolved;
}

export async function loadBundle(organisationId: number, slug: string, transaction?: Transaction): Promise<ExhibitBundle | null> {
  const exhibit = await Exhibit.findOne({
    where: { organisationId, slug },
    include: [
      { model: ExhibitMedium, as: "medium", required: true },
      { model: ChartEdition, as: "edition", required: true },
      { model: User, as: "updatedBy" },
    ],
    transaction,
  });
  if (!exhibit) return null;
  const [{ domain, ids }, markerRows, insetRows] = await Promise.all([
    intervalsWithIds(exhibit.editionId, transaction),
    Marker.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]], transaction }),
    Inset.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]], transaction }),
  ]);
  const events = await eventsByIds(markerRows.filter((m) => m.kind === "event").map((m) => m.datedEventId!), organisationId);
  const markers = resolveMarkers(markerRows, ids, events, domain, exhibit.edition!);
  const insets: InsetSpec[] = insetRows.map((r) => ({ id: `inset-${r.id}`, label: r.label, olderMa: Number(r.olderMa), youngerMa: Number(r.youngerMa), magnification: r.magnification }));
  const spec: ExhibitSpec = {
    spanOlder: { value: Number(exhibit.spanOlderValue), unit: exhibit.spanOlderUnit },
    spanYounger: { value: Number(exhibit.spanYoungerValue), unit: exhibit.spanYoungerUnit },
    medium: mediumSpecOf(exhibit.medium!),
    legibility: exhibit.legibility ?? {},
    unitsPreference: exhibit.unitsPreference,
    insets,
  };
  return { exhibit, medium: exhibit.medium!, edition: exhibit.edition!, intervals: domain, intervalIds: ids, markers, markerRows, insets, spec };
}

export async function requireBundle(organisationId: number, slug: string, transaction?: Transaction) {
  const bundle = await loadBundle(organisationId, slug, transaction);
  if (!bundle) throw data({ message: "There is no exhibit at this address in your organisation." }, { status: 404 });
  return bundle;
}

export function computeBundle(bundle: Pick<ExhibitBundle, "spec" | "markers">, lifeYears = 80) {
  return computeExhibit(bundle.spec, bundle.markers, standardDurations(lifeYears));
}

export function resultOf(bundle: Pick<ExhibitBundle, "spec" | "markers">): ScaleResult {
  const c = computeBundle(bundle);
  if (!c.ok) throw new ExhibitError(c.message);
  return c.result;
}

export interface Actor {
  organisationId: number;
  user: User;
}

/**
 * Runs `change` as the next revision of the exhibit. `revision` is the one the designer's form
 * was based on; if someone saved since, nothing happens and RevisionConflictError says who.
 */
export async function reviseExhibit<T>(
  actor: Actor,
  slug: string,
  revision: number,
  action: string,
  change: (bundle: ExhibitBundle, transaction: Transaction) => Promise<T>,
  details: (result: T) => Record<string, unknown> = () => ({}),
): Promise<{ result: T; revision: number }> {
  return sequelize.transaction(async (transaction) => {
    const [rows] = (await sequelize.query(
      `UPDATE exhibits SET revision = revision + 1, updated_by_id = $1, updated_at = now()
       WHERE organisation_id = $2 AND slug = $3 AND revision = $4 RETURNING id, revision`,
      { bind: [actor.user.id, actor.organisationId, slug, revision], transaction },
    )) as [{ id: number; revision: number }[], unknown];
    if (rows.length === 0) {
      const current = await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug }, include: [{ model: User, as: "updatedBy" }], transaction });
      if (!current) throw data({ message: "There is no exhibit at this address in your organisation." }, { status: 404 });
      throw new RevisionConflictError(current.revision, current.updatedBy?.name ?? null, current.updatedAt);
    }
    const before = await requireBundle(actor.organisationId, slug, transaction);
    const result = await change(before, transaction);
    // The whole exhibit must still compute: markers inside the span, a valid medium.
    const after = await requireBundle(actor.organisationId, slug, transaction);
    const computed = computeBundle(after);
    if (!computed.ok) throw new ExhibitError(`Not saved: ${computed.message}`);
    await audit(
      { organisationId: actor.organisationId, actorId: actor.user.id, action: `exhibit.${action}`, objectType: "exhibit", objectId: before.exhibit.id, details: { slug, revision: rows[0].revision, ...details(result) } },
      transaction,
    );
    return { result, revision: rows[0].revision };
  });
}

// ---------- creating ----------

export interface SettingsInput {
  title: string;
  spanOlderValue: number;
  spanOlderUnit: AgeUnit;
  spanYoungerValue: number;
  spanYoungerUnit: AgeUnit;
  mediumType: MediumType;
  unitsPreference: "metric" | "us";
  minVisibleMm?: number;
  minSpacingMm?: number;
}

export type MediumInput =
  | { kind: "length"; lengthValue: number; lengthUnit: LengthUnit; panelWidthValue?: number; panelWidthUnit?: LengthUnit }
  | { kind: "route"; geometry: LineStringGeometry; lengthMetres: number; vertexCount: number; sourceName: string };

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

export async function createExhibit(actor: Actor, input: { slug: string; editionSlug: string; settings: SettingsInput; medium: MediumInput }) {
  const edition = await ChartEdition.findOne({ where: { slug: input.editionSlug, status: { [Op.ne]: "draft" } } });
  if (!edition) throw new ExhibitError("Choose a published chart edition to pin the exhibit to.", "editionSlug");
  if (await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug: input.slug } })) {
    throw new ExhibitError(`Your organisation already has an exhibit at /${input.slug}. Choose another slug.`, "slug");
  }
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
export function replaceRoute(actor: Actor, slug: string, revision: number, route: Extract<MediumInput, { kind: "route" }>) {
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
      let chosen: DomainInterval[];
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
      const present = new Set(b.markers.filter((m) => m.kind === "boundary").map((m) => m.intervalName));
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

/** "How we know" for markers with a decay system: how much of the parent is left after the marker's age. */
export async function howWeKnowFor(bundle: ExhibitBundle): Promise<{ systems: { id: number; label: string }[]; byMarker: Map<string, string> }> {
  const systems = await DecaySystem.findAll({ order: [["position", "ASC"], ["slug", "ASC"]] });
  const byId = new Map(systems.map((s) => [s.id, s]));
  const byMarker = new Map<string, string>();
  const markers = new Map(bundle.markers.map((m) => [m.id, m]));
  for (const row of bundle.markerRows) {
    const system = row.decaySystemId ? byId.get(row.decaySystemId) : undefined;
    const marker = markers.get(String(row.id));
    if (!system || !marker) continue;
    const h = howWeKnow(marker.ageMa * 1e6, {
      parent: system.parent,
      daughter: system.daughter,
      halfLifeYears: Number(system.halfLifeYears),
      halfLifeUncertaintyYears: system.halfLifeUncertaintyYears == null ? null : Number(system.halfLifeUncertaintyYears),
      decayConstantPerYear: Number(system.decayConstantPerYear),
      branchConstantPerYear: system.branchConstantPerYear == null ? null : Number(system.branchConstantPerYear),
    });
    byMarker.set(marker.id, `${h.sentence} (${system.citation.split(/[.;]/)[0]})`);
  }
  return { systems: systems.map((s) => ({ id: s.id, label: `${s.parent} → ${s.daughter}` })), byMarker };
}

export function removeMarker(actor: Actor, slug: string, revision: number, markerId: number) {
  return reviseExhibit(actor, slug, revision, "markers.remove", async (b, transaction) => {
    const row = await markerOf(b, markerId);
    await row.destroy({ transaction });
    return row.label;
  }, (label) => ({ markerId, label }));
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

// ---------- edition impact ----------

export async function impactFor(bundle: ExhibitBundle) {
  const current = await currentEdition();
  if (!current || current.id === bundle.edition.id) return null;
  const target = await editionIntervals(current.id);
  return { edition: { slug: current.slug, label: current.label }, report: impactReport(bundle.markers, bundle.intervals, target, metresPerYearOf(bundle.spec)) };
}

/** Re-pins the exhibit to the current edition: boundary markers follow their interval (by name, or its rename). */
export function repinToCurrent(actor: Actor, slug: string, revision: number) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "repin",
    async (b, transaction) => {
      const current = await currentEdition();
      if (!current) throw new ExhibitError("No chart edition is current.");
      if (current.id === b.edition.id) throw new ExhibitError(`This exhibit is already pinned to ${current.label}.`);
      const target = await intervalsWithIds(current.id, transaction);
      const report = impactReport(b.markers, b.intervals, target.domain, 1);
      const missing = report.rows.filter((r) => r.newAgeMa === null);
      if (missing.length) {
        throw new ExhibitError(`Not re-pinned: ${missing.map((r) => `marker ${r.number} (${r.intervalName})`).join(", ")} has no matching interval in ${current.label}. Remove or replace those markers first.`);
      }
      const renamed = new Map(report.rows.filter((r) => r.newIntervalName).map((r) => [r.intervalName, r.newIntervalName!]));
      for (const row of b.markerRows.filter((m) => m.kind === "boundary")) {
        const name = b.intervalIds.get(row.intervalId!)!.name;
        const newName = renamed.get(name) ?? name;
        const id = target.rowsByName.get(newName);
        if (!id) throw new ExhibitError(`The ${name} is not in ${current.label}.`);
        await row.update({ intervalId: id, ...(renamed.has(name) && row.label === `Base of the ${name}` ? { label: `Base of the ${newName}` } : {}) }, { transaction });
      }
      await b.exhibit.update({ editionId: current.id }, { transaction });
      return { from: b.edition.slug, to: current.slug, moved: report.rows.length };
    },
    (r) => r,
  );
}

/**
 * For the edition compare page: the organisation's exhibits pinned to `editionId` with a boundary
 * marker on each interval (by the interval's name in that edition).
 */
export async function exhibitsByBoundary(organisationId: number, editionId: number): Promise<Map<string, { slug: string; title: string }[]>> {
  const [rows] = (await sequelize.query(
    `SELECT DISTINCT i.name AS interval, e.slug, e.title
       FROM markers m JOIN exhibits e ON e.id = m.exhibit_id JOIN intervals i ON i.id = m.interval_id
      WHERE e.organisation_id = $1 AND e.edition_id = $2 AND m.kind = 'boundary'
      ORDER BY e.title`,
    { bind: [organisationId, editionId] },
  )) as [{ interval: string; slug: string; title: string }[], unknown];
  const out = new Map<string, { slug: string; title: string }[]>();
  for (const r of rows) out.set(r.interval, [...(out.get(r.interval) ?? []), { slug: r.slug, title: r.title }]);
  return out;
}

/** Exhibit forms, including a route file upload (GPS tracks of 10⁵ points are a few MB). */
export const MAX_EXHIBIT_FORM_BYTES = 8 * 1024 * 1024;

/** readLimitedFormData with the exhibit forms' limit; a too-large body → a message for the route-file field. */
export async function readExhibitForm(request: Request): Promise<{ ok: true; form: FormData } | { ok: false; message: string }> {
  try {
    return { ok: true, form: await readLimitedFormData(request, MAX_EXHIBIT_FORM_BYTES) };
  } catch (error) {
    if (error instanceof BodyTooLargeError) return { ok: false, message: `The upload is larger than ${megabytes(MAX_EXHIBIT_FORM_BYTES)}. Simplify the route (fewer points) or split it.` };
    throw error;
  }
}
