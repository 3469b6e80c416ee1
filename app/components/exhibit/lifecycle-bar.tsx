// The exhibit's place in the review lifecycle, on the composer page: its status in words, what
// happens next, and the one button that moves it on (submit for review, or publish an approved
// revision). Each button posts its intent with the revision the page shows (a stale page gets 409).
import { Form, Link } from "react-router";
import { dayOf, STATUS_EXPLAINED, STATUS_WORDS, type ExhibitStatus } from "~/lib/review/lifecycle";

export interface LifecycleView {
  slug: string;
  organisation: string;
  status: ExhibitStatus;
  revision: number;
  approvedRevision: number | null;
  canSubmit: boolean;
  canPublish: boolean;
  latestPublication: { number: number; revision: number; at: string } | null;
}

const TONE: Record<ExhibitStatus, string> = {
  draft: "border-rule",
  in_review: "border-slate-river-500",
  changes_requested: "border-warn",
  approved: "border-ok",
  published: "border-ok",
};

export function LifecycleBar({ view }: { view: LifecycleView }) {
  const { slug, status, revision } = view;
  const submit = view.canSubmit && (status === "draft" || status === "changes_requested");
  const publish = view.canPublish && status === "approved" && view.approvedRevision === revision;
  return (
    <section aria-labelledby="lifecycle-heading" className={`card mt-4 border-l-4 ${TONE[status]} font-sans text-sm`}>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h2 id="lifecycle-heading" className="text-base font-semibold">
            Status: <span data-testid="exhibit-status">{STATUS_WORDS[status]}</span>
          </h2>
          <p className="mt-1 text-ink-soft">{STATUS_EXPLAINED[status]}</p>
          {view.latestPublication ? (
            <p className="mt-1 text-ink-soft">
              Visitors see publication {view.latestPublication.number} (revision {view.latestPublication.revision}, published <span className="whitespace-nowrap">{dayOf(view.latestPublication.at)}</span>).{" "}
              <a href={`/api/exhibits/${view.organisation}/${slug}`}>Its data (public JSON)</a>.
            </p>
          ) : null}
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <Link to={`/studio/exhibits/${slug}/review`} className="btn-quiet no-underline">Review page</Link>
          <Link to={`/studio/exhibits/${slug}/revisions`} className="btn-quiet no-underline">History</Link>
          {submit ? (
            <Form method="post">
              <input type="hidden" name="intent" value="submit-for-review" />
              <input type="hidden" name="revision" value={revision} />
              <button type="submit" className="btn">Submit for review</button>
            </Form>
          ) : null}
          {publish ? (
            <Form method="post">
              <input type="hidden" name="intent" value="publish" />
              <input type="hidden" name="revision" value={revision} />
              <button type="submit" className="btn">Publish revision {revision}</button>
            </Form>
          ) : null}
        </div>
      </div>
    </section>
  );
}
