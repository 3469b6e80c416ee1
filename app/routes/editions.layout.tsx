// The frame of the chart-edition pages (/editions…) and the glossary: readable by visitors and by
// every signed-in member. A member sees the same site navigation as in the studio, so the chart
// editions are one area (browse, compare, manage) with one navigation.
import { Outlet, data, useLocation } from "react-router";
import { GeneralErrorBoundary } from "~/components/error-boundary";
import { FlashNotice } from "~/components/forms";
import { EditionsTabs } from "~/components/site-nav";
import { StudioHeader } from "~/components/studio-header";
import { getSigned } from "#server/auth.server.ts";
import { readNotice } from "#server/session.server.ts";
import { studioHeaderOf } from "#server/studio-header.server.ts";
import type { Route } from "./+types/editions.layout";

export async function loader({ request }: Route.LoaderArgs) {
  const signed = await getSigned(request);
  const { notice, setCookie } = await readNotice(request);
  return data({ header: signed ? studioHeaderOf(signed) : null, notice }, setCookie ? { headers: { "Set-Cookie": setCookie } } : undefined);
}

export default function EditionsLayout({ loaderData }: Route.ComponentProps) {
  const { header, notice } = loaderData;
  const { pathname } = useLocation();
  return (
    <div className="min-h-screen">
      <StudioHeader header={header} signInTo={pathname} />
      <main className="mx-auto max-w-6xl px-4 py-6 sm:px-5 sm:py-8">
        {pathname.startsWith("/editions") ? <EditionsTabs canManage={Boolean(header?.may.editions)} canImport={Boolean(header?.may.importEditions)} /> : null}
        <FlashNotice notice={notice} />
        <Outlet />
      </main>
      <footer className="border-t border-rule px-4 py-6 text-center font-sans text-sm text-ink-soft">
        Shared chart data: International Commission on Stratigraphy, CC BY 4.0. The shared editions are also published as JSON for other programs: <a href="/api/timescales">list of editions (JSON)</a>.
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
