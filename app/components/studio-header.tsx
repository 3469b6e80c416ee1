// The site header of the studio and of the chart-edition pages: the wordmark, the sections this
// person may open, the organisation switch and sign-out (or, for a visitor, sign-in).
import { Form, Link } from "react-router";
import { SiteNav, studioLinks } from "~/components/site-nav";
import type { StudioHeaderData } from "~/lib/site-header";

export function StudioHeader({ header, signInTo }: { header: StudioHeaderData | null; signInTo?: string }) {
  const links = header ? studioLinks(header.may) : studioLinks({ member: false, team: false });
  return (
    <header className="border-b border-rule bg-white">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-4 py-3 sm:px-5">
        <SiteNav label={header ? "Studio" : "Site"} links={links} />
        {header ? <Account header={header} /> : (
          <Link to={`/login?redirectTo=${encodeURIComponent(signInTo ?? "/studio")}`} className="btn-quiet font-sans text-sm no-underline">Sign in</Link>
        )}
      </div>
    </header>
  );
}

function Account({ header: { user, organisation, roles, steward, organisations } }: { header: StudioHeaderData }) {
  return (
    <div className="flex min-w-0 flex-wrap items-center gap-3 font-sans text-sm">
      {organisations.length > 1 ? (
        <Form method="post" action="/studio/switch-organisation" className="flex min-w-0 items-center gap-2">
          <label htmlFor="org-switch" className="sr-only">Organisation</label>
          <select id="org-switch" name="organisationId" defaultValue={organisation?.id} className="field w-auto max-w-[15rem]">
            {organisations.map((o) => (
              <option key={o.id} value={o.id}>{o.name} ({o.roles})</option>
            ))}
          </select>
          <button type="submit" className="btn-quiet">Switch</button>
        </Form>
      ) : null}
      <div className="flex min-w-0 flex-col leading-tight sm:text-right">
        {organisations.length > 1 || !organisation ? null : <span className="font-semibold">{organisation.name}</span>}
        <span className="text-ink-soft" title={user.email}>{user.name} · {roles}{steward && organisation ? " · chart steward" : ""}</span>
      </div>
      <Form method="post" action="/logout">
        <button type="submit" className="btn-quiet">Sign out</button>
      </Form>
    </div>
  );
}
