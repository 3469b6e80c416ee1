// The studio's exhibit list: one row per exhibit, filtered and sorted as the list page's query asks.
export const EXHIBIT_SORTS = ["title", "medium", "length", "edition", "status", "updated"] as const;
export type ExhibitSort = (typeof EXHIBIT_SORTS)[number];

export interface ExhibitListRow {
  slug: string;
  title: string;
  /** "wall", or "route (trail)" for route exhibits. */
  medium: string;
  metres: number;
  length: string;
  edition: string;
  needsRecheck: boolean;
  status: string;
  revision: number;
  markers: number;
  /** ISO time of the last save. */
  updated: string;
  updatedBy: string | null;
}

export interface ExhibitListQuery {
  q: string;
  medium: string;
  recheck: boolean;
  sort: ExhibitSort;
  dir: "asc" | "desc";
}

/** The list page's query string; unknown values fall back to the newest first. */
export function exhibitListQuery(params: URLSearchParams): ExhibitListQuery {
  const asked = params.get("sort") ?? "";
  const sort: ExhibitSort = (EXHIBIT_SORTS as readonly string[]).includes(asked) ? (asked as ExhibitSort) : "updated";
  const dirParam = params.get("dir");
  const dir = dirParam === "asc" || dirParam === "desc" ? dirParam : sort === "updated" ? "desc" : "asc";
  return { q: (params.get("q") ?? "").trim().toLowerCase(), medium: params.get("medium") ?? "", recheck: params.get("recheck") === "1", sort, dir };
}

const SORT_KEYS: Record<ExhibitSort, (r: ExhibitListRow) => string | number> = {
  title: (r) => r.title.toLowerCase(),
  medium: (r) => r.medium,
  length: (r) => r.metres,
  edition: (r) => r.edition,
  status: (r) => r.status,
  updated: (r) => r.updated,
};

export function filterAndSortExhibits(rows: readonly ExhibitListRow[], query: ExhibitListQuery): ExhibitListRow[] {
  const { q, medium, recheck } = query;
  const kept = rows.filter((r) => (!q || r.title.toLowerCase().includes(q) || r.slug.includes(q)) && (!medium || r.medium.includes(medium)) && (!recheck || r.needsRecheck));
  const key = SORT_KEYS[query.sort];
  const dir = query.dir === "asc" ? 1 : -1;
  return kept.sort((a, b) => (key(a) < key(b) ? -dir : key(a) > key(b) ? dir : 0));
}
