// /studio/exhibits/:slug — the composer. The loader hands the page its data (server/exhibits/
// composer.server.ts); the action parses the posted form with one discriminated union on `intent`
// (app/lib/exhibit/intents.ts) and runs the matching command. The page is components/exhibit/composer.
import { data, redirect } from "react-router";
import { Composer } from "~/components/exhibit/composer";
import { LifecycleBar } from "~/components/exhibit/lifecycle-bar";
import { ComposerCommandSchema, type ComposerRefusal } from "~/lib/exhibit";
import { can } from "~/lib/permissions";
import { composerPermission } from "~/lib/review/lifecycle";
import { parseForm } from "~/lib/validation";
import { requireMember, requirePermission } from "#server/auth.server.ts";
import { composerImages } from "#server/assets/usage.server.ts";
import { composerView, runComposerCommand } from "#server/exhibits/composer.server.ts";
import { ExhibitError } from "#server/exhibits/load.server.ts";
import { exportMenuFiles } from "#server/exports/registry.server.ts";
import { readExhibitForm } from "#server/exhibits/revise.server.ts";
import { lifecycleView } from "#server/review/view.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/exhibits.$slug";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `${loaderData?.exhibit.title ?? "Exhibit"} · Eonscale` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const [view, images, lifecycle] = await Promise.all([
    composerView(member.organisation.id, params.slug, can(member.subject, "exhibit.edit")),
    composerImages(member.organisation.id, params.slug),
    lifecycleView({ organisationId: member.organisation.id, user: member.user, subject: member.subject }, params.slug),
  ]);
  const exportMenu = { publication: lifecycle.latestPublication?.number ?? null, organisation: lifecycle.organisation, files: exportMenuFiles(view.spec.medium.kind) };
  return { ...view, images, lifecycle, exportMenu };
}

const refuse = (status: number, refusal: ComposerRefusal) => data(refusal, { status });

export async function action({ request, params }: Route.ActionArgs) {
  await requireMember(request);
  const read = await readExhibitForm(request);
  if (!read.ok) return refuse(413, { intent: "replace-route", error: read.message, fields: { routeFile: read.message } });
  const intent = String(read.form.get("intent") ?? "");
  // Publishing (designers and admins) and submitting have their own permissions; every other form edits.
  const member = await requirePermission(request, composerPermission(intent));
  const command = parseForm(ComposerCommandSchema, read.form);
  if (!command.ok) return refuse(400, { intent, error: command.formError, fields: command.fieldErrors });
  let message: string;
  try {
    message = await runComposerCommand({ organisationId: member.organisation.id, user: member.user, subject: member.subject }, params.slug, command.data);
  } catch (error) {
    if (error instanceof ExhibitError) return refuse(error.status, { intent, error: error.message, fields: { [error.field]: error.message } });
    throw error;
  }
  return redirect(`/studio/exhibits/${params.slug}`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
}

export default function ExhibitPage({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <Composer view={loaderData} refusal={actionData}>
      <LifecycleBar view={loaderData.lifecycle} />
    </Composer>
  );
}
