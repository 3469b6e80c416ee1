// Who owns a chart edition and what it is for the reader, shown beside its name everywhere: a shared
// (ICS) edition and whether it is the latest; an organisation's own edition, always labelled as the
// organisation's own and never as an ICS edition; and which one the reader's organisation uses.
import type { EditionStatus } from "~/lib/timescale";

export interface EditionBadgeData {
  status: EditionStatus;
  organisationId: number | null;
  ownerName: string | null;
  latest: boolean;
  currentForOrganisation: boolean;
}

const BADGE = "inline-block rounded border px-2 py-0.5 font-sans text-xs font-semibold uppercase tracking-wide";

/** The status in words that fit the owner: a shared edition is the "latest", an own edition "in use". */
export function statusWords(e: Pick<EditionBadgeData, "status" | "organisationId">): string {
  if (e.status === "draft") return "Draft";
  if (e.status === "retired") return "Retired";
  return e.organisationId === null ? "Latest shared edition" : "In use";
}

export function EditionBadges({ edition: e, organisationName }: { edition: EditionBadgeData; organisationName?: string | null }) {
  return (
    <span className="inline-flex flex-wrap gap-1 align-middle">
      {e.organisationId === null ? (
        <span className={`${BADGE} border-slate-river-500 bg-slate-river-100 text-slate-river-700`}>Shared</span>
      ) : (
        <span className={`${BADGE} border-warn bg-amber-50 text-warn`} title="Made by this organisation; not an edition of the International Chronostratigraphic Chart">
          {e.ownerName ? `${e.ownerName}'s own` : "Own edition"}
        </span>
      )}
      <span className={`${BADGE} ${e.status === "draft" ? "border-warn bg-amber-50 text-warn" : e.status === "current" ? "border-ok bg-green-50 text-ok" : "border-rule bg-paper-deep text-ink-soft"}`}>
        {statusWords(e)}
      </span>
      {e.currentForOrganisation ? <span className={`${BADGE} border-ok bg-green-100 text-ok`}>Current for {organisationName ?? "your organisation"}</span> : null}
    </span>
  );
}

/** One sentence that says whose edition it is, for the edition page. */
export function OwnerNote({ edition: e }: { edition: EditionBadgeData }) {
  if (e.organisationId === null) return null;
  return (
    <p role="note" className="mt-4 rounded border-l-4 border-warn bg-amber-50 p-3 font-sans text-sm">
      This is {e.ownerName ?? "an organisation"}'s own chart edition. It is not an edition of the International Chronostratigraphic
      Chart, and only members of {e.ownerName ?? "that organisation"} can see it.
    </p>
  );
}
