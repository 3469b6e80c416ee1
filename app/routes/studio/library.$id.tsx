// /studio/library/:id — one library entry. Everyone reads it (with its "how we know" figures where
// the dating method is radiometric); editors and admins edit or delete their organisation's own
// entries. Shared entries are read-only (403 on any change); another organisation's entry is 404.
import { data, Form, Link, redirect, useNavigation } from "react-router";
import { FormMessage } from "~/components/forms";
import { EventForm, formValues, ScopeBadge, type EventFormValues } from "~/components/dated-events/event-form";
import { checkedSentence, checksFigures } from "~/components/dated-events/checking";
import { decaySystemsForMethod, howWeKnow, decayFigures } from "~/lib/decay";
import { AGE_KIND_HINTS, AGE_KIND_LABELS, DatedEventFormSchema, displayUnit, fromMa } from "~/lib/dated-events";
import { parseForm } from "~/lib/validation";
import { can } from "~/lib/permissions";
import { notFound, requireMember, requirePermission } from "#server/auth.server.ts";
import { deleteEvent, entryPeople, findVisibleEvent, LibraryError, listDecaySystems, SHARED_READ_ONLY, toEventView, updateEvent } from "#server/dated-events.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/library.$id";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `${loaderData?.event.name ?? "Entry"} · Event library · Eonscale` }];

function idFrom(params: { id?: string }): number {
  const id = Number(params.id);
  return Number.isSafeInteger(id) && id > 0 ? id : 0;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const row = await findVisibleEvent(member.organisation.id, idFrom(params));
  if (!row) notFound("There is no such entry in your library.");
  const event = toEventView(row);
  const editable = event.scope === "organisation" && can(member.subject, "dated-events.manage");
  const [people, systems] = await Promise.all([entryPeople(row), listDecaySystems()]);
  // Editors, reviewers and admins check figures: they read how far this entry's were checked.
  const checker = checksFigures(member.roles);
  const unit = displayUnit(event.ageMa);
  const values: EventFormValues | null = editable
    ? {
        name: event.name,
        slug: event.slug,
        summary: event.summary,
        ageValue: fromMa(event.ageMa, unit),
        ageUnit: unit,
        uncertaintyValue: event.uncertaintyMa === null ? "" : fromMa(event.uncertaintyMa, unit),
        ageKind: event.ageKind,
        citation: event.citation,
        doi: event.doi ?? "",
        url: event.url ?? "",
        datingMethod: event.datingMethod ?? "",
        verification: event.verification,
      }
    : null;
  const slugs = decaySystemsForMethod(event.datingMethod);
  const howWeKnowPanels = systems
    .filter((s) => slugs.includes(s.slug))
    .map((s) => ({
      slug: s.slug,
      citation: s.citation,
      ...howWeKnow(Number(event.ageMa) * 1e6, decayFigures(s)),
    }));
  return {
    event,
    organisation: member.organisation.name,
    canManage: can(member.subject, "dated-events.manage"),
    editable,
    values,
    added: { by: people.addedBy, on: row.createdAt.toISOString().slice(0, 10) },
    changed: { by: people.changedBy, on: row.updatedAt.toISOString().slice(0, 10) },
    checked: checker ? checkedSentence(event.verification, event.checkedAgainst, event.scope === "shared") : null,
    howWeKnow: howWeKnowPanels,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requirePermission(request, "dated-events.manage");
  const id = idFrom(params);
  const form = await request.formData();
  const intent = String(form.get("intent") ?? "");
  const actor = { id: member.user.id };
  try {
    if (intent === "delete") {
      const { name } = await deleteEvent(actor, member.organisation.id, id);
      return redirect("/studio/library", { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message: `“${name}” has been deleted from ${member.organisation.name}'s library.` }) } });
    }
    if (intent !== "save") return data({ intent, error: "Unknown action: save the entry or delete it.", fields: {} as Record<string, string>, values: null }, { status: 400 });
    const parsed = parseForm(DatedEventFormSchema, form);
    if (!parsed.ok) {
      // A shared or foreign entry is refused as such even when the form is also wrong.
      await assertEditable(member.organisation.id, id);
      return data({ intent, error: parsed.formError, fields: parsed.fieldErrors, values: formValues(form) }, { status: 400 });
    }
    const { row, changed } = await updateEvent(actor, member.organisation.id, id, parsed.data);
    const message = changed.length === 0 ? "Nothing had changed." : `“${row.name}” has been saved.`;
    return redirect(`/studio/library/${row.id}`, { headers: { "Set-Cookie": await noticeHeader({ kind: changed.length ? "success" : "info", message }) } });
  } catch (error) {
    if (error instanceof LibraryError) {
      if (error.status === 404) notFound(error.message);
      return data({ intent, error: error.message, fields: { [error.field]: error.message } as Record<string, string>, values: intent === "save" ? formValues(form) : null }, { status: error.status });
    }
    throw error;
  }
}

async function assertEditable(organisationId: number, id: number) {
  const row = await findVisibleEvent(organisationId, id);
  if (!row) throw new LibraryError("There is no such entry in your library.", "_form", 404);
  if (row.organisationId === null) throw new LibraryError(SHARED_READ_ONLY, "_form", 403);
}

export default function LibraryEntry({ loaderData, actionData }: Route.ComponentProps) {
  const { event, organisation, canManage, editable, values, added, changed, checked, howWeKnow: panels } = loaderData;
  const busy = useNavigation().state === "submitting";
  const doiLink = event.doi ? `https://doi.org/${event.doi}` : null;
  return (
    <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
      <section>
        <p className="font-sans text-sm"><Link to="/studio/library">← Event library</Link></p>
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <h1 className="text-3xl">{event.name}</h1>
          <ScopeBadge scope={event.scope} />
        </div>
        {actionData && actionData.intent !== "save" ? <FormMessage>{actionData.error}</FormMessage> : null}
        {actionData?.intent === "save" && !editable ? <FormMessage>{actionData.error}</FormMessage> : null}
        <p className="mt-3 text-lg">{event.summary}</p>
        <dl className="card mt-6 grid gap-x-6 gap-y-3 font-sans text-sm sm:grid-cols-[10rem_1fr]">
          <dt className="font-semibold">Age</dt>
          <dd className="figures text-base font-semibold">{event.ageText}</dd>
          <dt className="font-semibold">Kind of age</dt>
          <dd>{AGE_KIND_LABELS[event.ageKind]} — {AGE_KIND_HINTS[event.ageKind]}</dd>
          {!/ Ma$/.test(event.ageText) ? (
            <>
              <dt className="font-semibold">In Ma</dt>
              <dd className="figures">{event.ageMa}{event.uncertaintyMa !== null ? ` ± ${event.uncertaintyMa}` : ""} Ma</dd>
            </>
          ) : null}
          <dt className="font-semibold">Dating method</dt>
          <dd>{event.datingMethod ?? "Not stated"}</dd>
          <dt className="font-semibold">Source</dt>
          <dd className="font-serif">
            {event.citation}
            {doiLink ? <> <a href={doiLink} rel="noreferrer">doi:{event.doi}</a></> : null}
            {event.url ? <> · <a href={event.url} rel="noreferrer">{event.url}</a></> : null}
          </dd>
          {checked ? (
            <>
              <dt className="font-semibold">Checked</dt>
              <dd>{checked}</dd>
            </>
          ) : null}
          {event.scope === "organisation" ? (
            <>
              <dt className="font-semibold">History</dt>
              <dd>Added {added.by ? `by ${added.by} ` : ""}on {added.on}{changed.on !== added.on || changed.by !== added.by ? `; last changed ${changed.by ? `by ${changed.by} ` : ""}on ${changed.on}` : ""}.</dd>
            </>
          ) : null}
        </dl>

        {panels.length ? (
          <section className="mt-8" aria-labelledby="how-we-know">
            <h2 id="how-we-know" className="text-xl">How we know</h2>
            <p className="mt-1 text-ink-soft">The clock behind a {event.datingMethod} age: how much of the parent isotope is left after {event.ageText.replace(/^(about|at least|from) /, "")}.</p>
            <ul className="mt-3 grid gap-3 sm:grid-cols-2">
              {panels.map((p) => (
                <li key={p.slug} className="card">
                  <p className="font-sans text-sm font-semibold">{p.parent} → {p.daughter}</p>
                  <p className="mt-1 figures text-2xl">{p.percentText}</p>
                  <p className="font-sans text-xs text-ink-soft">of the {p.parent} left · {Number(p.halfLives.toPrecision(3))} half-lives</p>
                  <p className="mt-2 text-sm">{p.sentence}</p>
                </li>
              ))}
            </ul>
            <p className="mt-2 font-sans text-xs text-ink-soft">Half-lives and their sources: <Link to="/studio/library/decay">decay systems</Link>.</p>
          </section>
        ) : null}
      </section>

      <aside>
        {editable && values ? (
          <>
            <h2 className="mb-3 text-xl">Edit this entry</h2>
            <EventForm
              values={actionData?.intent === "save" && actionData.values ? actionData.values : values}
              errors={actionData?.intent === "save" ? actionData.fields : {}}
              formError={actionData?.intent === "save" ? actionData.error : undefined}
              submitLabel="Save changes"
              busy={busy}
              intent="save"
              cancelTo={`/studio/library/${event.id}`}
            />
            <Form method="post" className="card mt-4" onSubmit={(e) => { if (!confirm(`Delete “${event.name}” from ${organisation}'s library?`)) e.preventDefault(); }}>
              <input type="hidden" name="intent" value="delete" />
              <h3 className="text-lg">Delete</h3>
              <p className="mb-3 mt-1 font-sans text-sm text-ink-soft">Removes the entry for everyone in {organisation}. An entry that exhibit markers use cannot be deleted.</p>
              <button type="submit" className="btn-quiet text-danger" disabled={busy}>Delete this entry</button>
            </Form>
          </>
        ) : event.scope === "organisation" ? (
          <div className="card font-sans text-sm text-ink-soft">Editors and admins of {organisation} can change this entry.</div>
        ) : (
          <div className="card">
            <h2 className="text-lg">Shared reference entry</h2>
            <p className="mt-1 font-sans text-sm text-ink-soft">
              Shared entries are read-only reference data, kept with their sources for every organisation.
            </p>
            {canManage ? (
              <>
                <p className="mt-3 font-sans text-sm text-ink-soft">Need a different figure or wording? Start your own entry from this one; the shared entry stays as it is.</p>
                <Link to={`/studio/library/new?from=${event.id}`} className="btn-quiet mt-3 no-underline">Copy into {organisation}'s library</Link>
              </>
            ) : null}
          </div>
        )}
      </aside>
    </div>
  );
}
