// /studio/exhibits/:slug/review — the automatic checks (recomputed on the server), the figures beside
// the pinned edition's, comments, and the reviewer's two decisions (intent=approve,
// intent=request-changes, each with the revision). Every member may read it; reviewers decide;
// designers and reviewers comment; designers resolve comments.
import { data, Form, Link, redirect } from "react-router";
import { FormMessage } from "~/components/forms";
import { PageHeader } from "~/components/page-header";
import { CheckList, CheckSummary, FiguresTable } from "~/components/review/checks";
import { Comments } from "~/components/review/comments";
import { STATUS_WORDS } from "~/lib/review/lifecycle";
import { ReviewCommandSchema } from "~/lib/review/forms";
import { parseForm } from "~/lib/validation";
import { forbidden, requireMember } from "#server/auth.server.ts";
import { can } from "~/lib/permissions";
import { ExhibitError } from "#server/exhibits/load.server.ts";
import { reviewView, runReviewCommand } from "#server/review/view.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/exhibits.$slug.review";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `Review: ${loaderData?.exhibit.title ?? "exhibit"} · Eonscale` }];

const actorOf = (m: Awaited<ReturnType<typeof requireMember>>) => ({ organisationId: m.organisation.id, user: m.user, subject: m.subject });

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  return reviewView(actorOf(member), params.slug);
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requireMember(request);
  if (!can(member.subject, "exhibit.edit") && !can(member.subject, "exhibit.request-changes")) {
    forbidden(`Reviewers decide and comment here, designers comment and resolve comments. Your roles in ${member.organisation.name}: ${member.roles.join(" and ") || "none"}.`);
  }
  const form = await request.formData();
  const intent = String(form.get("intent") ?? "");
  const command = parseForm(ReviewCommandSchema, form);
  if (!command.ok) return data({ intent, error: command.formError, fields: command.fieldErrors }, { status: 400 });
  let message: string;
  try {
    message = await runReviewCommand(actorOf(member), params.slug, command.data);
  } catch (error) {
    if (error instanceof ExhibitError) return data({ intent, error: error.message, fields: { [error.field]: error.message } }, { status: error.status });
    throw error;
  }
  return redirect(`/studio/exhibits/${params.slug}/review`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
}

export default function ReviewPage({ loaderData, actionData }: Route.ComponentProps) {
  const v = loaderData;
  const { exhibit, report } = v;
  const refusal = actionData as { intent: string; error: string; fields: Record<string, string> } | undefined;
  const inReview = exhibit.status === "in_review";
  const decisionError = refusal && (refusal.intent === "approve" || refusal.intent === "request-changes") ? refusal.error : null;
  return (
    <div>
      <PageHeader
        title={`Review: ${exhibit.title}`}
        crumbs={[{ to: "/studio/exhibits", label: "Exhibits" }, { to: `/studio/exhibits/${exhibit.slug}`, label: exhibit.title }]}
        current="Review"
        lead={<>Status: <strong data-testid="review-status">{STATUS_WORDS[exhibit.status]}</strong> · revision {exhibit.revision} · {v.publications.length ? "edited since the last publication by" : "edited by"} {v.editors.join(", ") || "nobody"}</>}
        actions={<Link to={`/studio/exhibits/${exhibit.slug}/revisions`} className="btn-quiet no-underline">History</Link>}
      />
      {refusal && !decisionError && refusal.intent !== "comment" ? <div className="mt-4"><FormMessage>{refusal.error}</FormMessage></div> : null}

      <section aria-labelledby="checks" className="mt-6">
        <h2 id="checks" className="text-xl">Automatic checks</h2>
        <div className="mt-2"><CheckSummary report={report} /></div>
        <div className="card mt-3"><CheckList report={report} markers={v.markers} /></div>
      </section>

      <section aria-labelledby="figures" className="mt-8">
        <h2 id="figures" className="text-xl">Boundary ages beside {report.edition.label}</h2>
        <div className="card mt-3"><FiguresTable report={report} /></div>
      </section>

      <section aria-labelledby="decision" className="mt-8">
        <h2 id="decision" className="text-xl">Decision</h2>
        {decisionError ? <div className="mt-2"><FormMessage>{decisionError}</FormMessage></div> : null}
        {!inReview ? (
          <p className="mt-2 font-sans text-sm text-ink-soft">Decisions are made while the exhibit is in review; it is {STATUS_WORDS[exhibit.status].toLowerCase()}.</p>
        ) : v.can.decide ? (
          <div className="mt-3 grid gap-4 md:grid-cols-2">
            <Form method="post" className="card font-sans text-sm">
              <input type="hidden" name="intent" value="approve" />
              <input type="hidden" name="revision" value={exhibit.revision} />
              <label htmlFor="approve-comment" className="mb-1 block font-semibold">Note with the approval (optional)</label>
              <textarea id="approve-comment" name="comment" rows={2} className="field w-full" />
              {v.approveRefusal ? <p className="mt-2 text-danger">{v.approveRefusal}</p> : null}
              <button type="submit" className="btn mt-2" disabled={Boolean(v.approveRefusal) || report.overall === "fail"}>Approve revision {exhibit.revision}</button>
            </Form>
            <Form method="post" className="card font-sans text-sm">
              <input type="hidden" name="intent" value="request-changes" />
              <input type="hidden" name="revision" value={exhibit.revision} />
              <label htmlFor="changes-comment" className="mb-1 block font-semibold">What needs to change (required)</label>
              <textarea id="changes-comment" name="comment" rows={2} className="field w-full" aria-invalid={refusal?.fields?.comment ? true : undefined} aria-describedby={refusal?.fields?.comment ? "changes-error" : undefined} />
              {refusal?.intent === "request-changes" && refusal.fields?.comment ? <p id="changes-error" className="mt-1 text-danger">{refusal.fields.comment}</p> : null}
              <button type="submit" className="btn mt-2">Request changes</button>
            </Form>
          </div>
        ) : (
          <p className="mt-2 font-sans text-sm text-ink-soft">Reviewers of your organisation approve or request changes here.</p>
        )}
        {v.reviews.length ? (
          <ul className="mt-4 space-y-1 font-sans text-sm">
            {v.reviews.map((r, i) => (
              <li key={i}>Revision {r.revision}: <strong>{r.decision === "approved" ? "approved" : "changes requested"}</strong> by {r.reviewer}, <span className="whitespace-nowrap">{r.at.slice(0, 16).replace("T", " ")} UTC</span>{r.comment ? ` — “${r.comment}”` : ""}</li>
            ))}
          </ul>
        ) : null}
      </section>

      <section aria-labelledby="comments" className="mt-8">
        <h2 id="comments" className="text-xl">Comments</h2>
        <div className="mt-2">
          <Comments comments={v.comments} markers={v.markers} canComment={v.can.comment} canResolve={v.can.resolve} error={refusal?.intent === "comment" ? refusal.error : undefined} />
        </div>
      </section>
    </div>
  );
}
