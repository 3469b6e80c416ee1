import { Outlet, data, useLocation } from "react-router";
import { GeneralErrorBoundary } from "~/components/error-boundary";
import { FlashNotice } from "~/components/forms";
import { EditionsTabs } from "~/components/site-nav";
import { StudioHeader } from "~/components/studio-header";
import { requireAnyPermission, requireMember } from "#server/auth.server.ts";
import { readNotice } from "#server/session.server.ts";
import { studioHeaderOf } from "#server/studio-header.server.ts";
import type { Route } from "./+types/layout";

export async function loader({ request }: Route.LoaderArgs) {
  // A chart steward who belongs to no organisation still reaches the edition pages.
  const member = await requireMember(request).catch(async (refusal) => {
    const steward = await requireAnyPermission(request, ["edition.manage-shared"]).catch(() => null);
    if (!steward) throw refusal;
    return steward;
  });
  const { notice, setCookie } = await readNotice(request);
  return data({ header: studioHeaderOf(member), notice }, setCookie ? { headers: { "Set-Cookie": setCookie } } : undefined);
}

export default function StudioLayout({ loaderData }: Route.ComponentProps) {
  const { header, notice } = loaderData;
  const { pathname } = useLocation();
  return (
    <div className="min-h-screen">
      <StudioHeader header={header} />
      <main className="mx-auto max-w-6xl px-4 py-6 sm:px-5 sm:py-8">
        {pathname.startsWith("/studio/editions") ? <EditionsTabs canManage={header.may.editions} canImport={header.may.importEditions} /> : null}
        <FlashNotice notice={notice} />
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
