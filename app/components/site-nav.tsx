import { Link, useLocation } from "react-router";
import { Wordmark } from "./site-header";

export interface NavItem {
  to: string;
  label: string;
  end?: boolean;
  /** Other path prefixes that belong to this section (the chart editions live at /editions and /studio/editions). */
  also?: string[];
}

function isActive(pathname: string, l: NavItem): boolean {
  const under = (p: string) => pathname === p || pathname.startsWith(`${p}/`);
  return (l.end ? pathname === l.to : under(l.to)) || (l.also ?? []).some(under);
}

/** The studio's sections, the same on every studio and chart-edition page a member opens. */
export function studioLinks(may: { member: boolean; team: boolean }): NavItem[] {
  return [
    ...(may.member ? [{ to: "/studio", label: "Overview", end: true }, { to: "/studio/exhibits", label: "Exhibits" }] : []),
    { to: "/editions", label: "Chart editions", also: ["/studio/editions"] },
    ...(may.member ? [{ to: "/studio/library", label: "Event library" }] : []),
    ...(may.team ? [{ to: "/studio/team", label: "Team" }] : []),
    ...(may.member ? [{ to: "/studio/account", label: "Account" }] : []),
    { to: "/glossary", label: "Glossary" },
  ];
}

/** The wordmark and a row of section links, as the studio and the public edition pages show them. */
export function SiteNav({ label, links }: { label: string; links: NavItem[] }) {
  const { pathname } = useLocation();
  return (
    <div className="flex min-w-0 flex-wrap items-center gap-x-4 gap-y-2">
      <Wordmark />
      <nav aria-label={label} className="flex min-w-0 flex-wrap gap-1">
        {links.map((l) => {
          const active = isActive(pathname, l);
          return (
            <Link
              key={l.to}
              to={l.to}
              aria-current={active ? "page" : undefined}
              className={`rounded px-2.5 py-2 no-underline ${active ? "bg-paper-deep font-semibold text-ink" : "text-ink-soft hover:bg-paper"}`}
            >
              {l.label}
            </Link>
          );
        })}
      </nav>
    </div>
  );
}

/** The chart-editions area's own tabs, under the site navigation on /editions… and /studio/editions…. */
export function EditionsTabs({ canManage, canImport }: { canManage: boolean; canImport: boolean }) {
  const links: NavItem[] = [
    { to: "/editions", label: "All editions", end: true },
    { to: "/editions/compare", label: "Compare two editions" },
    ...(canManage ? [{ to: "/studio/editions", label: "Manage", end: true }] : []),
    ...(canImport ? [{ to: "/studio/editions/import", label: "Import" }] : []),
  ];
  const { pathname } = useLocation();
  return (
    <nav aria-label="Chart editions" className="mb-6 flex flex-wrap gap-x-1 gap-y-1 border-b border-rule font-sans text-sm">
      {links.map((l) => {
        const active = isActive(pathname, l) || (l.to === "/editions" && /^\/editions\/(?!compare)[^/]+$/.test(pathname));
        return (
          <Link key={l.to} to={l.to} aria-current={active ? "page" : undefined} className={`-mb-px border-b-2 px-3 py-2 no-underline ${active ? "border-sandstone-600 font-semibold text-ink" : "border-transparent text-ink-soft hover:text-ink"}`}>
            {l.label}
          </Link>
        );
      })}
    </nav>
  );
}
