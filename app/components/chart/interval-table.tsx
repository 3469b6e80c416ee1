// The intervals of an edition as a table: filter by name, rank and how the base is defined (GSSP,
// GSSA); sort by any column.
import { useId, useMemo, useState } from "react";
import { RANKS, rankDepth, type Interval, type Rank } from "~/lib/timescale";
import { RANK_LABELS, fmtBoundaryKind, fmtMa } from "~/lib/chart/format";

type SortKey = "order" | "name" | "rank" | "base" | "top" | "uncertainty" | "gssp";
type GsspFilter = "all" | "gssp" | "gssa" | "no" | "unknown";

const gsspRank = (iv: Interval) => (iv.gssp === true ? (iv.boundaryKind === "GSSA" ? 1 : 0) : iv.gssp === false ? 2 : 3);
const gsspMatches = (iv: Interval, f: GsspFilter) =>
  f === "all" ||
  (f === "gssp" ? iv.gssp === true && iv.boundaryKind !== "GSSA" : f === "gssa" ? iv.boundaryKind === "GSSA" : f === "no" ? iv.gssp === false : iv.gssp === null);

const COMPARE: Record<SortKey, (a: Interval, b: Interval) => number> = {
  order: (a, b) => a.order - b.order,
  name: (a, b) => a.name.localeCompare(b.name, "en"),
  rank: (a, b) => rankDepth(a.rank) - rankDepth(b.rank) || b.baseMa - a.baseMa,
  base: (a, b) => a.baseMa - b.baseMa,
  top: (a, b) => a.topMa - b.topMa,
  uncertainty: (a, b) => (a.baseUncertaintyMa ?? -1) - (b.baseUncertaintyMa ?? -1),
  gssp: (a, b) => gsspRank(a) - gsspRank(b) || a.order - b.order,
};

export function IntervalTable({ intervals, caption }: { intervals: readonly Interval[]; caption: string }) {
  const id = useId();
  const [query, setQuery] = useState("");
  const [rank, setRank] = useState<Rank | "all">("all");
  const [gssp, setGssp] = useState<GsspFilter>("all");
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: "order", dir: 1 });

  const rows = useMemo(() => {
    const q = query.trim().toLowerCase();
    const filtered = intervals.filter(
      (iv) =>
        (rank === "all" || iv.rank === rank) &&
        gsspMatches(iv, gssp) &&
        (q === "" || iv.name.toLowerCase().includes(q) || (iv.parent ?? "").toLowerCase().includes(q)),
    );
    const cmp = COMPARE[sort.key];
    return [...filtered].sort((a, b) => sort.dir * cmp(a, b) || a.order - b.order);
  }, [intervals, query, rank, gssp, sort]);

  const ranksPresent = RANKS.filter((r) => intervals.some((iv) => iv.rank === r));



  return (
    <div>
      <div className="mb-3 flex flex-wrap items-end gap-3 font-sans text-sm">
        <div>
          <label htmlFor={`${id}-q`} className="mb-1 block font-semibold">Name or parent contains</label>
          <input id={`${id}-q`} type="search" className="field w-56" value={query} onChange={(e) => setQuery(e.target.value)} placeholder="e.g. Cretaceous" />
        </div>
        <div>
          <label htmlFor={`${id}-rank`} className="mb-1 block font-semibold">Rank</label>
          <select id={`${id}-rank`} className="field w-auto" value={rank} onChange={(e) => setRank(e.target.value as Rank | "all")}>
            <option value="all">All ranks</option>
            {ranksPresent.map((r) => <option key={r} value={r}>{RANK_LABELS[r]}</option>)}
          </select>
        </div>
        <div>
          <label htmlFor={`${id}-gssp`} className="mb-1 block font-semibold">Base defined by</label>
          <select id={`${id}-gssp`} className="field w-auto" value={gssp} onChange={(e) => setGssp(e.target.value as GsspFilter)}>
            <option value="all">Any</option>
            <option value="gssp">GSSP (a point in a rock section)</option>
            <option value="gssa">GSSA (a numerical age)</option>
            <option value="no">Not ratified</option>
            <option value="unknown">Not stated</option>
          </select>
        </div>
        <button type="button" className="btn-quiet" onClick={() => { setQuery(""); setRank("all"); setGssp("all"); setSort({ key: "order", dir: 1 }); }}>
          Chart order, no filter
        </button>
        <p className="ml-auto text-ink-soft" aria-live="polite">Showing {rows.length} of {intervals.length} intervals</p>
      </div>
      <div className="card scroll-x p-0">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="border-b border-rule bg-paper">
            <tr>
              <Header sort={sort} setSort={setSort} k="name">Name</Header>
              <Header sort={sort} setSort={setSort} k="rank">Rank</Header>
              <th scope="col" className="px-3 py-2">Parent</th>
              <Header sort={sort} setSort={setSort} k="base" num>Base (Ma)</Header>
              <Header sort={sort} setSort={setSort} k="uncertainty" num>± (Ma)</Header>
              <Header sort={sort} setSort={setSort} k="top" num>Top (Ma)</Header>
              <Header sort={sort} setSort={setSort} k="gssp">Base defined by</Header>
              <th scope="col" className="px-3 py-2">Colour</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((iv) => (
              <tr key={iv.name} className="border-b border-rule last:border-0">
                <td className="px-3 py-1.5 font-semibold" style={sort.key === "order" && rank === "all" ? { paddingLeft: `${0.75 + rankDepth(iv.rank) * 0.9}rem` } : undefined}>
                  {iv.name}
                </td>
                <td className="px-3 py-1.5">{RANK_LABELS[iv.rank]}</td>
                <td className="px-3 py-1.5 text-ink-soft">{iv.parent ?? "—"}</td>
                <td className="num px-3 py-1.5 text-right">{iv.approximate ? "~" : ""}{fmtMa(iv.baseMa)}</td>
                <td className="num px-3 py-1.5 text-right">{iv.baseUncertaintyMa === null ? <span className="text-ink-soft">—</span> : `± ${fmtMa(iv.baseUncertaintyMa)}`}</td>
                <td className="num px-3 py-1.5 text-right">{fmtMa(iv.topMa)}</td>
                <td className="px-3 py-1.5">{fmtBoundaryKind(iv)}</td>
                <td className="px-3 py-1.5">
                  <span className="flex items-center gap-2">
                    <span aria-hidden="true" className="inline-block h-4 w-7 rounded-sm border border-ink/40" style={{ background: iv.color }} />
                    <code className="text-xs">{iv.color.toUpperCase()}</code>
                  </span>
                </td>
              </tr>
            ))}
            {rows.length === 0 ? (
              <tr>
                <td colSpan={8} className="px-3 py-6 text-center text-ink-soft">No interval matches these filters.</td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}

type SortState = { key: SortKey; dir: 1 | -1 };

function Header({ k, children, num, sort, setSort }: { k: SortKey; children: React.ReactNode; num?: boolean; sort: SortState; setSort: (update: (s: SortState) => SortState) => void }) {
  const active = sort.key === k;
  return (
    <th scope="col" aria-sort={active ? (sort.dir === 1 ? "ascending" : "descending") : "none"} className={`p-0 ${num ? "text-right" : ""}`}>
      <button
        type="button"
        className={`flex min-h-10 w-full items-center gap-1 px-3 py-2 font-semibold hover:bg-paper-deep ${num ? "justify-end" : ""}`}
        onClick={() => setSort((s) => (s.key === k ? { key: k, dir: s.dir === 1 ? -1 : 1 } : { key: k, dir: 1 }))}
      >
        {children}
        <span aria-hidden="true" className="text-ink-soft">{active ? (sort.dir === 1 ? "▲" : "▼") : "↕"}</span>
      </button>
    </th>
  );
}
