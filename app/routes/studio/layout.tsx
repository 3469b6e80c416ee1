import { Form, Outlet, data } from "react-router";
import { GeneralErrorBoundary } from "~/components/error-boundary";
import { FormMessage } from "~/components/forms";
import { SiteNav } from "~/components/site-nav";
import { ROLE_LABELS } from "~/lib/roles";
import { requireMember } from "#server/auth.server.ts";
import { readNotice } from "#server/session.server.ts";
import type { Route } from "./+types/layout";

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const { notice, setCookie } = await readNotice(request);
  return data(
    {
      user: { name: member.user.name, email: member.user.email },
      organisation: { id: member.organisation.id, name: member.organisation.name },
      role: member.role,
      organisations: member.memberships.map((m) => ({ id: m.organisationId, name: m.organisation!.name, role: m.role })),
      notice,
    },
    setCookie ? { headers: { "Set-Cookie": setCookie } } : undefined,
  );
}

export default function StudioLayout({ loaderData }: Route.ComponentProps) {
  const { user, organisation, role, organisations, notice } = loaderData;
  const links = [
    { to: "/studio", label: "Overview", end: true, show: true },
    { to: "/studio/exhibits", label: "Exhibits", show: true },
    // Editors and admins manage editions here; everyone else reads them on the public pages.
    { to: role === "editor" || role === "admin" ? "/studio/editions" : "/editions", label: "Chart editions", show: true },
    { to: "/studio/library", label: "Event library", show: true },
    { to: "/studio/team", label: "Team", show: role === "admin" },
    { to: "/studio/account", label: "Account", show: true },
  ];
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-5 py-3">
          <SiteNav label="Studio" links={links.filter((l) => l.show)} />
          <div className="flex items-center gap-3 font-sans text-sm">
            {organisations.length > 1 ? (
              <Form method="post" action="/studio/switch-organisation" className="flex items-center gap-2">
                <label htmlFor="org-switch" className="sr-only">Organisation</label>
                <select id="org-switch" name="organisationId" defaultValue={organisation.id} className="field w-auto">
                  {organisations.map((o) => (
                    <option key={o.id} value={o.id}>{o.name} ({ROLE_LABELS[o.role].toLowerCase()})</option>
                  ))}
                </select>
                <button type="submit" className="btn-quiet">Switch</button>
              </Form>
            ) : null}
            <div className="flex flex-col text-right leading-tight">
              {organisations.length > 1 ? null : <span className="font-semibold">{organisation.name}</span>}
              <span className="text-ink-soft" title={user.email}>{user.name} · {ROLE_LABELS[role]}</span>
            </div>
            <Form method="post" action="/logout">
              <button type="submit" className="btn-quiet">Sign out</button>
            </Form>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-5 py-8">
        {notice ? <FormMessage kind={notice.kind}>{notice.message}</FormMessage> : null}
        <Outlet />
      </main>
    </div>
  );
}

export function ErrorBoundary() {
  return (
    <main className="mx-auto max-w-2xl p-8">
      <GeneralErrorBoundary />
    </main>
  );
}
