// What the composer page receives from the server: the saved exhibit, its resolved markers with
// their sanitised texts, the pinned edition's intervals, and the impact of the current edition.
import type { Rank } from "../timescale/types";
import type { ImpactReport } from "./impact";
import type { WarningAcknowledgement } from "./acknowledgements";
import type { ExhibitSpec, ResolvedMarker } from "./types";

export interface ComposerMarker extends ResolvedMarker {
  /** The marker text as sanitised HTML. */
  html: string;
  /** "How we know" sentence when the marker names a decay system. */
  howWeKnow: string | null;
  decaySystemId: number | null;
}

export interface ComposerView {
  exhibit: { title: string; slug: string; status: string; revision: number; updatedAt: string; updatedBy: string | null };
  edition: { slug: string; label: string; status: string };
  spec: ExhibitSpec;
  markers: ComposerMarker[];
  decaySystems: { id: number; label: string }[];
  insetIds: string[];
  intervals: { name: string; rank: Rank; baseMa: number; topMa: number; color: string }[];
  /** Set when another edition is current: what re-pinning to it would move. */
  impact: { edition: { slug: string; label: string }; report: ImpactReport } | null;
  /** Stored acknowledgements of legibility warnings (acknowledgementOf / withAcknowledgements match them to the warnings by key). */
  acknowledgements: WarningAcknowledgement[];
  canEdit: boolean;
  /** The export menu (the route adds it): latest publication, organisation slug, files offered. */
  exportMenu?: { publication: number | null; organisation: string; files: { name: string; title: string; purpose: string }[] };
}

/** The action's answer when a form is refused: which form, the message, and field → message. */
export interface ComposerRefusal {
  intent: string;
  error: string;
  fields: Record<string, string>;
}
