// applyCorrections(): apply a recorded list of corrections to intervals read from a source.
// Strict on purpose: each correction names the interval and the value it expects to find
// ("from"); if the source no longer holds that value the correction is stale and this throws,
// so a correction can never be applied silently to data it was not written for.
// Corrections apply in list order; a name correction also renames the parent reference of the
// interval's children. Chart order is recomputed afterwards.

import { inChartOrder } from "./order";
import { CORRECTABLE_FIELDS, type Correction, type Interval } from "./types";

export class CorrectionError extends Error {
  constructor(
    message: string,
    readonly correction: Correction,
  ) {
    super(message);
    this.name = "CorrectionError";
  }
}

export function applyCorrections(intervals: readonly Interval[], corrections: readonly Correction[]): Interval[] {
  const list = intervals.map((iv) => ({ ...iv, names: { ...iv.names } }));
  for (const c of corrections) {
    if (!(CORRECTABLE_FIELDS as readonly string[]).includes(c.field)) {
      throw new CorrectionError(`correction of "${c.interval}": field "${c.field}" cannot be corrected`, c);
    }
    const matches = list.filter((iv) => iv.name === c.interval);
    if (matches.length !== 1) {
      throw new CorrectionError(
        `correction of "${c.interval}".${c.field}: ${matches.length === 0 ? "no interval" : `${matches.length} intervals`} of that name`,
        c,
      );
    }
    const iv = matches[0];
    const current = iv[c.field] as unknown;
    if (current !== c.from) {
      throw new CorrectionError(
        `correction of "${c.interval}".${c.field}: expected ${JSON.stringify(c.from)} but found ${JSON.stringify(current)}`,
        c,
      );
    }
    if (c.field === "name") {
      if (typeof c.to !== "string" || c.to === "") throw new CorrectionError(`correction of "${c.interval}".name: new name must be a string`, c);
      for (const other of list) if (other.parent === c.interval) other.parent = c.to;
    }
    (iv as Record<string, unknown>)[c.field] = c.to;
  }
  return inChartOrder(list);
}
