// What the review, revisions and compare pages show, and the review page's commands.
import { data } from "react-router";
import { decide, can } from "../../app/lib/permissions.ts";
import { diffRevisions, type RevisionDiff } from "../../app/lib/review/diff.ts";
import { CompareQuerySchema, type ReviewCommand } from "../../app/lib/review/forms.ts";
import { parseForm } from "../../app/lib/validation.ts";
import type { ExhibitStatus } from "../../app/lib/review/lifecycle.ts";
import type { CheckReport, ReviewComment as CommentView } from "../../app/lib/review/types.ts";
import { formatAgeMa } from "../../app/lib/exhibit/display.ts";
import { Exhibit, ExhibitComment, ExhibitReview, Organisation, Publication, User } from "../../db/models/index.ts";
import { EXHIBIT_NOT_FOUND, ExhibitError } from "../exhibits/load.server.ts";
import { checkExhibit } from "./checks.server.ts";
import { addComment, resolveComment } from "./comments.server.ts";
import { approve, requestChanges, type ReviewActor } from "./lifecycle.server.ts";
import { editorsSincePublication, revisionContentAt, revisionsOf } from "./revisions.server.ts";


export interface ReviewView {
  exhibit: { title: string; slug: string; status: ExhibitStatus; revision: number; approvedRevision: number | null; updatedAt: string; organisation: string };
  report: CheckReport;
  markers: { id: string; number: number; label: string; ageText: string }[];
  comments: CommentView[];
  reviews: { revision: number; decision: "approved" | "changes_requested"; reviewer: string; comment: string; at: string }[];
  editors: string[];
  publications: { number: number; revision: number; at: string; hash: string }[];
  can: { decide: boolean; comment: boolean; resolve: boolean };
  /** Why this person may not approve (role or four-eyes), or null. */
  approveRefusal: string | null;
}

const nameOf = (u: User | null | undefined) => u?.name ?? "a former member";

function thread(rows: ExhibitComment[]): CommentView[] {
  const views = new Map<number, CommentView>();
  for (const r of rows) {
    views.set(r.id, {
      id: r.id,
      markerId: r.markerId,
      markerLabel: r.markerLabel,
      author: nameOf(r.author),
      body: r.body,
      revision: r.revision,
      at: r.createdAt.toISOString(),
      resolved: r.resolvedAt ? { by: nameOf(r.resolvedBy), at: r.resolvedAt.toISOString() } : null,
      replies: [],
    });
  }
  const roots: CommentView[] = [];
  for (const r of rows) {
    const v = views.get(r.id)!;
    const parent = r.parentId === null ? undefined : views.get(r.parentId);
    if (parent) parent.replies.push(v);
    else roots.push(v);
  }
  return roots;
}

export async function reviewView(actor: ReviewActor, slug: string): Promise<ReviewView> {
  const { exhibitId, bundle, report } = await checkExhibit(actor.organisationId, slug);
  const exhibit = (await Exhibit.findByPk(exhibitId))!;
  const [comments, reviews, publications, editorIds, org] = await Promise.all([
    ExhibitComment.findAll({ where: { exhibitId }, include: [{ model: User, as: "author" }, { model: User, as: "resolvedBy" }], order: [["createdAt", "ASC"], ["id", "ASC"]] }),
    ExhibitReview.findAll({ where: { exhibitId }, include: [{ model: User, as: "reviewer" }], order: [["createdAt", "DESC"]] }),
    Publication.findAll({ where: { exhibitId }, attributes: ["number", "revision", "publishedAt", "sha256"], order: [["number", "DESC"]] }),
    editorsSincePublication(exhibit),
    Organisation.findByPk(actor.organisationId),
  ]);
  const editors = editorIds.length ? await User.findAll({ where: { id: editorIds }, attributes: ["id", "name"] }) : [];
  const approval = decide(actor.subject, "exhibit.approve", { editorIds });
  return {
    exhibit: { title: exhibit.title, slug: exhibit.slug, status: exhibit.status, revision: exhibit.revision, approvedRevision: exhibit.approvedRevision, updatedAt: exhibit.updatedAt.toISOString(), organisation: org?.slug ?? "" },
    report,
    markers: (bundle?.markers ?? []).map((m) => ({ id: m.id, number: m.number, label: m.label, ageText: formatAgeMa(m.ageMa) })),
    comments: thread(comments),
    reviews: reviews.map((r) => ({ revision: r.revision, decision: r.decision, reviewer: nameOf(r.reviewer), comment: r.comment, at: r.createdAt.toISOString() })),
    editors: editors.map((u) => u.name),
    publications: publications.map((p) => ({ number: p.number, revision: p.revision, at: p.publishedAt.toISOString(), hash: p.sha256 })),
    can: {
      decide: approval.ok || can(actor.subject, "exhibit.request-changes"),
      comment: can(actor.subject, "exhibit.edit") || can(actor.subject, "exhibit.request-changes"),
      resolve: can(actor.subject, "exhibit.edit"),
    },
    approveRefusal: approval.ok ? null : approval.reason,
  };
}

/** Runs a review-page command; returns the notice shown after the redirect. */
export async function runReviewCommand(actor: ReviewActor, slug: string, command: ReviewCommand): Promise<string> {
  const need = (action: "exhibit.request-changes" | "exhibit.edit", what: string) => {
    if (command.intent === "comment" ? !(can(actor.subject, "exhibit.edit") || can(actor.subject, "exhibit.request-changes")) : !can(actor.subject, action)) {
      throw new ExhibitError(`Only ${what}.`, "_form", 403);
    }
  };
  switch (command.intent) {
    case "approve": {
      const { mailed } = await approve(actor, slug, command.revision, command.comment);
      return `Approved revision ${command.revision}.${mailed.length ? ` ${mailed.length} editor${mailed.length === 1 ? " was" : "s were"} told by e-mail.` : ""}`;
    }
    case "request-changes": {
      need("exhibit.request-changes", "reviewers request changes");
      await requestChanges(actor, slug, command.revision, command.comment);
      return "Changes requested; the designers were told by e-mail.";
    }
    case "comment":
      need("exhibit.edit", "designers and reviewers comment");
      await addComment(actor, slug, { body: command.body, markerId: command.markerId, parentId: command.parentId });
      return "Comment added.";
    case "resolve-comment":
      need("exhibit.edit", "designers resolve comments");
      await resolveComment(actor, slug, command.commentId);
      return "Comment resolved.";
  }
}

/** The composer's status bar: status, the approved revision, which button this member may press, the live publication. */
export async function lifecycleView(actor: ReviewActor, slug: string) {
  const exhibit = await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug } });
  if (!exhibit) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  const [latest, org] = await Promise.all([
    Publication.findOne({ where: { exhibitId: exhibit.id }, order: [["number", "DESC"]], attributes: ["number", "revision", "publishedAt"] }),
    Organisation.findByPk(actor.organisationId, { attributes: ["slug"] }),
  ]);
  return {
    slug: exhibit.slug,
    organisation: org?.slug ?? "",
    status: exhibit.status,
    revision: exhibit.revision,
    approvedRevision: exhibit.approvedRevision,
    canSubmit: can(actor.subject, "exhibit.submit"),
    canPublish: can(actor.subject, "exhibit.publish"),
    latestPublication: latest ? { number: latest.number, revision: latest.revision, at: latest.publishedAt.toISOString() } : null,
  };
}

export interface RevisionsView {
  exhibit: { title: string; slug: string; status: ExhibitStatus; revision: number };
  revisions: { revision: number; author: string; action: string; at: string; markers: number; published: number | null; reviewed: string | null }[];
}

export async function revisionsView(organisationId: number, slug: string): Promise<RevisionsView> {
  const exhibit = await Exhibit.findOne({ where: { organisationId, slug } });
  if (!exhibit) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  const [rows, publications, reviews] = await Promise.all([
    revisionsOf(exhibit.id),
    Publication.findAll({ where: { exhibitId: exhibit.id }, attributes: ["number", "revision"] }),
    ExhibitReview.findAll({ where: { exhibitId: exhibit.id }, include: [{ model: User, as: "reviewer" }], order: [["createdAt", "ASC"]] }),
  ]);
  const published = new Map(publications.map((p) => [p.revision, p.number]));
  const reviewed = new Map(reviews.map((r) => [r.revision, `${r.decision === "approved" ? "approved" : "changes requested"} by ${nameOf(r.reviewer)}`]));
  return {
    exhibit: { title: exhibit.title, slug: exhibit.slug, status: exhibit.status, revision: exhibit.revision },
    revisions: rows.map((r) => ({ revision: r.revision, author: nameOf(r.author), action: r.action, at: r.createdAt.toISOString(), markers: r.content.markers.length, published: published.get(r.revision) ?? null, reviewed: reviewed.get(r.revision) ?? null })),
  };
}

export interface CompareView {
  exhibit: { title: string; slug: string };
  from: { revision: number; label: string };
  to: { revision: number; label: string };
  diff: RevisionDiff;
}

/** `?from=N&to=M|published`, read after the exhibit is found (an unknown exhibit is 404 whatever the query). */
export async function compareView(organisationId: number, slug: string, query: URLSearchParams): Promise<CompareView> {
  const exhibit = await Exhibit.findOne({ where: { organisationId, slug } });
  if (!exhibit) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  const parsed = parseForm(CompareQuerySchema, { from: query.get("from") ?? undefined, to: query.get("to") ?? undefined });
  if (!parsed.ok) throw new ExhibitError(`Choose two revisions to compare: ${Object.values(parsed.fieldErrors)[0]}`, Object.keys(parsed.fieldErrors)[0]);
  const { from, to } = parsed.data;
  let toRevision: number;
  let toLabel: string;
  if (to === "published") {
    const latest = await Publication.findOne({ where: { exhibitId: exhibit.id }, order: [["number", "DESC"]], attributes: ["number", "revision"] });
    if (!latest) throw new ExhibitError("This exhibit has not been published yet: compare two revisions instead.", "to", 404);
    toRevision = latest.revision;
    toLabel = `publication ${latest.number} (revision ${latest.revision})`;
  } else {
    toRevision = to;
    toLabel = `revision ${to}`;
  }
  const [a, b] = await Promise.all([revisionContentAt(exhibit.id, from), revisionContentAt(exhibit.id, toRevision)]);
  if (!a) throw new ExhibitError(`Revision ${from} of this exhibit is not kept.`, "from", 404);
  if (!b) throw new ExhibitError(`Revision ${toRevision} of this exhibit is not kept.`, "to", 404);
  return { exhibit: { title: exhibit.title, slug: exhibit.slug }, from: { revision: from, label: `revision ${from}` }, to: { revision: toRevision, label: toLabel }, diff: diffRevisions(a, b) };
}
