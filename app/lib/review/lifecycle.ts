// The exhibit lifecycle: draft → in_review → approved → published, in_review → changes_requested,
// and any edit of an exhibit that is in review, approved or published returns it to draft (the
// approval is void; the live publication stays until the next one). Pure: the server enforces it
// (server/review/lifecycle.server.ts), the pages read the words and the buttons from here.

export const EXHIBIT_STATUSES = ["draft", "in_review", "changes_requested", "approved", "published"] as const;
export type ExhibitStatus = (typeof EXHIBIT_STATUSES)[number];

export const STATUS_WORDS: Record<ExhibitStatus, string> = {
  draft: "Draft",
  in_review: "In review",
  changes_requested: "Changes requested",
  approved: "Approved",
  published: "Published",
};

export const STATUS_EXPLAINED: Record<ExhibitStatus, string> = {
  draft: "Being composed. Submit it for review when the checks pass.",
  in_review: "Waiting for a reviewer to check the figures against the pinned chart edition.",
  changes_requested: "A reviewer asked for changes: see the review comments, change the exhibit, then submit it again.",
  approved: "A reviewer approved this revision. A designer or an admin may publish it.",
  published: "The latest publication is what visitors see. Any change starts a new draft.",
};

export type Transition = "submit-for-review" | "approve" | "request-changes" | "publish";

/** Where each transition may start, and where it leads. */
export const TRANSITIONS: Record<Transition, { from: readonly ExhibitStatus[]; to: ExhibitStatus; words: string }> = {
  "submit-for-review": { from: ["draft", "changes_requested"], to: "in_review", words: "submitted for review" },
  approve: { from: ["in_review"], to: "approved", words: "approved" },
  "request-changes": { from: ["in_review"], to: "changes_requested", words: "sent back with changes requested" },
  publish: { from: ["approved"], to: "published", words: "published" },
};

/** Why a transition cannot start from this status, in words; null when it can. */
export function transitionRefusal(transition: Transition, status: ExhibitStatus): string | null {
  const t = TRANSITIONS[transition];
  if (t.from.includes(status)) return null;
  const allowed = t.from.map((s) => STATUS_WORDS[s].toLowerCase()).join(" or ");
  return `This exhibit is ${STATUS_WORDS[status].toLowerCase()}; it can be ${t.words} only when it is ${allowed}.`;
}

/** The status after an edit (any change to the content): in review, approved and published go back to draft. */
export function statusAfterEdit(status: ExhibitStatus): ExhibitStatus {
  return status === "changes_requested" ? "changes_requested" : "draft";
}

export function isExhibitStatus(value: unknown): value is ExhibitStatus {
  return typeof value === "string" && (EXHIBIT_STATUSES as readonly string[]).includes(value);
}

/** The permission a composer form needs: publishing and submitting have their own; every other intent edits. */
export function composerPermission(intent: string): "exhibit.publish" | "exhibit.submit" | "exhibit.edit" {
  return intent === "publish" ? "exhibit.publish" : intent === "submit-for-review" ? "exhibit.submit" : "exhibit.edit";
}

/** What a kept revision's change was, in words (the history page); unknown actions read as their name. */
export const REVISION_ACTION_WORDS: Record<string, string> = {
  create: "Created the exhibit",
  settings: "Changed the settings",
  "route.replace": "Replaced the route",
  repin: "Pinned another chart edition",
  "markers.add-boundaries": "Added boundary markers",
  "markers.add-event": "Added a library event",
  "markers.add-custom": "Added a custom age",
  "markers.edit": "Edited a marker",
  "markers.remove": "Removed a marker",
  "markers.combine": "Combined markers",
  "insets.add": "Added an inset",
  "insets.remove": "Removed an inset",
  "warnings.acknowledge": "Acknowledged a warning",
  "images.set-marker": "Set a marker's image",
  "images.remove-marker": "Removed a marker's image",
  "images.set-cover": "Set the cover image",
  "images.remove-cover": "Removed the cover image",
};

export function revisionActionWords(action: string): string {
  return REVISION_ACTION_WORDS[action] ?? action.replace(/[.-]/g, " ");
}

/** A date as a person reads it ("1 December 2026"), the same on the server and in the browser. */
export function dayOf(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
}
