// What the visitor pages read: the latest publication of an exhibit (never a draft), by
// organisation and exhibit slug. The head (number, hash, languages) is kept a few seconds per
// address so that a revalidation (304) costs no database round trip; the parsed snapshot is kept
// per hash (a publication never changes). A newer publication shows within HEAD_TTL_MS on every
// app server.
import { QueryTypes } from "sequelize";
import type { PublicationMeta, PublicationSnapshot } from "../../app/lib/publication/types.ts";
import { sequelize } from "../db.server.ts";
import { findPublished } from "../publications/public.server.ts";
import { negotiateLanguage } from "../../app/lib/visit/language.ts";
import { pageBasics, type PageBasics } from "../../app/lib/visit/view.ts";

export const HEAD_TTL_MS = 5_000;
const SNAPSHOTS_KEPT = 16;
const HEADS_KEPT = 2_000;

export interface VisitHead {
  exhibitId: number;
  org: string;
  slug: string;
  /** The address used an old slug (frozen-slug redirects): answer 301 to org/slug. */
  moved: boolean;
  number: number;
  sha256: string;
  approvedAt: string;
  publishedAt: string;
  /** The edition's language tags (interval names), from the snapshot. */
  languages: string[];
}

export interface VisitPublication {
  head: VisitHead;
  meta: PublicationMeta;
  snapshot: PublicationSnapshot;
}

const heads = new Map<string, { at: number; head: Promise<VisitHead | null> }>();
const snapshots = new Map<string, Promise<{ meta: PublicationMeta; snapshot: PublicationSnapshot }>>();

/** Tests and the benchmark: forget what is kept (e.g. right after publishing). */
export function forgetVisitHeads() {
  heads.clear();
}

async function readHead(org: string, slug: string): Promise<VisitHead | null> {
  const found = await findPublished(org, slug);
  if (!found) return null;
  const [row] = await sequelize.query<{ number: number; sha256: string; approvedAt: Date; publishedAt: Date; languages: string[] | null }>(
    `SELECT number, sha256, approved_at AS "approvedAt", published_at AS "publishedAt", snapshot->'edition'->'languages' AS languages
       FROM publications WHERE exhibit_id = $1 ORDER BY number DESC LIMIT 1`,
    { bind: [found.exhibitId], type: QueryTypes.SELECT },
  );
  if (!row) return null;
  return {
    exhibitId: found.exhibitId,
    org: found.org,
    slug: found.slug,
    moved: found.moved,
    number: row.number,
    sha256: row.sha256,
    approvedAt: new Date(row.approvedAt).toISOString(),
    publishedAt: new Date(row.publishedAt).toISOString(),
    languages: row.languages?.length ? row.languages : ["en"],
  };
}

/** The latest publication's head for /visit/:org/:slug, or null (unknown, or never published). */
export function visitHead(org: string, slug: string, now = Date.now()): Promise<VisitHead | null> {
  const key = `${org}\u0000${slug}`;
  const kept = heads.get(key);
  if (kept && now - kept.at < HEAD_TTL_MS) return kept.head;
  const head = readHead(org, slug);
  heads.delete(key);
  if (heads.size >= HEADS_KEPT) heads.delete(heads.keys().next().value!);
  heads.set(key, { at: now, head });
  head.catch(() => heads.delete(key));
  return head;
}

function readSnapshot(head: VisitHead) {
  let kept = snapshots.get(head.sha256);
  if (!kept) {
    kept = sequelize
      .query<{ meta: PublicationMeta; snapshot_canonical: string }>(`SELECT meta, snapshot_canonical FROM publications WHERE exhibit_id = $1 AND number = $2`, {
        bind: [head.exhibitId, head.number],
        type: QueryTypes.SELECT,
      })
      .then(([row]) => ({ meta: row.meta, snapshot: JSON.parse(row.snapshot_canonical) as PublicationSnapshot }));
    if (snapshots.size >= SNAPSHOTS_KEPT) snapshots.delete(snapshots.keys().next().value!);
    snapshots.set(head.sha256, kept);
    kept.catch(() => snapshots.delete(head.sha256));
  }
  return kept;
}

/** The latest publication with its snapshot, or null. */
export async function visitPublication(org: string, slug: string): Promise<VisitPublication | null> {
  const head = await visitHead(org, slug);
  if (!head) return null;
  const { meta, snapshot } = await readSnapshot(head);
  return { head, meta, snapshot };
}

/** What every visitor page's loader starts from: the publication and the page's language and words. */
export interface VisitLoad extends VisitPublication {
  page: PageBasics;
}

/**
 * The latest publication of /visit/:org/:slug for this request, or a 404 thrown as a Response. The
 * language: ?lang= when the edition has it, else Accept-Language (app/lib/visit/language.ts).
 */
export async function loadVisit(request: Request, org: string, slug: string, path: (base: string) => string = (b) => b): Promise<VisitLoad> {
  const pub = await visitPublication(org, slug);
  if (!pub) throw new Response(JSON.stringify({ message: NOT_PUBLISHED }), { status: 404, headers: { "Content-Type": "application/json" } });
  const query = new URL(request.url).searchParams.get("lang");
  const lang = negotiateLanguage(query, request.headers.get("Accept-Language"), pub.head.languages);
  const base = `/visit/${pub.head.org}/${pub.head.slug}`;
  const page = pageBasics(
    pub.snapshot,
    { number: pub.head.number, sha256: pub.head.sha256, approvedAt: pub.head.approvedAt, publishedAt: pub.head.publishedAt, editionLabel: pub.meta.edition.label },
    lang,
    path(base),
    query ? `?lang=${lang}` : "",
  );
  return { ...pub, page };
}

export const NOT_PUBLISHED = "This address has no published exhibit or marker. Drafts are never shown to visitors.";
