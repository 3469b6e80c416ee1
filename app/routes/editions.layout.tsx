// The frame of the public chart-edition pages (/editions…): readable by visitors and by every
// signed-in member; those who manage editions also see their drafts and the management links.
import { Link, Outlet, data } from "react-router";
import { GeneralErrorBoundary } from "~/components/error-boundary";
import { FormMessage } from "~/components/forms";
import { SiteNav } from "~/components/site-nav";
import { managesEditions, viewerOf } from "#server/editions.server.ts";
import { readNotice } from "#server/session.server.ts";
import type { Route } from "./+types/editions.layout";

export async function loader({ request }: Route.LoaderArgs) {
  const viewer = await viewerOf(request);
  const { notice, setCookie } = await readNotice(request);
  return data(
    { viewer: viewer ? { name: viewer.name, canManage: managesEditions(viewer), member: viewer.member || viewer.subject.steward } : null, notice },
    setCookie ? { headers: { "Set-Cookie": setCookie } } : undefined,
  );
}

export default function EditionsLayout({ loaderData }: Route.ComponentProps) {
  const { viewer, notice } = loaderData;
  const links = [
    { to: "/editions", label: "Chart editions", end: true },
    { to: "/editions/compare", label: "Compare" },
    ...(viewer?.canManage ? [{ to: "/studio/editions", label: "Manage", end: false }] : []),
  ];
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-5 py-3">
          <SiteNav label="Chart editions" links={links} />
          <div className="flex items-center gap-3 font-sans text-sm">
            {viewer ? (
              <>
                <span className="text-ink-soft">{viewer.name}</span>
                {viewer.member ? <Link to="/studio" className="btn-quiet no-underline">Back to the studio</Link> : null}
              </>
            ) : (
              <Link to="/login?redirectTo=%2Feditions" className="btn-quiet no-underline">Sign in</Link>
            )}
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-5 py-8">
        {notice ? <FormMessage kind={notice.kind}>{notice.message}</FormMessage> : null}
        <Outlet />
      </main>
      <footer className="border-t border-rule py-6 text-center font-sans text-sm text-ink-soft">
        Shared chart data: International Commission on Stratigraphy, CC BY 4.0 · Public JSON of the shared editions at <code>/api/timescales</code>
      </footer>
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
