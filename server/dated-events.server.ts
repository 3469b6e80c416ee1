// The dated-event library and the decay systems on the server: listing and searching (shared
// entries plus the organisation's own), creating, editing and deleting an organisation's entries
// (each in one transaction with its audit event), and the read-only decay-system table.
//
// Shared entries (organisation_id NULL) are reference data from db/data/dated-events: read-only here.
import { ForeignKeyConstraintError, Op, UniqueConstraintError, type WhereOptions } from "sequelize";
import { DatedEvent, DecaySystem, User } from "../db/models/index.ts";
import { sequelize } from "./db.server.ts";
import { formatAge, type DatedEventInput, type DatedEventView, type Verification } from "../app/lib/dated-events.ts";
import { audit } from "./audit.server.ts";
import { SEED_DECAY_SYSTEMS, type SeedDecaySystem } from "../db/data/dated-events/decay-systems.ts";
import { SEED_DATED_EVENTS } from "../db/data/dated-events/dated-events.ts";
import { checkIntervalNames, type IntervalWarning } from "../app/lib/interval-consistency.ts";
import { currentEditionFor, editionIntervals } from "./editions.server.ts";

/** What each shared entry was checked against (kept with the reference data, not in the database). */
const SHARED_CHECKED = new Map(SEED_DATED_EVENTS.map((e) => [e.slug, e.checkedAgainst] as const));
const SYSTEM_CHECKED = new Map(SEED_DECAY_SYSTEMS.map((d) => [d.slug, d.checkedAgainst] as const));

export const LIBRARY_SCOPES = ["all", "shared", "ours"] as const;
export type LibraryScope = (typeof LIBRARY_SCOPES)[number];

/** Most results the search route answers with. */
export const SEARCH_LIMIT = 20;

export const SHARED_READ_ONLY =
  "Shared library entries are read-only: they are reference data kept with their sources. To use a different figure, add your organisation's own entry.";

/** A refusal meant for the person using the form: a field (or "_form"), the reason and a status. */
export class LibraryError extends Error {
  constructor(message: string, public field = "_form", public status = 400) {
    super(message);
    this.name = "LibraryError";
  }
}

export function toEventView(row: DatedEvent): DatedEventView {
  return {
    id: row.id,
    slug: row.slug,
    name: row.name,
    summary: row.summary,
    ageMa: String(row.ageMa),
    uncertaintyMa: row.uncertaintyMa === null ? null : String(row.uncertaintyMa),
    ageKind: row.ageKind,
    ageText: formatAge(row.ageMa, row.uncertaintyMa, row.ageKind).text,
    citation: row.citation,
    doi: row.doi,
    url: row.url,
    datingMethod: row.datingMethod,
    verification: row.verification,
    checkedAgainst: row.organisationId === null ? (SHARED_CHECKED.get(row.slug) ?? null) : null,
    scope: row.organisationId === null ? "shared" : "organisation",
  };
}

/** Names of the people who added and last changed an entry (null where unknown). */
export async function entryPeople(row: DatedEvent): Promise<{ addedBy: string | null; changedBy: string | null }> {
  const ids = [row.createdById, row.updatedById].filter((x): x is number => x !== null);
  const people = ids.length ? await User.findAll({ where: { id: ids }, attributes: ["id", "name"] }) : [];
  const nameOf = (id: number | null) => people.find((p) => p.id === id)?.name ?? null;
  return { addedBy: nameOf(row.createdById), changedBy: nameOf(row.updatedById) };
}

/**
 * Interval-name warnings for library entries on the organisation's current chart edition (the one
 * place the library asks which edition that is). Empty when the organisation has no current edition.
 */
export async function libraryIntervalWarnings(
  organisationId: number,
  events: readonly DatedEventView[],
): Promise<{ editionLabel: string | null; warnings: IntervalWarning[] }> {
  const edition = await currentEditionFor(organisationId);
  if (!edition) return { editionLabel: null, warnings: [] };
  const intervals = await editionIntervals(edition.id);
  return { editionLabel: edition.label, warnings: checkIntervalNames(intervals, events, { editionLabel: edition.label }) };
}

/** Entries an organisation can see: the shared library and its own. */
function visibleTo(organisationId: number, scope: LibraryScope = "all"): WhereOptions<DatedEvent> {
  if (scope === "shared") return { organisationId: null };
  if (scope === "ours") return { organisationId };
  return { [Op.or]: [{ organisationId: null }, { organisationId }] };
}

function likePattern(word: string) {
  return `%${word.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** Every word of the query must appear in the name or the summary (case-insensitive). */
function matching(q: string): WhereOptions<DatedEvent> | null {
  const words = q.trim().split(/\s+/).filter(Boolean).slice(0, 8);
  if (words.length === 0) return null;
  return {
    [Op.and]: words.map((w) => ({ [Op.or]: [{ name: { [Op.iLike]: likePattern(w) } }, { summary: { [Op.iLike]: likePattern(w) } }] })),
  };
}

/** The library page: shared + own (or one of them), optionally filtered by a query; oldest first. */
export async function listEvents(organisationId: number, opts: { q?: string; scope?: LibraryScope } = {}): Promise<DatedEventView[]> {
  const match = matching(opts.q ?? "");
  const rows = await DatedEvent.findAll({
    where: { [Op.and]: [visibleTo(organisationId, opts.scope), ...(match ? [match] : [])] },
    order: [["ageMa", "DESC"], ["name", "ASC"]],
  });
  return rows.map(toEventView);
}

/**
 * Search-as-you-type for the composer: name or summary match, names that start with the query
 * first, then names containing it, then summary-only matches; oldest first within each. At most
 * `limit` (≤ 20) results.
 */
export async function searchEvents(organisationId: number, q: string, limit = SEARCH_LIMIT): Promise<DatedEventView[]> {
  const match = matching(q);
  const rows = await DatedEvent.findAll({
    where: { [Op.and]: [visibleTo(organisationId), ...(match ? [match] : [])] },
    order: [["ageMa", "DESC"], ["name", "ASC"]],
    limit: 500,
  });
  const needle = q.trim().toLowerCase();
  const rank = (r: DatedEvent) => {
    const name = r.name.toLowerCase();
    if (!needle) return 0;
    if (name.startsWith(needle)) return 0;
    if (name.includes(needle)) return 1;
    return 2;
  };
  return rows
    .map((r, i) => ({ r, i, k: rank(r) }))
    .sort((a, b) => a.k - b.k || a.i - b.i)
    .slice(0, Math.max(1, Math.min(limit, SEARCH_LIMIT)))
    .map(({ r }) => toEventView(r));
}

/** A shared entry or one of the organisation's own; null for anything else (→ 404). */
export async function findVisibleEvent(organisationId: number, id: number): Promise<DatedEvent | null> {
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  return DatedEvent.findOne({ where: { id, ...visibleTo(organisationId) } });
}

export interface LibraryEvent {
  id: number;
  name: string;
  ageMa: number;
  uncertaintyMa: number | null;
  citation: string;
}

/** The visible events among `ids` (what an exhibit's event markers point at), by id. */
export async function eventsByIds(ids: number[], organisationId: number): Promise<Map<number, LibraryEvent>> {
  if (ids.length === 0) return new Map();
  const rows = await DatedEvent.findAll({ where: { id: ids, ...visibleTo(organisationId) } });
  return new Map(
    rows.map((r) => [r.id, { id: r.id, name: r.name, ageMa: Number(r.ageMa), uncertaintyMa: r.uncertaintyMa == null ? null : Number(r.uncertaintyMa), citation: r.citation }]),
  );
}

/** An entry the organisation may change: its own. Shared → 403, another organisation's or none → 404. */
async function findOwnEvent(organisationId: number, id: number, transaction?: import("sequelize").Transaction): Promise<DatedEvent> {
  const row = Number.isSafeInteger(id) && id > 0 ? await DatedEvent.findByPk(id, { transaction, lock: transaction ? true : undefined }) : null;
  if (!row || (row.organisationId !== null && row.organisationId !== organisationId)) throw new LibraryError("There is no such entry in your library.", "_form", 404);
  if (row.organisationId === null) throw new LibraryError(SHARED_READ_ONLY, "_form", 403);
  return row;
}

async function assertSlugFree(organisationId: number, slug: string, exceptId?: number) {
  const clash = await DatedEvent.findOne({ where: { organisationId, slug, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) } });
  if (clash) throw new LibraryError(`Slug: another entry of your organisation (“${clash.name}”) already uses “${slug}”; choose another.`, "slug");
}

const FIELDS = ["slug", "name", "summary", "ageMa", "uncertaintyMa", "ageKind", "citation", "doi", "url", "datingMethod", "verification"] as const;

function snapshot(row: DatedEvent | DatedEventInput): Record<(typeof FIELDS)[number], string | null> {
  const out = {} as Record<(typeof FIELDS)[number], string | null>;
  for (const f of FIELDS) {
    const v = (row as unknown as Record<string, unknown>)[f];
    out[f] = v === null || v === undefined ? null : String(v);
  }
  return out;
}

function rethrowUnique(error: unknown, slug: string): never {
  if (error instanceof UniqueConstraintError) throw new LibraryError(`Slug: another entry of your organisation already uses “${slug}”; choose another.`, "slug");
  throw error;
}

export interface Actor {
  id: number;
}

export async function createEvent(actor: Actor, organisationId: number, input: DatedEventInput): Promise<DatedEvent> {
  await assertSlugFree(organisationId, input.slug);
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await DatedEvent.create(
        { organisationId, ...input, verification: input.verification as Verification, createdById: actor.id, updatedById: actor.id },
        { transaction },
      );
      await audit(
        { organisationId, actorId: actor.id, action: "dated-event.create", objectType: "dated_event", objectId: row.id, details: { slug: row.slug, name: row.name, ageMa: input.ageMa, uncertaintyMa: input.uncertaintyMa } },
        transaction,
      );
      return row;
    });
  } catch (error) {
    rethrowUnique(error, input.slug);
  }
}

export async function updateEvent(actor: Actor, organisationId: number, id: number, input: DatedEventInput): Promise<{ row: DatedEvent; changed: string[] }> {
  await findOwnEvent(organisationId, id);
  await assertSlugFree(organisationId, input.slug, id);
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await findOwnEvent(organisationId, id, transaction);
      const before = snapshot(row);
      const after = snapshot(input);
      const changes: Record<string, { from: string | null; to: string | null }> = {};
      for (const f of FIELDS) {
        // NUMERIC compares by value: "4404" and "4404.0" are the same age but the new text is kept.
        if (before[f] !== after[f]) changes[f] = { from: before[f], to: after[f] };
      }
      if (Object.keys(changes).length === 0) return { row, changed: [] };
      await row.update({ ...input, updatedById: actor.id }, { transaction });
      await audit({ organisationId, actorId: actor.id, action: "dated-event.update", objectType: "dated_event", objectId: row.id, details: { slug: row.slug, changes } }, transaction);
      return { row, changed: Object.keys(changes) };
    });
  } catch (error) {
    rethrowUnique(error, input.slug);
  }
}

export async function deleteEvent(actor: Actor, organisationId: number, id: number): Promise<{ name: string }> {
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await findOwnEvent(organisationId, id, transaction);
      const { name, slug } = row;
      await row.destroy({ transaction });
      await audit({ organisationId, actorId: actor.id, action: "dated-event.delete", objectType: "dated_event", objectId: id, details: { slug, name, snapshot: snapshot(row) } }, transaction);
      return { name };
    });
  } catch (error) {
    if (error instanceof ForeignKeyConstraintError) {
      throw new LibraryError("This entry is used by markers in your exhibits. Point those markers at another entry (or remove them) first; nothing was deleted.", "_form", 409);
    }
    throw error;
  }
}

// ------------------------------------------------------------------------------------------
// Decay systems
// ------------------------------------------------------------------------------------------

/** A decay system as pages show it: the seed file's fields (exact decimal strings) and its id. */
export type DecaySystemView = Omit<SeedDecaySystem, "position"> & { id: number };

export function toDecaySystemView(row: DecaySystem): DecaySystemView {
  return {
    id: row.id,
    slug: row.slug,
    parent: row.parent,
    daughter: row.daughter,
    decayMode: row.decayMode,
    halfLifeYears: String(row.halfLifeYears),
    halfLifeUncertaintyYears: row.halfLifeUncertaintyYears === null ? null : String(row.halfLifeUncertaintyYears),
    decayConstantPerYear: String(row.decayConstantPerYear),
    decayConstantStated: row.decayConstantStated,
    branchConstantPerYear: row.branchConstantPerYear === null ? null : String(row.branchConstantPerYear),
    citation: row.citation,
    doi: row.doi,
    verification: row.verification,
    checkedAgainst: SYSTEM_CHECKED.get(row.slug) ?? null,
    notes: row.notes,
  };
}

export async function listDecaySystems(): Promise<DecaySystemView[]> {
  const rows = await DecaySystem.findAll({ order: [["position", "ASC"], ["slug", "ASC"]] });
  return rows.map(toDecaySystemView);
}
