import { Form, Outlet, data } from "react-router";
import { GeneralErrorBoundary } from "~/components/error-boundary";
import { FormMessage } from "~/components/forms";
import { SiteNav } from "~/components/site-nav";
import { can } from "~/lib/permissions";
import { rolesInWords } from "~/lib/roles";
import { requireAnyPermission, requireMember } from "#server/auth.server.ts";
import { readNotice } from "#server/session.server.ts";
import type { Route } from "./+types/layout";

export async function loader({ request }: Route.LoaderArgs) {
  // A chart steward who belongs to no organisation still reaches the edition pages.
  const member = await requireMember(request).catch(async (refusal) => {
    const steward = await requireAnyPermission(request, ["edition.manage-shared"]).catch(() => null);
    if (!steward) throw refusal;
    return steward;
  });
  const { notice, setCookie } = await readNotice(request);
  const subject = member.subject;
  return data(
    {
      user: { name: member.user.name, email: member.user.email },
      organisation: member.organisation ? { id: member.organisation.id, name: member.organisation.name } : null,
      roles: rolesInWords(member.roles) || (subject.steward ? "Chart steward" : ""),
      steward: subject.steward,
      may: {
        editions: can(subject, "edition.import") || can(subject, "edition.set-current") || can(subject, "edition.manage-shared"),
        team: can(subject, "members.manage"),
      },
      organisations: member.memberships.map((m) => ({ id: m.organisationId, name: m.organisation!.name, roles: rolesInWords(m.roles, { lower: true }) })),
      notice,
    },
    setCookie ? { headers: { "Set-Cookie": setCookie } } : undefined,
  );
}

export default function StudioLayout({ loaderData }: Route.ComponentProps) {
  const { user, organisation, roles, steward, may, organisations, notice } = loaderData;
  const member = organisation !== null;
  const links = [
    { to: "/studio", label: "Overview", end: true, show: member },
    { to: "/studio/exhibits", label: "Exhibits", show: member },
    // Those who manage editions do it here; everyone else reads them on the public pages.
    { to: may.editions ? "/studio/editions" : "/editions", label: "Chart editions", show: true },
    { to: "/studio/library", label: "Event library", show: member },
    { to: "/studio/team", label: "Team", show: may.team },
    { to: "/studio/account", label: "Account", show: member },
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
                <select id="org-switch" name="organisationId" defaultValue={organisation?.id} className="field w-auto">
                  {organisations.map((o) => (
                    <option key={o.id} value={o.id}>{o.name} ({o.roles})</option>
                  ))}
                </select>
                <button type="submit" className="btn-quiet">Switch</button>
              </Form>
            ) : null}
            <div className="flex flex-col text-right leading-tight">
              {organisations.length > 1 || !organisation ? null : <span className="font-semibold">{organisation.name}</span>}
              <span className="text-ink-soft" title={user.email}>{user.name} · {roles}{steward && organisation ? " · chart steward" : ""}</span>
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
