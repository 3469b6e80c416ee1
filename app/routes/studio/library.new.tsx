// /studio/library/new — editors and admins add one of their organisation's own library entries.
// ?from=<id> starts from a copy of a visible entry (e.g. a shared one whose figure they want to
// state differently).
import { data, Link, redirect, useNavigation } from "react-router";
import { EMPTY_EVENT_FORM, EventForm, formValues, type EventFormValues } from "~/components/dated-events/event-form";
import { DatedEventFormSchema, displayUnit, fromMa } from "~/lib/dated-events";
import { parseForm } from "~/lib/validation";
import { requirePermission } from "#server/auth.server.ts";
import { createEvent, findVisibleEvent, LibraryError } from "#server/dated-events.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/library.new";

export const meta: Route.MetaFunction = () => [{ title: "Add an event · Event library · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requirePermission(request, "dated-events.manage");
  const from = Number(new URL(request.url).searchParams.get("from"));
  let values: EventFormValues = EMPTY_EVENT_FORM;
  let copiedFrom: string | null = null;
  if (from) {
    const source = await findVisibleEvent(member.organisation.id, from);
    if (source) {
      const unit = displayUnit(String(source.ageMa));
      values = {
        name: source.name,
        slug: "",
        summary: source.summary,
        ageValue: fromMa(String(source.ageMa), unit),
        ageUnit: unit,
        uncertaintyValue: source.uncertaintyMa === null ? "" : fromMa(String(source.uncertaintyMa), unit),
        ageKind: source.ageKind,
        citation: source.citation,
        doi: source.doi ?? "",
        url: source.url ?? "",
        datingMethod: source.datingMethod ?? "",
        verification: source.verification,
      };
      copiedFrom = source.name;
    }
  }
  return { organisation: member.organisation.name, values, copiedFrom };
}

export async function action({ request }: Route.ActionArgs) {
  const member = await requirePermission(request, "dated-events.manage");
  const form = await request.formData();
  const parsed = parseForm(DatedEventFormSchema, form);
  if (!parsed.ok) return data({ error: parsed.formError, fields: parsed.fieldErrors, values: formValues(form) }, { status: 400 });
  try {
    const row = await createEvent({ id: member.user.id }, member.organisation.id, parsed.data);
    return redirect(`/studio/library/${row.id}`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message: `“${row.name}” is in ${member.organisation.name}'s library.` }) } });
  } catch (error) {
    if (error instanceof LibraryError) return data({ error: error.message, fields: { [error.field]: error.message } as Record<string, string>, values: formValues(form) }, { status: error.status });
    throw error;
  }
}

export default function NewLibraryEvent({ loaderData, actionData }: Route.ComponentProps) {
  const { organisation, values, copiedFrom } = loaderData;
  const busy = useNavigation().state === "submitting";
  return (
    <div className="max-w-3xl">
      <p className="font-sans text-sm"><Link to="/studio/library">← Event library</Link></p>
      <h1 className="mt-2 text-3xl">Add an event to {organisation}'s library</h1>
      <p className="mb-6 mt-2 text-ink-soft">
        {copiedFrom
          ? `Starting from a copy of “${copiedFrom}”. Change what your source says differently; the shared entry stays as it is.`
          : "Only your organisation sees its own entries. Every figure needs its published source."}
      </p>
      <EventForm
        values={actionData?.values ?? values}
        errors={actionData?.fields}
        formError={actionData?.error}
        submitLabel="Add to the library"
        busy={busy}
        cancelTo="/studio/library"
      />
    </div>
  );
}
