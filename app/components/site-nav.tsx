import { NavLink } from "react-router";
import { Wordmark } from "./site-header";

export interface NavItem {
  to: string;
  label: string;
  end?: boolean;
}

/** The wordmark and a row of section links, as the studio and the public edition pages show them. */
export function SiteNav({ label, links }: { label: string; links: NavItem[] }) {
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
      <Wordmark />
      <nav aria-label={label} className="flex flex-wrap gap-1">
        {links.map((l) => (
          <NavLink
            key={l.to}
            to={l.to}
            end={l.end}
            className={({ isActive }) => `rounded px-2.5 py-2 no-underline ${isActive ? "bg-paper-deep font-semibold text-ink" : "text-ink-soft hover:bg-paper"}`}
          >
            {l.label}
          </NavLink>
        ))}
      </nav>
    </div>
  );
}
