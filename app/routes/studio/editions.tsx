// /studio/editions — chart editions by owner. An organisation's editors and admins choose which
// edition is current for the organisation (a shared one, or one of its own) and import, retire or
// discard its own editions; chart stewards make a shared edition the latest and retire or discard
// shared drafts. The log below lists every edition change the reader is concerned by.
import { data, Form, Link, redirect, useNavigation } from "react-router";
import { safeRedirectPath } from "~/lib/redirects";
import { z } from "zod";
import { EditionBadges } from "~/components/chart/edition-owner";
import { FormMessage } from "~/components/forms";
import { can } from "~/lib/permissions";
import { parseForm } from "~/lib/validation";
import { requireAnyPermission } from "#server/auth.server.ts";
import { discardDraft, editionLog, EditionError, listEditions, makeLatest, retireEdition, scopeOf, setOrganisationCurrent, toViewer } from "#server/editions.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/editions";

export const meta: Route.MetaFunction = () => [{ title: "Manage chart editions · Eonscale" }];

const MANAGE = ["edition.import", "edition.set-current", "edition.manage-shared"] as const;

export async function loader({ request }: Route.LoaderArgs) {
  const s = await requireAnyPermission(request, MANAGE);
  const scope = scopeOf(toViewer(s));
  const [editions, log] = await Promise.all([listEditions(scope), editionLog(scope)]);
  return {
    editions,
    log,
    organisation: s.organisation ? { id: s.organisation.id, name: s.organisation.name } : null,
    may: {
      importOwn: can(s.subject, "edition.import"),
      setCurrent: can(s.subject, "edition.set-current"),
      shared: can(s.subject, "edition.manage-shared"),
    },
  };
}

const Slug = z.string({ error: "Choose an edition." }).min(1, { error: "Choose an edition." }).max(60, { error: "Choose an edition." });
const ActionSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("set-current"), slug: Slug, redirectTo: z.string().optional() }),
    z.object({ intent: z.literal("make-latest"), slug: Slug, redirectTo: z.string().optional() }),
    z.object({ intent: z.literal("retire"), slug: Slug, redirectTo: z.string().optional() }),
    z.object({ intent: z.literal("discard"), slug: Slug, redirectTo: z.string().optional() }),
  ],
  { error: "Unknown action: choose make current, make latest, retire or discard." },
);

export async function action({ request }: Route.ActionArgs) {
  const s = await requireAnyPermission(request, MANAGE);
  const parsed = parseForm(ActionSchema, await request.formData());
  if (!parsed.ok) return data({ error: parsed.formError }, { status: 400 });
  const { intent, slug } = parsed.data;
  const actor = { id: s.user.id, subject: s.subject };
  let message: string;
  let to = safeRedirectPath(parsed.data.redirectTo, "/studio/editions");
  try {
    if (intent === "set-current") {
      if (!s.organisation) return data({ error: "Only an organisation has a current edition; you are not a member of one." }, { status: 403 });
      const { edition, previous } = await setOrganisationCurrent(slug, actor, s.organisation.id);
      message = `${edition.label} is now the current edition of ${s.organisation.name}.${previous ? ` It replaces ${previous.label}; exhibits pinned to that one now need a re-check.` : ""}`;
    } else if (intent === "make-latest") {
      const { edition, previous } = await makeLatest(slug, actor);
      message = `${edition.label} is now the latest shared edition.${previous ? ` ${previous.label} has been retired; organisations that had not chosen an edition stay on it until they choose.` : ""}`;
    } else if (intent === "retire") {
      const edition = await retireEdition(slug, actor);
      message = `${edition.label} has been retired.`;
    } else {
      const edition = await discardDraft(slug, actor);
      message = `The draft ${edition.label} has been discarded.`;
      if (to.startsWith(`/editions/${slug}`)) to = "/studio/editions";
    }
  } catch (error) {
    if (error instanceof EditionError) return data({ error: error.message }, { status: error.status });
    throw error;
  }
  return redirect(to, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
}

const day = (iso: string | null) => (iso ? iso.slice(0, 10) : "—");

const LOG_WORDS: Record<string, string> = {
  "edition.import": "imported",
  "edition.make-latest": "made the latest shared edition",
  "edition.make-current": "made current",
  "edition.set-current": "made current for the organisation",
  "edition.retire": "retired",
  "edition.discard": "discarded",
};

export default function ManageEditions({ loaderData, actionData }: Route.ComponentProps) {
  const { editions, log, organisation, may } = loaderData;
  const busy = useNavigation().state === "submitting";
  const current = editions.find((e) => e.currentForOrganisation) ?? editions.find((e) => e.latest);
  const mayChange = (e: (typeof editions)[number]) => (e.organisationId === null ? may.shared : may.importOwn);
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-3xl">
          <h1 className="text-3xl">Chart editions</h1>
          <p className="mt-2 text-ink-soft">
            {organisation ? (
              <>
                {current ? <><strong className="text-ink">{current.label}</strong> is the current edition of {organisation.name}: new exhibits are pinned to it, and exhibits pinned to another edition need a re-check. </> : null}
                Shared editions are the published ICS charts, looked after by the site's chart stewards. {may.importOwn ? `${organisation.name} may also import editions of its own, seen only by its members.` : ""}
              </>
            ) : (
              "You manage the shared chart editions as a chart steward. Each organisation chooses for itself when to adopt the latest one."
            )}
          </p>
        </div>
        <div className="flex gap-2">
          <Link to="/studio/editions/import" className="btn no-underline">Import an edition</Link>
          <Link to="/editions" className="btn-quiet no-underline">Public pages</Link>
        </div>
      </div>
      {actionData?.error ? <div className="mt-4"><FormMessage>{actionData.error}</FormMessage></div> : null}
      <div className="card mt-6 overflow-x-auto p-0">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Chart editions</caption>
          <thead className="border-b border-rule bg-paper">
            <tr>
              <th scope="col" className="p-3">Edition</th>
              <th scope="col" className="p-3">Owner and status</th>
              <th scope="col" className="p-3 text-right">Intervals</th>
              <th scope="col" className="p-3">Imported</th>
              <th scope="col" className="p-3"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {editions.map((e) => (
              <tr key={e.slug} className="border-b border-rule align-top last:border-0">
                <td className="p-3">
                  <Link to={`/editions/${e.slug}`} className="font-semibold">{e.label}</Link>
                  <br />
                  <code className="text-xs text-ink-soft">{e.slug}</code>
                </td>
                <td className="p-3">
                  <EditionBadges edition={e} organisationName={organisation?.name} />
                  {e.retiredAt ? <span className="mt-1 block text-xs text-ink-soft">retired {day(e.retiredAt)}</span> : null}
                </td>
                <td className="num p-3 text-right">{e.total}</td>
                <td className="p-3">{day(e.createdAt)}<span className="block text-xs text-ink-soft">{e.createdBy ?? "reference data"}</span></td>
                <td className="p-3">
                  <div className="flex flex-wrap justify-end gap-2">
                    {current && current.slug !== e.slug ? (
                      <Link className="btn-quiet no-underline" to={`/editions/compare?from=${current.slug}&to=${e.slug}`}>Compare</Link>
                    ) : null}
                    {organisation && may.setCurrent && !e.currentForOrganisation && (e.organisationId !== null || e.status !== "draft") ? (
                      <Form method="post" onSubmit={(ev) => { if (!confirm(`Make ${e.label} the current edition of ${organisation.name}? Exhibits pinned to another edition will need a re-check.`)) ev.preventDefault(); }}>
                        <input type="hidden" name="intent" value="set-current" />
                        <input type="hidden" name="slug" value={e.slug} />
                        <button type="submit" className="btn" disabled={busy}>Make current for {organisation.name}</button>
                      </Form>
                    ) : null}
                    {may.shared && e.organisationId === null && e.status !== "current" ? (
                      <Form method="post" onSubmit={(ev) => { if (!confirm(`Make ${e.label} the latest shared edition? The present latest one will be retired.`)) ev.preventDefault(); }}>
                        <input type="hidden" name="intent" value="make-latest" />
                        <input type="hidden" name="slug" value={e.slug} />
                        <button type="submit" className="btn" disabled={busy}>Make latest shared edition</button>
                      </Form>
                    ) : null}
                    {e.status === "draft" && mayChange(e) ? (
                      <>
                        <Form method="post">
                          <input type="hidden" name="intent" value="retire" />
                          <input type="hidden" name="slug" value={e.slug} />
                          <button type="submit" className="btn-quiet" disabled={busy}>Retire</button>
                        </Form>
                        <Form method="post" onSubmit={(ev) => { if (!confirm(`Discard the draft ${e.label} and its intervals?`)) ev.preventDefault(); }}>
                          <input type="hidden" name="intent" value="discard" />
                          <input type="hidden" name="slug" value={e.slug} />
                          <button type="submit" className="btn-quiet text-danger" disabled={busy}>Discard</button>
                        </Form>
                      </>
                    ) : null}
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <section className="mt-8" aria-labelledby="log-heading">
        <h2 id="log-heading" className="text-2xl">Edition changes</h2>
        <p className="mt-1 text-ink-soft">
          {organisation ? `Changes to ${organisation.name}'s editions and its current edition, and every change to the shared editions.` : "Every change to the shared editions."}
        </p>
        {log.length === 0 ? <p className="card mt-3">No changes yet.</p> : (
          <ul className="card mt-3 grid gap-1 font-sans text-sm">
            {log.map((l, i) => (
              <li key={i}>
                <span className="text-ink-soft">{l.at.slice(0, 16).replace("T", " ")}</span> · {l.actor ?? "someone"} {LOG_WORDS[l.action] ?? l.action} <code>{l.slug ?? "?"}</code>
                {l.shared ? <span className="text-ink-soft"> (shared)</span> : null}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
