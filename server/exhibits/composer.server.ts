// The composer page's data, and its commands, one per intent of app/lib/exhibit/intents.ts: each runs the matching
// change and returns the notice the designer sees after the redirect.
import { formatAgeMa, formatLength, listWords, routeMediumOf, type ComposerCommand, type ComposerView } from "../../app/lib/exhibit/index.ts";
import { toYears } from "../../app/lib/units/index.ts";
import { acknowledgeWarning, acknowledgementsFor } from "./warnings.server.ts";
import { addBoundaries, addCustom, addEvent, addInset, combineMarkers, editMarker, removeInset, removeMarker, replaceRoute, updateSettings } from "./commands.server.ts";
import { renderMarkdown } from "../markdown.server.ts";
import { removeImage, setImage } from "../assets/attach.server.ts";
import { impactFor, repinToCurrent } from "./impact.server.ts";
import { ExhibitError, howWeKnowFor, requireBundle } from "./load.server.ts";
import type { Actor } from "./revise.server.ts";
import { reviewActorOf, submitForReview } from "../review/lifecycle.server.ts";
import { publish } from "../publications/publish.server.ts";

const ma = (value: number, unit: Parameters<typeof toYears>[0]["unit"]) => toYears({ value, unit }) / 1e6;

export async function runComposerCommand(actor: Actor, slug: string, command: ComposerCommand): Promise<string> {
  const revision = command.revision;
  switch (command.intent) {
    case "settings": {
      const c = command;
      const medium = c.mediumKind === "length" ? { kind: "length" as const, lengthValue: c.lengthValue, lengthUnit: c.lengthUnit, panelWidthValue: c.panelWidthValue, panelWidthUnit: c.panelWidthUnit } : undefined;
      await updateSettings(actor, slug, revision, c, medium);
      return "Settings saved.";
    }
    case "add-boundaries": {
      const { result } = await addBoundaries(actor, slug, revision, { intervalName: command.intervalName, rank: command.rank });
      return result.length === 1 ? `Added the base of the ${result[0]}.` : `Added ${result.length} boundaries.`;
    }
    case "add-event": {
      const { result } = await addEvent(actor, slug, revision, command.eventId);
      return `Added “${result}”.`;
    }
    case "add-custom": {
      const c = command;
      const uncertaintyMa = c.uncertaintyValue == null ? null : ma(c.uncertaintyValue, c.ageUnit);
      await addCustom(actor, slug, revision, { label: c.label, ageMa: ma(c.ageValue, c.ageUnit), uncertaintyMa, source: c.source, text: c.text });
      return `Added “${c.label}”.`;
    }
    case "edit-marker":
      await editMarker(actor, slug, revision, command.markerId, command.label, command.text, command.decaySystemId ?? null);
      return "Marker saved.";
    case "remove-marker": {
      const { result } = await removeMarker(actor, slug, revision, command.markerId);
      return `Removed “${result}”.`;
    }
    case "add-inset": {
      const i = command;
      const olderMa = ma(i.olderValue, i.olderUnit);
      const youngerMa = ma(i.youngerValue, i.youngerUnit);
      const label = i.label ?? `${formatAgeMa(olderMa)} to ${formatAgeMa(youngerMa)} at ${i.magnification.toLocaleString("en-GB")}×`;
      await addInset(actor, slug, revision, { olderMa, youngerMa, magnification: i.magnification, label });
      return `Inset added: ${label}.`;
    }
    case "remove-inset":
      await removeInset(actor, slug, revision, command.insetId);
      return "Inset removed.";
    case "replace-route": {
      const r = await routeMediumOf(command.routeFile);
      if (!r.ok) throw new ExhibitError(r.message, "routeFile");
      await replaceRoute(actor, slug, revision, r.medium);
      return `Route replaced by ${r.medium.sourceName} (${formatLength(r.medium.lengthMetres, "metric", 0.01)}); every marker moved with it.${r.medium.note ? ` ${r.medium.note}` : ""}`;
    }
    case "set-marker-image":
    case "set-cover-image": {
      const markerId = command.intent === "set-marker-image" ? command.markerId : null;
      await setImage(actor, slug, revision, markerId, { assetId: command.assetId, alt: command.alt, credit: command.credit });
      const what = markerId === null ? "Cover image" : "Image";
      return command.alt ? `${what} saved.` : `${what} saved. Add its alt text before review: the review checks need it.`;
    }
    case "remove-image":
      await removeImage(actor, slug, revision, command.markerId === "cover" ? null : command.markerId);
      return command.markerId === "cover" ? "Cover image removed." : "Image removed from the marker.";
    case "submit-for-review": {
      const { report, mailed } = await submitForReview(reviewActorOf(actor), slug, revision);
      return `Submitted for review${report.counts.warning ? ` with ${report.counts.warning} warning${report.counts.warning === 1 ? "" : "s"} for the reviewer to weigh` : ""}; ${mailed.length} reviewer${mailed.length === 1 ? " was" : "s were"} told by e-mail.`;
    }
    case "publish": {
      const { number, newSigns } = await publish(reviewActorOf(actor), slug, revision);
      return `Published as publication ${number}${newSigns ? ` (${newSigns} new sign number${newSigns === 1 ? "" : "s"})` : ""}. Visitors now see this version.`;
    }
    case "acknowledge-warning": {
      const { result } = await acknowledgeWarning(actor, slug, revision, command.warningKey, command.reason);
      return `Warning acknowledged${result.markers.length ? ` (markers ${listWords(result.markers.map((m) => String(m.number)))})` : ""}; the reviewer will read your reason.`;
    }
    case "combine-markers": {
      const { result } = await combineMarkers(actor, slug, revision, command.markerIds);
      return `Combined ${result.removeIds.length + 1} markers into one: “${result.label}”.`;
    }
    case "repin": {
      const { result } = await repinToCurrent(actor, slug, revision);
      return `Re-pinned from ${result.from} to ${result.to}; ${result.moved} marker${result.moved === 1 ? "" : "s"} changed. The exhibit needs review again.`;
    }
  }
}

/** The composer page's data: the preview is computed in the browser; the server adds the impact report and "how we know". */
export async function composerView(organisationId: number, slug: string, canEdit: boolean): Promise<ComposerView> {
  const bundle = await requireBundle(organisationId, slug);
  const [impact, decay, acknowledgements] = await Promise.all([impactFor(bundle), howWeKnowFor(bundle), acknowledgementsFor(bundle.exhibit.id)]);
  const decayOf = new Map(bundle.markerRows.map((r) => [String(r.id), r.decaySystemId]));
  const e = bundle.exhibit;
  return {
    exhibit: { title: e.title, slug: e.slug, status: e.status, revision: e.revision, updatedAt: e.updatedAt.toISOString(), updatedBy: e.updatedBy?.name ?? null },
    edition: { slug: bundle.edition.slug, label: bundle.edition.label, status: bundle.edition.status },
    spec: bundle.spec,
    markers: bundle.markers.map((m) => ({ ...m, html: renderMarkdown(m.text), howWeKnow: decay.byMarker.get(m.id) ?? null, decaySystemId: decayOf.get(m.id) ?? null })),
    decaySystems: decay.systems,
    insetIds: bundle.insets.map((i) => i.id),
    intervals: bundle.intervals.map((i) => ({ name: i.name, rank: i.rank, baseMa: i.baseMa, topMa: i.topMa, color: i.color })),
    impact,
    acknowledgements,
    canEdit,
  };
}
