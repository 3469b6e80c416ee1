// The heading block of a studio or edition page: an optional trail back ("Exhibits / riverside"),
// the title, a lead sentence, anything else under them (status lines, badges), and the page's
// main actions on the right.
import { Link } from "react-router";

export interface Crumb {
  to: string;
  label: string;
}

export function PageHeader({
  title,
  crumbs,
  current,
  lead,
  actions,
  align = "end",
  children,
}: {
  title: React.ReactNode;
  /** Pages above this one; `current` names this one at the end of the trail. */
  crumbs?: Crumb[];
  current?: string;
  lead?: React.ReactNode;
  actions?: React.ReactNode;
  align?: "start" | "end";
  children?: React.ReactNode;
}) {
  return (
    <div className={`flex flex-wrap justify-between gap-4 ${align === "start" ? "items-start" : "items-end"}`}>
      <div>
        {crumbs?.length ? (
          <p className="font-sans text-sm text-ink-soft">
            {crumbs.map((c) => (
              <span key={c.to}><Link to={c.to}>{c.label}</Link> / </span>
            ))}
            {current}
          </p>
        ) : null}
        <h1 className={`text-3xl ${crumbs?.length ? "mt-1" : ""}`}>{title}</h1>
        {lead ? <p className="mt-1 text-ink-soft">{lead}</p> : null}
        {children}
      </div>
      {actions ? <div className="flex flex-wrap gap-2 font-sans text-sm">{actions}</div> : null}
    </div>
  );
}
