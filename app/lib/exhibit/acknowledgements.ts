// Acknowledged warnings: a designer may accept a legibility warning with a reason ("the two signs
// share one post"). An acknowledgement is stored under the warning's key (scale/warnings.ts); it
// applies while a warning with that key exists and is ignored once the warning is gone.
import { z } from "zod";
import type { ScaleWarning } from "../scale/warnings";

export interface WarningAcknowledgement {
  warningKey: string;
  reason: string;
  /** Who acknowledged it (name), null if the account is gone. */
  by: string | null;
  /** ISO time. */
  at: string;
  /** The exhibit revision the acknowledgement was saved as. */
  revision: number;
}

/** A warning with its acknowledgement, if any. */
export type AcknowledgedWarning = ScaleWarning & { acknowledgement: WarningAcknowledgement | null };

export const ACK_REASON_MIN = 10;
export const ACK_REASON_MAX = 1000;

export const AcknowledgeWarningSchema = z.object({
  warningKey: z
    .string({ error: "The form lost which warning to acknowledge; reload the page." })
    .trim()
    .min(1, { error: "The form lost which warning to acknowledge; reload the page." })
    .max(5000, { error: "That warning key is too long; reload the page." }),
  reason: z
    .string({ error: "Say why this warning is acceptable." })
    .trim()
    .min(ACK_REASON_MIN, { error: `Say why this warning is acceptable, in at least ${ACK_REASON_MIN} characters (e.g. "the two signs share one post").` })
    .max(ACK_REASON_MAX, { error: `Keep the reason under ${ACK_REASON_MAX.toLocaleString("en-GB")} characters.` }),
});

/** The latest acknowledgement of this warning, if any (an acknowledgement under another key never applies). */
export function acknowledgementOf(warning: Pick<ScaleWarning, "key">, acks: readonly WarningAcknowledgement[]): WarningAcknowledgement | null {
  let found: WarningAcknowledgement | null = null;
  for (const a of acks) if (a.warningKey === warning.key && (!found || a.revision > found.revision)) found = a;
  return found;
}

export function isAcknowledged(warning: Pick<ScaleWarning, "key">, acks: readonly WarningAcknowledgement[]): boolean {
  return acknowledgementOf(warning, acks) !== null;
}

/** Every warning with its acknowledgement; acknowledgements of warnings that no longer exist are left out. */
export function withAcknowledgements(warnings: readonly ScaleWarning[], acks: readonly WarningAcknowledgement[]): AcknowledgedWarning[] {
  return warnings.map((w) => ({ ...w, acknowledgement: acknowledgementOf(w, acks) }));
}

/** Markers that can be combined into one: at least two, all of one age (a markers-same-age warning's markers). */
export function combinableIds(warning: Pick<ScaleWarning, "code" | "pointIds">): string[] | null {
  return warning.code === "markers-same-age" && warning.pointIds.length >= 2 ? warning.pointIds : null;
}
