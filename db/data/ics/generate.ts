// Generates the seeded chart editions from the ICS Turtle files in ./source:
//
//   npx tsx db/data/ics/generate.ts        (npm run ics:generate)
//
// writes db/data/ics/ics-2024-12.json and db/data/ics/ics-2023-09.json.
//
// Steps, for each edition:
//   1. read the Turtle file with parseTurtle() (n3), which also runs check() on what it read;
//   2. apply the explicit list of corrections below (each one names the value it expects to
//      find, so a correction can never apply silently to data it was not written for);
//   3. run check() on the corrected intervals and stop with exit code 1 if any problem remains,
//      or if a problem the source file raised is left without a correction;
//   4. write the edition (metadata + corrections + intervals in chart order) as JSON.
// The output is deterministic: running it twice gives identical files.

import { readFileSync, writeFileSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";
import { applyCorrections } from "../../../app/lib/timescale/corrections";
import { check } from "../../../app/lib/timescale/check";
import { parseTurtle } from "../../../app/lib/timescale/turtle";
import type { Correction, Edition, EditionMeta, Interval } from "../../../app/lib/timescale/types";

const here = dirname(fileURLToPath(import.meta.url));
const repoRoot = join(here, "..", "..", "..");

const PRINTED_2024 = "ICS International Chronostratigraphic Chart v2024/12 (printed chart)";
const PRINTED_2023 = "ICS International Chronostratigraphic Chart v2023/09 (printed chart)";

// ---------------------------------------------------------------------------------------------
// Names. The 2024/12 file carries no label at all (in any language) for 26 intervals: the
// Lower/Middle/Upper epochs of seven periods, the Upper Pleistocene age and the numbered
// Cambrian series and stages. parseTurtle() names them by their IRI local name
// ("LowerDevonian"); here they get English names. Eonscale's ranks are the time ranks
// (epoch, age), so the time form is used (Early/Middle/Late X — the printed chart's rock
// columns say Lower/Upper), spelled exactly as the ICS's own 2023/09 data file spells the same
// IRI, so that names stay stable across editions.
// ---------------------------------------------------------------------------------------------
function nameFromIri(local: string, english: string, file: string): Correction {
  return {
    interval: local,
    field: "name",
    from: local,
    to: english,
    reason: `the file carries no skos:prefLabel for ischart:${local}; English time name given (Lower/Upper series = Early/Late epoch), spelled as the ICS 2023/09 data file labels the same IRI`,
    source: `${file} (IRI ischart:${local}); ICS chart data file for v2023/09 (skos:prefLabel@en of ischart:${local})`,
  };
}

const F2024 = "ics-chart-2024-12.ttl";
const F2023 = "ics-chart-2023-09.ttl";

const MISSING_NAMES_2024: Array<[string, string]> = [
  ["UpperPleistocene", "Late Pleistocene"],
  ["LowerCretaceous", "Early Cretaceous"],
  ["UpperCretaceous", "Late Cretaceous"],
  ["LowerJurassic", "Early Jurassic"],
  ["MiddleJurassic", "Middle Jurassic"],
  ["UpperJurassic", "Late Jurassic"],
  ["LowerTriassic", "Early Triassic"],
  ["MiddleTriassic", "Middle Triassic"],
  ["UpperTriassic", "Late Triassic"],
  ["LowerMississippian", "Early Mississippian"],
  ["MiddleMississippian", "Middle Mississippian"],
  ["UpperMississippian", "Late Mississippian"],
  ["LowerPennsylvanian", "Early Pennsylvanian"],
  ["MiddlePennsylvanian", "Middle Pennsylvanian"],
  ["UpperPennsylvanian", "Late Pennsylvanian"],
  ["LowerDevonian", "Early Devonian"],
  ["MiddleDevonian", "Middle Devonian"],
  ["UpperDevonian", "Late Devonian"],
  ["LowerOrdovician", "Early Ordovician"],
  ["MiddleOrdovician", "Middle Ordovician"],
  ["UpperOrdovician", "Late Ordovician"],
  ["CambrianSeries2", "Cambrian Series 2"],
  ["CambrianStage10", "Cambrian Stage 10"],
  ["CambrianStage4", "Cambrian Stage 4"],
  ["CambrianStage3", "Cambrian Stage 3"],
  ["CambrianStage2", "Cambrian Stage 2"],
];

// ---------------------------------------------------------------------------------------------
// ICS 2024/12 corrections.
// ---------------------------------------------------------------------------------------------
const CORRECTIONS_2024_12: Correction[] = [
  // check(): tiling-base + rank-gap. The base of the Aquitanian is the base of the Miocene and of
  // the Neogene (one GSSP). The file gives 23.04 Ma to Miocene base, Neogene base, Chattian top,
  // Oligocene top and Paleogene top, but 23.03 (the 2023/09 figure) to the Aquitanian base.
  {
    interval: "Aquitanian",
    field: "baseMa",
    from: 23.03,
    to: 23.04,
    reason:
      "base of the Aquitanian = base of the Miocene and Neogene (same GSSP); the file writes 23.04 Ma for Miocene, Neogene, Chattian top, Oligocene top and Paleogene top and 23.03 (the 2023/09 value) for the Aquitanian base only; the printed 2024/12 chart gives 23.04 (from memory)",
    source: `${PRINTED_2024}, from memory; ${F2024} ischart:Miocene, ischart:Neogene, ischart:Chattian`,
  },
  // check(): tiling-top (Ludfordian) + sibling-overlap (Pridoli). The file ends the Ludlow at the
  // top of the Silurian (419.62 Ma), so it overlaps the Pridoli; its own youngest stage, the
  // Ludfordian, ends at 422.7 Ma, the base of the Pridoli.
  {
    interval: "Ludlow",
    field: "topMa",
    from: 419.62,
    to: 422.7,
    reason:
      "the file ends the Ludlow at the top of the Silurian (419.62 Ma), overlapping the Pridoli (base 422.7 ± 1.6 Ma); the Ludlow ends where the Pridoli begins, as its youngest stage (Ludfordian, top 422.7) does; printed chart: Ludlow 426.7 – 422.7 (from memory)",
    source: `${PRINTED_2024}, from memory; ${F2024} ischart:Pridoli, ischart:Ludfordian`,
  },
  ...MISSING_NAMES_2024.map(([local, english]) => nameFromIri(local, english, F2024)),
  // parseTurtle() "source" problem: the Neoproterozoic is marked both gts:ratifiedGSSP and
  // gts:ratifiedGSSA. Its base is the base of the Tonian (1000 Ma), which the same file marks
  // GSSA only; the printed chart shows the Precambrian boundaries up to the Tonian base as
  // numerically defined (GSSA), and the Ediacaran base as the first Proterozoic GSSP.
  {
    interval: "Neoproterozoic",
    field: "boundaryKind",
    from: null,
    to: "GSSA",
    reason:
      "the file marks the Neoproterozoic both ratifiedGSSP and ratifiedGSSA; its base is the base of the Tonian (1000 Ma), which the file marks GSSA only — a boundary defined by age",
    source: `${F2024} ischart:Tonian (gts:ratifiedGSSA true), ischart:Neoproterozoic; ${PRINTED_2024}, from memory (Precambrian boundaries defined by age)`,
  },
];

// ---------------------------------------------------------------------------------------------
// ICS 2023/09 corrections.
// ---------------------------------------------------------------------------------------------
const CORRECTIONS_2023_09: Correction[] = [
  // check(): base-older-than-top, sibling-overlap/-gap under Early Cretaceous. Base and top
  // swapped: the Berriasian ends at ~139.8 and the Hauterivian starts at ~132.6.
  {
    interval: "Valanginian",
    field: "baseMa",
    from: 132.6,
    to: 139.8,
    reason: "base and top swapped in the file (base 132.6 < top 139.8); Berriasian top is ~139.8 and Hauterivian base ~132.6; printed 2023/09 chart: Valanginian ~139.8 (from memory)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Berriasian, ischart:Hauterivian`,
  },
  {
    interval: "Valanginian",
    field: "topMa",
    from: 139.8,
    to: 132.6,
    reason: "base and top swapped in the file; the Valanginian ends where the Hauterivian begins (~132.6)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Hauterivian`,
  },
  // check(): base-older-than-top, tiling-top and sibling-gap under Early Triassic, rank-gap.
  {
    interval: "Olenekian",
    field: "baseMa",
    from: 247.2,
    to: 251.2,
    reason: "base and top swapped in the file (base 247.2 < top 251.2); the Induan ends at 251.2 and the Anisian starts at 247.2; printed 2023/09 chart: Olenekian 251.2 (from memory)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Induan, ischart:Anisian`,
  },
  {
    interval: "Olenekian",
    field: "topMa",
    from: 251.2,
    to: 247.2,
    reason: "base and top swapped in the file; the Olenekian ends where the Anisian (and the Middle Triassic) begins, 247.2",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Anisian, ischart:MiddleTriassic`,
  },
  // check(): base-older-than-top, tiling-base (Cambrian, Mesozoic), tiling-top (Permian),
  // sibling-overlap/-gap under Phanerozoic, rank-gap. Base and top swapped, each with its ±.
  {
    interval: "Paleozoic",
    field: "baseMa",
    from: 251.902,
    to: 538.8,
    reason: "base and top swapped in the file (base 251.902 < top 538.8); the Paleozoic starts with the Cambrian (538.8 ± 0.2) and ends with the Permian (251.902 ± 0.024); printed 2023/09 chart (from memory)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Cambrian, ischart:Permian`,
  },
  {
    interval: "Paleozoic",
    field: "topMa",
    from: 538.8,
    to: 251.902,
    reason: "base and top swapped in the file; the Paleozoic ends where the Mesozoic begins (251.902)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Mesozoic`,
  },
  {
    interval: "Paleozoic",
    field: "baseUncertaintyMa",
    from: 0.024,
    to: 0.2,
    reason: "the ± travelled with the swapped ages: 0.024 belongs to 251.902 (Permian–Triassic), the base 538.8 carries ± 0.2 as on the Cambrian and Phanerozoic",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Cambrian, ischart:Phanerozoic`,
  },
  // check(): sibling-gap and tiling-top under Terreneuvian, rank-overlap with Stage 3. The file
  // gives Stage 2 the span of Series 2 (521–509); Stage 2 runs from ~529 (Fortunian top) to ~521.
  {
    interval: "Cambrian-Stage 2",
    field: "baseMa",
    from: 521,
    to: 529,
    reason: "Stage 2 is given ~521–~509 (the span of Series 2, overlapping Stages 3 and 4); it follows the Fortunian (top ~529) and ends where Stage 3 and Series 2 begin (~521); printed 2023/09 chart: Stage 2 ~529 (from memory)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Fortunian, ischart:CambrianStage3`,
  },
  {
    interval: "Cambrian-Stage 2",
    field: "topMa",
    from: 509,
    to: 521,
    reason: "Stage 2 ends where Stage 3 begins and where its parent Terreneuvian ends (~521)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:CambrianStage3, ischart:Terreneuvian`,
  },
  // check(): tiling-top (Ludfordian) + sibling-overlap (Pridoli), as in 2024/12.
  {
    interval: "Ludlow",
    field: "topMa",
    from: 419.2,
    to: 423,
    reason:
      "the file ends the Ludlow at the top of the Silurian (419.2 Ma), overlapping the Pridoli (base 423.0 ± 2.3 Ma); the Ludlow ends where the Pridoli begins, as its youngest stage (Ludfordian, top 423.0) does; printed chart: Ludlow 427.4 – 423.0 (from memory)",
    source: `${PRINTED_2023}, from memory; ${F2023} ischart:Pridoli, ischart:Ludfordian`,
  },
  // Not a check() finding: the printed 2023/09 chart gives the base of the Sakmarian as
  // 293.52 ± 0.17 Ma; the data file writes 293.51 (Sakmarian base and Asselian top). The 2024/12
  // file has 293.52 ± 0.17 for the same boundary.
  {
    interval: "Sakmarian",
    field: "baseMa",
    from: 293.51,
    to: 293.52,
    reason: "the printed 2023/09 chart gives the Sakmarian base as 293.52 ± 0.17 Ma; the data file writes 293.51 (as reported by a reviewing reading of the printed chart; the same boundary is 293.52 ± 0.17 in the 2024/12 file)",
    source: `${PRINTED_2023} (not at hand here: value as reported by the review, issue 9); ${F2024} ischart:Sakmarian`,
  },
  {
    interval: "Asselian",
    field: "topMa",
    from: 293.51,
    to: 293.52,
    reason: "the Asselian ends where the Sakmarian begins (corrected to 293.52 Ma above)",
    source: `${PRINTED_2023} (as for the Sakmarian base); ${F2024} ischart:Asselian`,
  },
  // Not a check() finding: the file writes "Cambrian-Stage N" but "Cambrian Series 2"; the
  // stray hyphen is removed so the names match the 2024/12 edition and each other.
  ...["10", "4", "3", "2"].map(
    (n): Correction => ({
      interval: `Cambrian-Stage ${n}`,
      field: "name",
      from: `Cambrian-Stage ${n}`,
      to: `Cambrian Stage ${n}`,
      reason: `typographic: the file writes "Cambrian-Stage ${n}" but "Cambrian Series 2"; the printed chart shows "Stage ${n}" in the Cambrian; hyphen removed so the name matches the 2024/12 edition`,
      source: `${PRINTED_2023}, from memory; ${F2023} ischart:CambrianSeries2`,
    }),
  ),
];

// ---------------------------------------------------------------------------------------------
// Boundary kinds for 2023/09. Its file carries no ratification triples at all (gssp null
// throughout). A GSSP is a point in a rock section and a GSSA a fixed age: the boundary stays the
// same when its numerical age estimate is revised. So where an interval of the same name and rank
// exists in 2024/12, that file's GSSP/GSSA marking is carried over — each as a listed
// correction — except for the boundaries the 2024/12 file's own version note (skos:versionInfo)
// says were ratified since 2023/09: those were not ratified in 2023/09.
// ---------------------------------------------------------------------------------------------
/** Ratified between the two editions, per the 2024/12 file's skos:versionInfo ("ratification of the Valanginian GSSP"). */
export const RATIFIED_SINCE_2023_09 = ["Valanginian"] as const;

export function carriedBoundaryKinds(
  target: readonly Interval[],
  from: readonly Interval[],
  fromLabel: string,
  fromFile: string,
  ratifiedSince: readonly string[],
): Correction[] {
  const byName = new Map(from.map((iv) => [iv.name, iv] as const));
  const out: Correction[] = [];
  for (const iv of target) {
    const o = byName.get(iv.name);
    if (!o || o.rank !== iv.rank || o.gssp === null || iv.gssp !== null) continue;
    const iri = `ischart:${iv.name.replace(/\s+/g, "")}`;
    if (ratifiedSince.includes(iv.name)) {
      out.push({
        interval: iv.name,
        field: "gssp",
        from: null,
        to: false,
        reason: `the file states no ratification; the ${fromLabel} file's version note lists the ratification of the ${iv.name} GSSP as new since this edition, so it was not ratified here`,
        source: `${fromFile} skos:versionInfo ("ratification of the ${iv.name} GSSP")`,
      });
      continue;
    }
    const why = `the file states no ratification; the same boundary (base of the ${iv.name}) is marked`;
    out.push({ interval: iv.name, field: "gssp", from: null, to: o.gssp, reason: `${why} ${o.gssp ? "ratified" : "not ratified"} in ${fromLabel}, and its version note lists no change of ratification since this edition`, source: `${fromFile} ${iri}` });
    if (o.boundaryKind) {
      out.push({ interval: iv.name, field: "boundaryKind", from: null, to: o.boundaryKind, reason: `${why} ${o.boundaryKind} in ${fromLabel}`, source: `${fromFile} ${iri} (gts:ratified${o.boundaryKind})` });
    }
  }
  return out;
}

export interface EditionSpec {
  file: string;
  versionInfo: string;
  out: string;
  meta: Omit<EditionMeta, "corrections" | "sourceFile">;
  corrections: Correction[];
  /** Carry boundary kinds over from an edition built earlier in EDITIONS, with the boundaries ratified since. */
  kindsFrom?: { slug: string; ratifiedSince: readonly string[] };
}

const LICENCE = (year: number) =>
  `CC BY 4.0 — Creative Commons Attribution 4.0 International (https://creativecommons.org/licenses/by/4.0/), as stated in the data file; (c) International Commission on Stratigraphy, ${year}. Corrections by Eonscale are listed in edition.corrections.`;

export const EDITIONS: EditionSpec[] = [
  {
    file: F2024,
    versionInfo: "2024-12",
    out: "ics-2024-12.json",
    meta: {
      slug: "ics-2024-12",
      label: "ICS 2024/12",
      status: "current",
      source:
        "Cohen, K.M., Harper, D., Gibbard, P. & Car, N. (2025) The ICS International Chronostratigraphic Chart this decade. Episodes 48: 105–115. https://doi.org/10.18814/epiiugs/2025/025001. ICS International Chronostratigraphic Chart v2024/12 (numeric ages entered January 2025), https://stratigraphy.org/chart; data file chart.ttl of the ICS chart data repository i-c-stratigraphy/chart at commit d4d0e3d.",
      licence: LICENCE(2024),
    },
    corrections: CORRECTIONS_2024_12,
  },
  {
    file: F2023,
    versionInfo: "2023-09",
    out: "ics-2023-09.json",
    meta: {
      slug: "ics-2023-09",
      label: "ICS 2023/09",
      status: "retired",
      source:
        "Cohen, K.M., Finney, S.C., Gibbard, P.L. & Fan, J.-X. (2013; updated) The ICS International Chronostratigraphic Chart. Episodes 36: 199–204. ICS International Chronostratigraphic Chart v2023/09, https://stratigraphy.org/chart; data file chart.ttl of the ICS chart data repository i-c-stratigraphy/chart at tag v2023/09.",
      licence: LICENCE(2023),
    },
    corrections: CORRECTIONS_2023_09,
    kindsFrom: { slug: "ics-2024-12", ratifiedSince: RATIFIED_SINCE_2023_09 },
  },
];

export function buildEdition(spec: EditionSpec, built: ReadonlyMap<string, Edition> = new Map()): { edition: Edition; rawProblemCount: number } {
  const path = join(here, "source", spec.file);
  const parsed = parseTurtle(readFileSync(path, "utf8"));
  if (parsed.meta.versionInfo !== spec.versionInfo) {
    throw new Error(`${spec.file}: expected owl:versionInfo "${spec.versionInfo}", found "${parsed.meta.versionInfo}"`);
  }
  const syntax = parsed.problems.filter((p) => p.rule === "syntax");
  if (syntax.length) throw new Error(`${spec.file}: ${syntax.map((p) => p.message).join("; ")}`);

  // Every problem the source raises about itself (not an invariant check() can re-run) must be
  // answered by a correction of that interval and field.
  const unanswered = parsed.problems.filter(
    (p) => p.rule === "source" && !spec.corrections.some((c) => c.interval === p.interval && c.field === p.field),
  );

  let corrections = spec.corrections;
  if (spec.kindsFrom) {
    const from = built.get(spec.kindsFrom.slug);
    if (!from) throw new Error(`${spec.file}: build ${spec.kindsFrom.slug} first (boundary kinds are carried over from it)`);
    const carried = carriedBoundaryKinds(
      applyCorrections(parsed.intervals, spec.corrections),
      from.intervals,
      from.edition.label,
      from.edition.sourceFile.split("/").pop()!,
      spec.kindsFrom.ratifiedSince,
    );
    corrections = [...spec.corrections, ...carried];
  }
  const intervals = applyCorrections(parsed.intervals, corrections);
  const remaining = check(intervals);
  if (remaining.length || unanswered.length) {
    const lines = [...unanswered, ...remaining].map((p) => `  ${p.interval} ${p.field} [${p.rule}]: ${p.message}`);
    throw new Error(`${spec.file}: problems remain after corrections:\n${lines.join("\n")}`);
  }
  const edition: Edition = {
    edition: {
      ...spec.meta,
      sourceFile: relative(repoRoot, path).split("\\").join("/"),
      corrections,
    },
    intervals,
  };
  return { edition, rawProblemCount: parsed.problems.length };
}

function main() {
  let failed = false;
  const built = new Map<string, Edition>();
  for (const spec of EDITIONS) {
    try {
      const { edition, rawProblemCount } = buildEdition(spec, built);
      built.set(edition.edition.slug, edition);
      const out = join(here, spec.out);
      writeFileSync(out, JSON.stringify(edition, null, 2) + "\n");
      console.log(
        `${spec.out}: ${edition.intervals.length} intervals; ${rawProblemCount} problems in the source, ${edition.edition.corrections.length} corrections applied, check() clean`,
      );
    } catch (err) {
      failed = true;
      console.error((err as Error).message);
    }
  }
  if (failed) process.exit(1);
}

const invokedDirectly = process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1];
if (invokedDirectly) main();
