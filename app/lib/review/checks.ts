// The automatic review checks, as a pure function over the stored exhibit, its pinned edition and
// the stored acknowledgements. The server recomputes them from the database on every review page,
// submission and approval (never trusting a client); each result is in words, per marker where it
// concerns one: pass, warning or fail. A failing check refuses submission and approval; a warning
// is shown to the reviewer (legibility warnings may be acknowledged with a written reason).
import { computeExhibit, standardDurations } from "../exhibit/compose";
import type { ExhibitSpec, ResolvedMarker } from "../exhibit/types";
import { formatAgeMa } from "../exhibit/display";
import { checkIntervalNames } from "../interval-consistency";
import type { ScaleWarning } from "../scale/compute";
import type { Interval } from "../timescale/types";
import { toYears } from "../units";
import type { CheckReport, CheckResult, CheckStatus, FigureRow } from "./types";

/** The interval a boundary marker points to, as stored (it may belong to another edition by mistake). */
export interface BoundaryFact {
  markerId: string;
  intervalName: string;
  editionId: number;
  baseMa: number;
}

export interface Acknowledgement {
  warningKey: string;
  reason: string;
  by: string | null;
  at: string;
}

export interface CheckInput {
  revision: number;
  spec: ExhibitSpec;
  markers: ResolvedMarker[];
  edition: { id: number; slug: string; label: string; intervals: readonly Interval[] };
  boundaries: readonly BoundaryFact[];
  /** Library events of event markers: their dating method is read for interval names too. */
  events?: ReadonlyMap<string, { name: string; summary?: string | null; datingMethod?: string | null }>;
  acknowledgements: readonly Acknowledgement[];
  /** Marker id → its image's alt text; absent when no marker has an image (or images do not exist yet). */
  images?: ReadonlyMap<string, { alt: string | null }>;
  /** The organisation's current edition, and what re-pinning to it would change; null when the pinned one is current. */
  recheck: { edition: { slug: string; label: string }; moved: number; missing: number } | null;
}

/** Placeholders that are not a source a reviewer can follow. */
const PLACEHOLDER_SOURCE = /^(?:tbd|tba|todo|to do|n\/?a|none|unknown|source|sources|citation(?: needed)?|ref|reference|see above|\?+|x+|-+|\.+)$/i;
/** A source shorter than this cannot name an author, a year and a place. */
export const MIN_SOURCE_LENGTH = 8;

/** Why a source is not enough, or null when it is. */
export function sourceProblem(source: string | null | undefined): string | null {
  const s = (source ?? "").trim();
  if (!s) return "has no source";
  if (PLACEHOLDER_SOURCE.test(s)) return `gives “${s}” as its source, which is a placeholder, not a source`;
  if (s.length < MIN_SOURCE_LENGTH) return `gives “${s}” as its source, too short to name who published the age and where`;
  return null;
}

/** The key an acknowledgement names: the engine's key when it gives one (code + the markers' ids), else the same built here. */
export function warningKeyOf(w: ScaleWarning): string {
  const own = (w as ScaleWarning & { key?: string }).key;
  return own ?? `${w.code}:${[...w.pointIds, ...(w.durationIds ?? [])].join(",")}`;
}

/** Does an inset's label state its magnification ("1,000×", "1000 x", "100 times")? */
export function statesMagnification(label: string, magnification: number): boolean {
  const digits = label.replace(/[,\s\u202f\u00a0](?=\d{3}\b)/g, "");
  const figure = String(Number(magnification.toPrecision(6)));
  return new RegExp(`(?:^|[^\\d.])${figure.replace(".", "\\.")}\\s*(?:×|x|times)`, "i").test(digits);
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function runChecks(input: CheckInput): CheckReport {
  const results: CheckResult[] = [];
  const figures: FigureRow[] = [];
  const { markers, edition } = input;
  const byId = new Map(markers.map((m) => [m.id, m]));
  const name = (m: ResolvedMarker) => `Marker ${m.number} (“${m.label}”)`;
  const add = (r: Omit<CheckResult, "markerId" | "markerNumber">, m?: ResolvedMarker) =>
    results.push({ ...r, markerId: m?.id ?? null, markerNumber: m?.number ?? null });

  // 1. Boundary ages equal the pinned edition's.
  const pinned = new Map(edition.intervals.map((iv) => [iv.name, iv]));
  const facts = new Map(input.boundaries.map((b) => [b.markerId, b]));
  for (const m of markers.filter((x) => x.kind === "boundary")) {
    const fact = facts.get(m.id);
    const iv = pinned.get(fact?.intervalName ?? m.intervalName ?? "");
    const sameEdition = fact ? fact.editionId === edition.id : true;
    const matches = Boolean(iv) && sameEdition && Math.abs(m.ageMa - iv!.baseMa) < 1e-9;
    figures.push({
      markerId: m.id,
      number: m.number,
      label: m.label,
      intervalName: fact?.intervalName ?? m.intervalName ?? "",
      exhibitAgeMa: m.ageMa,
      exhibitUncertaintyMa: m.uncertaintyMa,
      editionAgeMa: iv?.baseMa ?? null,
      editionUncertaintyMa: iv?.baseUncertaintyMa ?? null,
      matches,
    });
    if (matches) {
      add({ kind: "boundary-age", status: "pass", message: `${name(m)}: ${formatAgeMa(m.ageMa)} is the base of the ${iv!.name} on ${edition.label}.` }, m);
    } else if (!iv) {
      add({ kind: "boundary-age", status: "fail", message: `${name(m)}: the ${fact?.intervalName ?? m.intervalName} is not an interval of ${edition.label}, the pinned edition.` }, m);
    } else if (!sameEdition) {
      add({ kind: "boundary-age", status: "fail", message: `${name(m)} uses the ${iv.name} of another chart edition; on ${edition.label} its base is ${formatAgeMa(iv.baseMa)}. Re-add the marker from the pinned edition.` }, m);
    } else {
      add({ kind: "boundary-age", status: "fail", message: `${name(m)} is at ${formatAgeMa(m.ageMa)}, but on ${edition.label} the base of the ${iv.name} is ${formatAgeMa(iv.baseMa)}.` }, m);
    }
  }

  // 2. Every event and custom age has a source.
  for (const m of markers.filter((x) => x.kind !== "boundary")) {
    const problem = sourceProblem(m.source);
    const what = m.kind === "event" ? "library event" : "custom age";
    if (problem) add({ kind: "source", status: "fail", message: `${name(m)}: this ${what} ${problem}. Give the publication the age comes from.` }, m);
    else add({ kind: "source", status: "pass", message: `${name(m)}: the ${what} names its source (${m.source.length > 90 ? `${m.source.slice(0, 87)}…` : m.source}).` }, m);
  }

  // 3. Inside the span and on the medium (from the recomputed positions).
  const olderMa = toYears(input.spec.spanOlder) / 1e6;
  const youngerMa = toYears(input.spec.spanYounger) / 1e6;
  const eps = 1e-9 * Math.max(1, olderMa);
  const outside = markers.filter((m) => m.ageMa > olderMa + eps || m.ageMa < youngerMa - eps);
  for (const m of outside) {
    add({ kind: "inside-span", status: "fail", message: `${name(m)} is at ${formatAgeMa(m.ageMa)}, outside the exhibit's span (${formatAgeMa(olderMa)} to ${formatAgeMa(youngerMa)}).` }, m);
  }
  const inside = markers.filter((m) => !outside.includes(m));
  const computed = computeExhibit(input.spec, inside, standardDurations());
  if (!computed.ok) {
    add({ kind: "computes", status: "fail", message: `The exhibit does not compute: ${computed.message}` });
  } else {
    const result = computed.result;
    const total = result.scale.totalMetres;
    const points = new Map(result.points.map((p) => [p.id, p]));
    for (const m of inside) {
      const p = points.get(m.id);
      const onMedium = p && p.fromOlderEndMetres >= -1e-9 && p.fromOlderEndMetres <= total + 1e-9 && (input.spec.medium.kind === "length" || Boolean(p.position));
      if (onMedium) {
        add({ kind: "inside-span", status: "pass", message: `${name(m)} lies inside the span, ${p!.display.fromOlderEnd} from the older end${p!.position ? `, at ${p!.position.lat.toFixed(6)}, ${p!.position.lon.toFixed(6)}` : ""}.` }, m);
      } else {
        add({ kind: "inside-span", status: "fail", message: `${name(m)} does not fall on the medium (recomputed position off its ${total.toFixed(2)} m).` }, m);
      }
    }
    // 4. Crowding and too-small warnings resolved or acknowledged.
    const acks = new Map(input.acknowledgements.map((a) => [a.warningKey, a]));
    for (const w of result.warnings) {
      const key = warningKeyOf(w);
      const ack = acks.get(key) ?? null;
      const first = w.pointIds.map((id) => byId.get(id)).find(Boolean);
      add(
        ack
          ? { kind: "legibility", status: "pass", message: `Acknowledged: ${w.message} Reason given: “${ack.reason}”.`, warningKey: key, acknowledgement: ack }
          : { kind: "legibility", status: "warning", message: `${w.message} Resolve it (an inset, fewer markers) or acknowledge it with a reason.`, warningKey: key, acknowledgement: null },
        first,
      );
    }
    if (result.warnings.length === 0) add({ kind: "legibility", status: "pass", message: "No crowded markers and nothing too small to see." });
  }

  // 5. Insets state their magnification.
  for (const inset of input.spec.insets) {
    const ok = statesMagnification(inset.label, inset.magnification);
    const mag = `${inset.magnification.toLocaleString("en-GB")}×`;
    add({ kind: "inset-magnification", status: ok ? "pass" : "fail", message: ok ? `Inset “${inset.label}” states its magnification (${mag}).` : `Inset “${inset.label}” does not state its magnification: add “${mag}” to its label so visitors know it is not to the main scale.` });
  }

  // 6. An event or custom marker whose text names an interval lies in it on the pinned edition.
  for (const m of markers.filter((x) => x.kind !== "boundary")) {
    const ev = input.events?.get(m.id);
    const warnings = checkIntervalNames(
      edition.intervals,
      [{ id: m.id, name: m.label, summary: [ev?.name, ev?.summary, m.text].filter(Boolean).join(" \n "), datingMethod: ev?.datingMethod ?? null, ageMa: m.ageMa, uncertaintyMa: m.uncertaintyMa }],
      { editionLabel: edition.label },
    );
    if (warnings.length) for (const w of warnings) add({ kind: "interval-names", status: "warning", message: `${name(m)}: ${w.message}` }, m);
    else add({ kind: "interval-names", status: "pass", message: `${name(m)}: no interval it names contradicts its age on ${edition.label}.` }, m);
  }

  // 7. Images have alt text (only when images exist).
  for (const [markerId, image] of input.images ?? []) {
    const m = byId.get(markerId);
    if (!m) continue;
    const alt = (image.alt ?? "").trim();
    add(alt ? { kind: "image-alt", status: "pass", message: `${name(m)}: its image has alt text (“${alt.length > 60 ? `${alt.slice(0, 57)}…` : alt}”).` } : { kind: "image-alt", status: "fail", message: `${name(m)}: its image has no alt text; describe what it shows for visitors who cannot see it.` }, m);
  }

  // 8. The pinned edition is the organisation's current one.
  if (input.recheck) {
    const r = input.recheck;
    add({
      kind: "edition-current",
      status: "warning",
      message: `Needs re-check: your organisation now works with ${r.edition.label}, but this exhibit is pinned to ${edition.label}. Re-pinning would move ${plural(r.moved, "boundary marker")}${r.missing ? ` and ${plural(r.missing, "marker")} ha${r.missing === 1 ? "s" : "ve"} no matching interval` : ""}; see the impact report on the exhibit page.`,
    });
  } else {
    add({ kind: "edition-current", status: "pass", message: `${edition.label} is your organisation's current chart edition.` });
  }

  const counts: Record<CheckStatus, number> = { pass: 0, warning: 0, fail: 0 };
  for (const r of results) counts[r.status]++;
  return {
    revision: input.revision,
    edition: { slug: edition.slug, label: edition.label },
    overall: counts.fail ? "fail" : counts.warning ? "warning" : "pass",
    counts,
    results,
    figures,
    recheck: input.recheck,
  };
}

/** The failing results in one sentence each, for a refusal message. */
export function failuresInWords(report: CheckReport, max = 3): string {
  const fails = report.results.filter((r) => r.status === "fail");
  const shown = fails.slice(0, max).map((r) => r.message).join(" ");
  return fails.length > max ? `${shown} (and ${fails.length - max} more)` : shown;
}
