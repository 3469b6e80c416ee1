// check(): every invariant of a chart edition, one precise Problem per break.
//
// Rules (the `rule` field of each Problem):
//   name                  every interval has a non-empty name
//   name-unique           names are unique within the edition
//   number                base, top and ± are finite numbers
//   base-older-than-top   base > top
//   age-negative          no age below 0 Ma (the present)
//   uncertainty           ± is non-negative (or null)
//   color                 colour is "#RRGGBB"
//   parent-exists         a named parent exists in the edition
//   parent-cycle          following parents never loops
//   rank-nesting          a child's rank is deeper than its parent's (ranks may be skipped,
//                         e.g. subperiod is optional between period and epoch)
//   root-eon              roots are eons only, and eons have no parent
//   tiling-base           the oldest child starts where its parent starts
//   tiling-top            the youngest child ends where its parent ends
//   sibling-gap / -overlap  consecutive children meet exactly (older.top = younger.base)
//   boundary-consistency  a parent and its oldest child share one boundary, so they carry the
//                         same ±, the same "~" and the same GSSP flag
//   rank-gap / -overlap   no gaps or overlaps within a rank across the whole chart (see below)
//   youngest-top          the youngest top is 0 Ma
//
// "Within a rank across the whole chart": for each rank R the chart is cut at R — every
// interval of rank R, plus undivided intervals of a shallower rank (leaves such as the Hadean or
// the Precambrian periods), plus intervals of a deeper rank whose parent is shallower than R
// (a rank skipped, e.g. an age directly under a period). That cut must tile the chart without
// gaps or overlaps. A seam (an older top meeting a younger base) already reported by the sibling
// rules is not repeated, and any other seam is reported once, at the shallowest rank showing it.
//
// Numbers are compared as written, to 1e-9 Ma (see numbers.ts).

import { fmtMa, fmtUncertainty, round9, sameMa } from "./numbers";
import { RANKS, isRank, rankDepth, type Interval, type Problem, type ProblemRule } from "./types";

export interface CheckOptions {
  /** Line (or index) of each interval in its source file, attached to problems as `line`. */
  lines?: ReadonlyArray<number | undefined>;
}

const HEX = /^#[0-9A-Fa-f]{6}$/;

export function check(intervals: readonly Interval[], options: CheckOptions = {}): Problem[] {
  const problems: Problem[] = [];
  const lineOf = new Map<Interval, number | undefined>();
  intervals.forEach((iv, i) => lineOf.set(iv, options.lines?.[i]));

  const report = (iv: Interval | null, field: string, rule: ProblemRule, message: string) => {
    const p: Problem = { interval: iv?.name ?? "", field, message, rule };
    const line = iv ? lineOf.get(iv) : undefined;
    if (line !== undefined) p.line = line;
    problems.push(p);
  };

  if (intervals.length === 0) {
    report(null, "intervals", "youngest-top", "the edition has no intervals");
    return problems;
  }

  // --- per-interval rules -------------------------------------------------------------------
  const finite = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);
  for (const iv of intervals) {
    if (typeof iv.name !== "string" || iv.name.trim() === "") {
      report(iv, "name", "name", "name is empty");
    }
    if (!isRank(iv.rank)) {
      report(iv, "rank", "rank-nesting", `rank "${String(iv.rank)}" is not one of ${RANKS.join(", ")}`);
    }
    const baseOk = finite(iv.baseMa);
    const topOk = finite(iv.topMa);
    if (!baseOk) report(iv, "baseMa", "number", `base ${String(iv.baseMa)} is not a finite number of Ma`);
    if (!topOk) report(iv, "topMa", "number", `top ${String(iv.topMa)} is not a finite number of Ma`);
    if (baseOk && topOk && round9(iv.baseMa) <= round9(iv.topMa)) {
      report(
        iv,
        "baseMa",
        "base-older-than-top",
        `base ${fmtMa(iv.baseMa)} Ma must be older (greater) than top ${fmtMa(iv.topMa)} Ma`,
      );
    }
    if (baseOk && round9(iv.baseMa) < 0) report(iv, "baseMa", "age-negative", `base ${fmtMa(iv.baseMa)} Ma is in the future (below 0 Ma)`);
    if (topOk && round9(iv.topMa) < 0) report(iv, "topMa", "age-negative", `top ${fmtMa(iv.topMa)} Ma is in the future (below 0 Ma)`);
    if (iv.baseUncertaintyMa !== null) {
      if (!finite(iv.baseUncertaintyMa)) {
        report(iv, "baseUncertaintyMa", "number", `base uncertainty ${String(iv.baseUncertaintyMa)} is not a finite number of Ma`);
      } else if (iv.baseUncertaintyMa < 0) {
        report(iv, "baseUncertaintyMa", "uncertainty", `base uncertainty ${fmtMa(iv.baseUncertaintyMa)} Ma is negative`);
      }
    }
    if (typeof iv.color !== "string" || !HEX.test(iv.color)) {
      report(iv, "color", "color", `colour "${String(iv.color)}" is not a hex colour "#RRGGBB"`);
    }
    if (iv.boundaryKind != null && iv.gssp !== true) {
      report(iv, "boundaryKind", "boundary-kind", `base is given the kind ${iv.boundaryKind} but is not marked ratified (gssp ${String(iv.gssp)}); a kind needs gssp = true`);
    }
  }

  // --- names --------------------------------------------------------------------------------
  const byName = new Map<string, Interval>();
  for (const iv of intervals) {
    const first = byName.get(iv.name);
    if (first) {
      const where = lineOf.get(first) !== undefined ? ` (line ${lineOf.get(first)})` : "";
      report(iv, "name", "name-unique", `name "${iv.name}" is already used by another ${first.rank}${where}`);
    } else {
      byName.set(iv.name, iv);
    }
  }

  // --- parents, cycles, rank nesting, roots ---------------------------------------------------
  const parentOf = new Map<Interval, Interval>();
  for (const iv of intervals) {
    if (iv.parent === null) continue;
    const p = byName.get(iv.parent);
    if (!p) {
      report(iv, "parent", "parent-exists", `parent "${iv.parent}" does not exist in this edition`);
    } else if (p === iv) {
      report(iv, "parent", "parent-cycle", `interval is its own parent`);
    } else {
      parentOf.set(iv, p);
    }
  }
  const inCycle = new Set<Interval>();
  for (const iv of intervals) {
    const seen = new Set<Interval>([iv]);
    let cur = parentOf.get(iv);
    while (cur) {
      if (cur === iv) {
        inCycle.add(iv);
        report(iv, "parent", "parent-cycle", `following parents from "${iv.name}" loops back to it`);
        break;
      }
      if (seen.has(cur)) break; // a cycle further up; reported on its own members
      seen.add(cur);
      cur = parentOf.get(cur);
    }
  }
  for (const c of inCycle) parentOf.delete(c);

  for (const iv of intervals) {
    const p = parentOf.get(iv);
    if (p && isRank(iv.rank) && isRank(p.rank) && rankDepth(iv.rank) <= rankDepth(p.rank)) {
      report(
        iv,
        "rank",
        "rank-nesting",
        `rank ${iv.rank} is not deeper than the rank of its parent "${p.name}" (${p.rank}); ranks nest eon > era > period > subperiod > epoch > age`,
      );
    }
    if (iv.parent === null && iv.rank !== "eon") {
      report(iv, "parent", "root-eon", `${iv.rank} has no parent; only eons may be roots`);
    }
    if (iv.parent !== null && iv.rank === "eon") {
      report(iv, "parent", "root-eon", `an eon cannot have a parent (has "${iv.parent}")`);
    }
  }

  // --- children tile their parent -----------------------------------------------------------
  const childrenOf = new Map<Interval, Interval[]>();
  for (const [c, p] of parentOf) {
    const list = childrenOf.get(p);
    if (list) list.push(c);
    else childrenOf.set(p, [c]);
  }
  const olderFirst = (a: Interval, b: Interval) => b.baseMa - a.baseMa || a.order - b.order;
  const siblingSeams = new Set<string>();
  for (const [p, kids] of childrenOf) {
    kids.sort(olderFirst);
    const first = kids[0];
    const last = kids[kids.length - 1];
    if (!sameMa(first.baseMa, p.baseMa)) {
      report(
        first,
        "baseMa",
        "tiling-base",
        `base ${fmtMa(first.baseMa)} Ma does not meet the base of its parent "${p.name}" (${fmtMa(p.baseMa)} Ma); the oldest child must start where its parent starts`,
      );
    } else {
      if (
        (first.baseUncertaintyMa === null) !== (p.baseUncertaintyMa === null) ||
        (first.baseUncertaintyMa !== null && p.baseUncertaintyMa !== null && !sameMa(first.baseUncertaintyMa, p.baseUncertaintyMa))
      ) {
        report(
          first,
          "baseUncertaintyMa",
          "boundary-consistency",
          `base uncertainty ${fmtUncertainty(first.baseUncertaintyMa)} differs from ${fmtUncertainty(p.baseUncertaintyMa)} on the same boundary (${fmtMa(p.baseMa)} Ma) of its parent "${p.name}"`,
        );
      }
      if (first.approximate !== p.approximate) {
        report(
          first,
          "approximate",
          "boundary-consistency",
          `base is ${first.approximate ? "" : "not "}marked approximate (~) but the same boundary (${fmtMa(p.baseMa)} Ma) of its parent "${p.name}" is${p.approximate ? "" : " not"}`,
        );
      }
      if (first.gssp !== p.gssp) {
        report(
          first,
          "gssp",
          "boundary-consistency",
          `GSSP flag ${String(first.gssp)} differs from ${String(p.gssp)} on the same boundary (${fmtMa(p.baseMa)} Ma) of its parent "${p.name}"`,
        );
      }
      if ((first.boundaryKind ?? null) !== (p.boundaryKind ?? null)) {
        report(
          first,
          "boundaryKind",
          "boundary-consistency",
          `boundary kind ${first.boundaryKind ?? "not stated"} differs from ${p.boundaryKind ?? "not stated"} on the same boundary (${fmtMa(p.baseMa)} Ma) of its parent "${p.name}"`,
        );
      }
    }
    if (!sameMa(last.topMa, p.topMa)) {
      report(
        last,
        "topMa",
        "tiling-top",
        `top ${fmtMa(last.topMa)} Ma does not meet the top of its parent "${p.name}" (${fmtMa(p.topMa)} Ma); the youngest child must end where its parent ends`,
      );
    }
    for (let i = 1; i < kids.length; i++) {
      const older = kids[i - 1];
      const younger = kids[i];
      siblingSeams.add(seamKey(older, younger));
      seam(older, younger, `under "${p.name}"`, "sibling-gap", "sibling-overlap");
    }
  }

  function seam(older: Interval, younger: Interval, where: string, gapRule: ProblemRule, overlapRule: ProblemRule) {
    const a = round9(older.topMa);
    const b = round9(younger.baseMa);
    if (a === b) return;
    if (b < a) {
      report(
        younger,
        "baseMa",
        gapRule,
        `gap of ${fmtMa(a - b)} Ma ${where} between "${older.name}" (top ${fmtMa(older.topMa)} Ma) and "${younger.name}" (base ${fmtMa(younger.baseMa)} Ma)`,
      );
    } else {
      report(
        younger,
        "baseMa",
        overlapRule,
        `overlap of ${fmtMa(b - a)} Ma ${where} between "${older.name}" (top ${fmtMa(older.topMa)} Ma) and "${younger.name}" (base ${fmtMa(younger.baseMa)} Ma)`,
      );
    }
  }

  // --- within each rank, across the whole chart -----------------------------------------------
  const reportedSeams = new Set<string>();
  for (let level = 0; level < RANKS.length; level++) {
    const cut: Interval[] = [];
    for (const iv of intervals) {
      if (!isRank(iv.rank) || byName.get(iv.name) !== iv) continue;
      const d = rankDepth(iv.rank);
      const p = parentOf.get(iv);
      const pd = p && isRank(p.rank) ? rankDepth(p.rank) : -1;
      const isLeaf = !childrenOf.has(iv);
      if (d === level || (d < level && isLeaf) || (d > level && pd < level)) cut.push(iv);
    }
    if (!cut.some((iv) => rankDepth(iv.rank) === level)) continue; // rank not used in this edition
    cut.sort(olderFirst);
    for (let i = 1; i < cut.length; i++) {
      const older = cut[i - 1];
      const younger = cut[i];
      if (sameMa(older.topMa, younger.baseMa)) continue;
      const key = seamKey(older, younger);
      if (siblingSeams.has(key) || reportedSeams.has(key)) continue;
      reportedSeams.add(key);
      seam(older, younger, `at ${RANKS[level]} rank`, "rank-gap", "rank-overlap");
    }
  }

  // --- the youngest top is the present ----------------------------------------------------------
  let youngest: Interval | null = null;
  for (const iv of intervals) {
    if (!finite(iv.topMa)) continue;
    if (!youngest || iv.topMa < youngest.topMa) youngest = iv;
  }
  if (youngest && round9(youngest.topMa) !== 0) {
    report(
      youngest,
      "topMa",
      "youngest-top",
      `the youngest top is ${fmtMa(youngest.topMa)} Ma; the chart must reach the present (0 Ma)`,
    );
  }

  return problems;
}

/** A seam is where an older interval's top meets a younger one's base; the same two ages are
 *  the same place in the chart, whichever intervals meet there at whichever rank. */
function seamKey(older: Interval, younger: Interval): string {
  return `${round9(older.topMa)}|${round9(younger.baseMa)}`;
}
