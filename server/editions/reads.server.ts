// Reading chart editions for pages and the public API: summaries (with their owner, whether a shared
// edition is the latest, whether one is current for the reader's organisation), intervals, the
// organisation's current edition, and the log of edition changes.
import { Op, type Transaction } from "sequelize";
import { AuditEvent, ChartEdition, Interval as IntervalRow, Organisation, User } from "../../db/models/index.ts";
import { RANKS, type Correction, type EditionStatus, type Interval, type Rank } from "../../app/lib/timescale/index.ts";
import { intervalFields } from "../../app/lib/timescale/json.ts";
import { sequelize } from "../db.server.ts";
import { isVisible, PUBLIC_SCOPE, visibleWhere, type EditionScope } from "./viewer.server.ts";

/** A refusal meant for the person using the form: a field (or "_form"), the reason and the status. */
export class EditionError extends Error {
  constructor(message: string, public field = "_form", public status = 400) {
    super(message);
    this.name = "EditionError";
  }
}

/** A stored interval as the domain type. NUMERIC comes back as the decimal text that was stored. */
export function toInterval(row: IntervalRow, parentName: string | null): Interval {
  return {
    name: row.name,
    rank: row.rank,
    parent: parentName,
    baseMa: Number(row.baseMa),
    baseUncertaintyMa: row.baseUncertaintyMa === null ? null : Number(row.baseUncertaintyMa),
    topMa: Number(row.topMa),
    color: row.color,
    gssp: row.gssp,
    boundaryKind: row.boundaryKind ?? null,
    approximate: row.approximate,
    names: row.names ?? {},
    order: row.chartOrder,
  };
}

export type RankCounts = Record<Rank, number>;

export interface EditionSummary {
  id: number;
  slug: string;
  label: string;
  status: EditionStatus;
  source: string;
  licence: string;
  sourceFile: string | null;
  corrections: Correction[];
  counts: RankCounts;
  total: number;
  createdAt: string;
  createdBy: string | null;
  madeCurrentAt: string | null;
  madeCurrentBy: string | null;
  retiredAt: string | null;
  /** Owning organisation; null for a shared edition. */
  organisationId: number | null;
  /** "Marrowby Museum of the Earth" for an organisation's own edition; null for a shared one. */
  ownerName: string | null;
  /** The latest shared edition (a shared edition whose status is current). */
  latest: boolean;
  /** The edition the reader's organisation works against. */
  currentForOrganisation: boolean;
}

export const emptyCounts = (): RankCounts => Object.fromEntries(RANKS.map((r) => [r, 0])) as RankCounts;

const STATUS_ORDER: Record<EditionStatus, number> = { current: 0, draft: 1, retired: 2 };

function summarise(e: ChartEdition, counts: RankCounts, currentId: number | null): EditionSummary {
  return {
    id: e.id,
    slug: e.slug,
    label: e.label,
    status: e.status,
    source: e.source,
    licence: e.licence,
    sourceFile: e.sourceFile,
    corrections: e.corrections ?? [],
    counts,
    total: Object.values(counts).reduce((a, b) => a + b, 0),
    createdAt: e.createdAt.toISOString(),
    createdBy: e.createdBy?.name ?? null,
    madeCurrentAt: e.madeCurrentAt?.toISOString() ?? null,
    madeCurrentBy: e.madeCurrentBy?.name ?? null,
    retiredAt: e.retiredAt?.toISOString() ?? null,
    organisationId: e.organisationId,
    ownerName: e.organisation?.name ?? null,
    latest: e.organisationId === null && e.status === "current",
    currentForOrganisation: currentId !== null && e.id === currentId,
  };
}

const WITH_PEOPLE = [
  { model: User, as: "createdBy", attributes: ["id", "name"] },
  { model: User, as: "madeCurrentBy", attributes: ["id", "name"] },
  { model: Organisation, as: "organisation", attributes: ["id", "name"] },
];

async function countsByEdition(ids: number[]): Promise<Map<number, RankCounts>> {
  const out = new Map<number, RankCounts>(ids.map((id) => [id, emptyCounts()]));
  if (!ids.length) return out;
  const [rows] = (await sequelize.query(
    `SELECT edition_id, rank, count(*)::int AS n FROM intervals WHERE edition_id IN (:ids) GROUP BY edition_id, rank`,
    { replacements: { ids } },
  )) as [{ edition_id: number; rank: Rank; n: number }[], unknown];
  for (const r of rows) out.get(r.edition_id)![r.rank] = r.n;
  return out;
}

/** The latest shared edition (what a steward last made current), or null. */
export async function latestSharedEdition(transaction?: Transaction): Promise<ChartEdition | null> {
  return ChartEdition.findOne({ where: { organisationId: null, status: "current" }, transaction });
}

/**
 * The edition an organisation works against: the one it chose, or — until it has chosen one — the
 * latest shared edition. New exhibits pin to it; "needs re-check" is computed against it.
 */
export async function currentEditionFor(organisationId: number | null, transaction?: Transaction): Promise<ChartEdition | null> {
  if (organisationId !== null) {
    const org = await Organisation.findByPk(organisationId, { attributes: ["id", "currentEditionId"], transaction });
    if (org?.currentEditionId) return ChartEdition.findByPk(org.currentEditionId, { transaction });
  }
  return latestSharedEdition(transaction);
}

/** Every edition the scope may see: current (latest) first, then drafts, then retired; newest first within each. */
export async function listEditions(scope: EditionScope): Promise<EditionSummary[]> {
  const [rows, current] = await Promise.all([
    ChartEdition.findAll({ where: visibleWhere(scope), include: WITH_PEOPLE, order: [["createdAt", "DESC"], ["id", "DESC"]] }),
    scope.organisationId === null ? null : currentEditionFor(scope.organisationId),
  ]);
  const counts = await countsByEdition(rows.map((r) => r.id));
  return rows
    .map((r) => summarise(r, counts.get(r.id)!, current?.id ?? null))
    .sort((a, b) => STATUS_ORDER[a.status] - STATUS_ORDER[b.status] || Number(a.organisationId !== null) - Number(b.organisationId !== null));
}

/** The intervals of an edition in chart order. */
export async function editionIntervals(editionId: number, transaction?: Transaction): Promise<Interval[]> {
  return (await editionIntervalRows(editionId, transaction)).map((r) => r.interval);
}

/** The edition's intervals in chart order, each with its database id (for rows that reference one). */
export async function editionIntervalRows(editionId: number, transaction?: Transaction): Promise<{ id: number; interval: Interval }[]> {
  const rows = await IntervalRow.findAll({ where: { editionId }, order: [["chartOrder", "ASC"]], transaction });
  const nameOf = new Map(rows.map((r) => [r.id, r.name] as const));
  return rows.map((r) => ({ id: r.id, interval: toInterval(r, r.parentId === null ? null : (nameOf.get(r.parentId) ?? null)) }));
}

export interface LoadedEdition {
  edition: EditionSummary;
  intervals: Interval[];
}

/** An edition by slug with its intervals; null when missing or not visible to the scope. */
export async function loadEdition(slug: string, scope: EditionScope): Promise<LoadedEdition | null> {
  const row = await ChartEdition.findOne({ where: { slug }, include: WITH_PEOPLE });
  if (!row || !isVisible(row, scope)) return null;
  const [intervals, current] = await Promise.all([editionIntervals(row.id), scope.organisationId === null ? null : currentEditionFor(scope.organisationId)]);
  const counts = emptyCounts();
  for (const iv of intervals) counts[iv.rank]++;
  return { edition: summarise(row, counts, current?.id ?? null), intervals };
}

// ------------------------------------------------------------------------------------------
// The public JSON (shared editions only: an organisation's own editions never leave it).
// ------------------------------------------------------------------------------------------

/** The public API's interval: the same fields, in the same order, as the JSON download (without names and order). */
export const apiInterval = intervalFields;

/** `latest` is new beside the original keys: true for the latest shared edition. */
export function apiEditionMeta(e: EditionSummary) {
  return { slug: e.slug, label: e.label, status: e.status, source: e.source, licence: e.licence, latest: e.latest };
}

// ------------------------------------------------------------------------------------------
// The log of edition changes, where everyone concerned can read it: an organisation's editors see
// their own organisation's edition events and every steward change to the shared editions.
// ------------------------------------------------------------------------------------------

export interface EditionLogEntry {
  at: string;
  action: string;
  actor: string | null;
  slug: string | null;
  shared: boolean;
  details: Record<string, unknown>;
}

export async function editionLog(scope: EditionScope, limit = 30): Promise<EditionLogEntry[]> {
  const whose = scope.organisationId === null ? { organisationId: null } : { organisationId: { [Op.or]: [null, scope.organisationId] } };
  const rows = await AuditEvent.findAll({
    where: { ...whose, action: { [Op.like]: "edition.%" } },
    include: [{ model: User, as: "actor", attributes: ["id", "name"] }],
    order: [["createdAt", "DESC"], ["id", "DESC"]],
    limit,
  });
  return rows.map((r) => ({
    at: r.createdAt.toISOString(),
    action: r.action,
    actor: (r as AuditEvent & { actor?: User | null }).actor?.name ?? null,
    slug: typeof r.details?.slug === "string" ? r.details.slug : null,
    shared: r.organisationId === null,
    details: r.details ?? {},
  }));
}

/** The body of GET /api/timescales/:slug (or null: unknown, a draft, or an organisation's own edition). */
export async function apiEditionBody(slug: string) {
  const loaded = await loadEdition(slug, PUBLIC_SCOPE);
  if (!loaded) return null;
  const { edition, intervals } = loaded;
  return {
    edition: { ...apiEditionMeta(edition), madeCurrentAt: edition.madeCurrentAt, corrections: edition.corrections },
    intervals: intervals.map(apiInterval),
  };
}
