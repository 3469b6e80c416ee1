// /studio/editions — editors and admins manage the chart editions: make one current (the previous
// current edition is retired in the same transaction), retire or discard a draft, import a new one.
import { data, Form, Link, redirect, useNavigation } from "react-router";
import { safeRedirect } from "remix-utils/safe-redirect";
import { z } from "zod";
import { StatusBadge } from "~/components/chart/edition-bits";
import { FormMessage } from "~/components/forms";
import { parseForm } from "~/lib/validation";
import { requireMember } from "#server/auth.server.ts";
import { EDITION_MANAGERS, EditionError, discardDraft, listEditions, makeCurrent, retireEdition } from "#server/editions.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/editions";

export const meta: Route.MetaFunction = () => [{ title: "Manage chart editions · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  await requireMember(request, EDITION_MANAGERS);
  return { editions: await listEditions({ includeDrafts: true }) };
}

const Slug = z.string({ error: "Choose an edition." }).min(1, { error: "Choose an edition." });
const ActionSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("make-current"), slug: Slug, redirectTo: z.string().optional() }),
    z.object({ intent: z.literal("retire"), slug: Slug, redirectTo: z.string().optional() }),
    z.object({ intent: z.literal("discard"), slug: Slug, redirectTo: z.string().optional() }),
  ],
  { error: "Unknown action: choose make current, retire or discard." },
);

export async function action({ request }: Route.ActionArgs) {
  const member = await requireMember(request, EDITION_MANAGERS);
  const form = await request.formData();
  const parsed = parseForm(ActionSchema, form);
  if (!parsed.ok) return data({ error: parsed.formError }, { status: 400 });
  const { intent, slug } = parsed.data;
  const actor = { id: member.user.id };
  const orgId = member.organisation.id;
  let message: string;
  let to = safeRedirect(parsed.data.redirectTo, "/studio/editions");
  try {
    if (intent === "make-current") {
      const { edition, previous } = await makeCurrent(slug, actor, orgId);
      message = `${edition.label} is now the current edition.${previous ? ` ${previous.label} has been retired.` : ""}`;
    } else if (intent === "retire") {
      const edition = await retireEdition(slug, actor, orgId);
      message = `${edition.label} has been retired.`;
    } else {
      const edition = await discardDraft(slug, actor, orgId);
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

export default function ManageEditions({ loaderData, actionData }: Route.ComponentProps) {
  const { editions } = loaderData;
  const busy = useNavigation().state === "submitting";
  const current = editions.find((e) => e.status === "current");
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-3xl">
          <h1 className="text-3xl">Chart editions</h1>
          <p className="mt-2 text-ink-soft">
            Import a new edition as a draft, compare it with the current one, then make it current. Only one edition is current at a time; the one it replaces is retired, and exhibits pinned to it are flagged for a re-check.
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
              <th scope="col" className="p-3">Status</th>
              <th scope="col" className="p-3 text-right">Intervals</th>
              <th scope="col" className="p-3">Imported</th>
              <th scope="col" className="p-3">Made current</th>
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
                <td className="p-3"><StatusBadge status={e.status} />{e.retiredAt ? <span className="mt-1 block text-xs text-ink-soft">retired {day(e.retiredAt)}</span> : null}</td>
                <td className="num p-3 text-right">{e.total}</td>
                <td className="p-3">{day(e.createdAt)}<span className="block text-xs text-ink-soft">{e.createdBy ?? "reference data"}</span></td>
                <td className="p-3">{e.madeCurrentAt ? <>{day(e.madeCurrentAt)}<span className="block text-xs text-ink-soft">{e.madeCurrentBy ?? "reference data"}</span></> : "—"}</td>
                <td className="p-3">
                  <div className="flex flex-wrap justify-end gap-2">
                    {current && current.slug !== e.slug ? (
                      <Link className="btn-quiet no-underline" to={`/editions/compare?from=${e.status === "draft" ? current.slug : e.slug}&to=${e.status === "draft" ? e.slug : current.slug}`}>Compare</Link>
                    ) : null}
                    {e.status !== "current" ? (
                      <Form method="post" onSubmit={(ev) => { if (!confirm(`Make ${e.label} the current edition?${current ? ` ${current.label} will be retired.` : ""}`)) ev.preventDefault(); }}>
                        <input type="hidden" name="intent" value="make-current" />
                        <input type="hidden" name="slug" value={e.slug} />
                        <button type="submit" className="btn" disabled={busy}>Make current</button>
                      </Form>
                    ) : null}
                    {e.status === "draft" ? (
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
    </div>
  );
}
