// Reading the ICS chart's own linked-data publication (RDF Turtle, SKOS) into intervals.
// Uses n3 (Parser + Store), which runs in the browser and in Node.
//
// How the file encodes what we need (both the 2023/09 and 2024/12 files):
//   interval          a skos:Concept with gts:rank
//   rank              gts:rank rank:Eon | Era | Period | Sub-Period | Epoch | Age; a concept
//                     with several ranks gets the shallowest (the Pridoli is rank:Epoch and
//                     rank:Age, a series not divided into stages → epoch)
//                     (rank:Super-Eon, i.e. "Precambrian", is not one of our six ranks: it is
//                     left out and listed in `excluded`; its eons become roots)
//   parent            skos:broader (skos:narrower is the inverse and is cross-checked)
//   base / top        time:hasBeginning / time:hasEnd → a blank node with
//                       ischart:inMYA        the age in Ma (also for the Holocene)
//                       schema:marginOfError the ± in Ma, where the chart gives one
//                       skos:note "uncertain" the chart's "~" (approximate age)
//   colour            schema:color "#RRGGBB"
//   GSSP / GSSA       gts:ratifiedGSSP true / gts:ratifiedGSSA true (only "true" is ever
//                     written; a file with no such triple at all gives gssp = null).
//                     gssp = either; boundaryKind = "GSSA" or "GSSP" as marked; a concept
//                     marked both gets boundaryKind null and a "source" problem (the 2024/12
//                     file marks the Neoproterozoic both ways)
//   names             skos:prefLabel@lang (2024/12); skos:prefLabel@en + skos:altLabel@lang
//                     (2023/09). The English label is the name; where the file has none, the
//                     IRI local name is used and a "source" problem says so.
// The file's sh:order is not used: `order` is recomputed in chart order (see order.ts).

import { Parser, Store, DataFactory, type Quad_Object, type Term } from "n3";
import { check } from "./check";
import { fmtMa, sameMa } from "./numbers";
import { chartOrderIndex } from "./order";
import { rankDepth, type Interval, type ParseResult, type Problem, type Rank } from "./types";

const { namedNode } = DataFactory;

const RDF_TYPE = "http://www.w3.org/1999/02/22-rdf-syntax-ns#type";
const SKOS = "http://www.w3.org/2004/02/skos/core#";
const GTS = "http://resource.geosciml.org/ontology/timescale/gts#";
const RANK_NS = "http://resource.geosciml.org/ontology/timescale/rank/";
const TIME = "http://www.w3.org/2006/time#";
const ISCHART = "http://resource.geosciml.org/classifier/ics/ischart/";
const SCHEMA = "https://schema.org/";
const DCT = "http://purl.org/dc/terms/";
const OWL = "http://www.w3.org/2002/07/owl#";

const RANK_MAP: Record<string, Rank> = {
  Eon: "eon",
  Era: "era",
  Period: "period",
  "Sub-Period": "subperiod",
  Epoch: "epoch",
  Age: "age",
};

export interface TurtleMeta {
  /** owl:versionInfo of the concept scheme, e.g. "2024-12". */
  versionInfo: string | null;
  /** dcterms:modified */
  modified: string | null;
  /** schema:license IRI */
  license: string | null;
  /** schema:copyrightNotice */
  copyrightNotice: string | null;
}

export interface TurtleExclusion {
  iri: string;
  name: string;
  rank: string;
  reason: string;
}

export interface TurtleParseResult extends ParseResult {
  meta: TurtleMeta;
  /** Concepts not imported (e.g. the Precambrian super-eon). */
  excluded: TurtleExclusion[];
  /** Source line of each returned interval (same index), 1-based. */
  lines: number[];
  /** IRI of each returned interval (same index). */
  iris: string[];
}

export interface TurtleOptions {
  /** Run check() on the intervals read and add its problems (default true). */
  check?: boolean;
}

export function parseTurtle(text: string, options: TurtleOptions = {}): TurtleParseResult {
  const empty: TurtleParseResult = {
    intervals: [],
    problems: [],
    meta: { versionInfo: null, modified: null, license: null, copyrightNotice: null },
    excluded: [],
    lines: [],
    iris: [],
  };
  let store: Store;
  try {
    store = new Store(new Parser().parse(text));
  } catch (err) {
    const e = err as Error & { context?: { line?: number } };
    const p: Problem = { interval: "", field: "turtle", message: `cannot read Turtle: ${e.message}`, rule: "syntax" };
    if (typeof e.context?.line === "number") p.line = e.context.line;
    return { ...empty, problems: [p] };
  }

  const subjectLines = subjectLineIndex(text);
  const objects = (s: Term, p: string) => store.getObjects(s, namedNode(p), null);
  const first = (s: Term, p: string): Quad_Object | undefined => objects(s, p)[0];
  const localName = (iri: string) => iri.replace(/^.*[/#]/, "");
  const problems: Problem[] = [];

  // Concept scheme metadata.
  const meta = { ...empty.meta };
  const scheme = store.getSubjects(namedNode(RDF_TYPE), namedNode(SKOS + "ConceptScheme"), null)[0];
  if (scheme) {
    meta.versionInfo = first(scheme, OWL + "versionInfo")?.value ?? null;
    meta.modified = first(scheme, DCT + "modified")?.value ?? null;
    meta.license = first(scheme, SCHEMA + "license")?.value ?? null;
    meta.copyrightNotice = first(scheme, SCHEMA + "copyrightNotice")?.value ?? null;
  }

  const hasRatification =
    store.countQuads(null, namedNode(GTS + "ratifiedGSSP"), null, null) +
      store.countQuads(null, namedNode(GTS + "ratifiedGSSA"), null, null) >
    0;

  const concepts = store
    .getSubjects(namedNode(RDF_TYPE), namedNode(SKOS + "Concept"), null)
    .filter((c) => c.termType === "NamedNode");
  const excluded: TurtleExclusion[] = [];
  const excludedIris = new Set<string>();
  const included: Term[] = [];
  const rankOf = (c: Term): { rank: Rank | undefined; rankIri: string } => {
    // A concept may carry several ranks: the Pridoli is both rank:Epoch and rank:Age (a series
    // not divided into stages). The shallowest of our ranks is taken (Pridoli → epoch).
    const iris = objects(c, GTS + "rank").map((o) => o.value);
    const known = iris
      .map((i) => RANK_MAP[i.startsWith(RANK_NS) ? i.slice(RANK_NS.length) : ""])
      .filter((r): r is Rank => r !== undefined)
      .sort((a, b) => rankDepth(a) - rankDepth(b));
    return { rank: known[0], rankIri: iris[0] ?? "" };
  };
  for (const c of concepts) {
    const { rank, rankIri } = rankOf(c);
    if (!rank) {
      excluded.push({
        iri: c.value,
        name: englishLabel(store, c) ?? localName(c.value),
        rank: rankIri ? localName(rankIri) : "(none)",
        reason: rankIri
          ? `rank ${localName(rankIri)} is not one of eon, era, period, subperiod, epoch, age`
          : "concept has no gts:rank",
      });
      excludedIris.add(c.value);
    } else {
      included.push(c);
    }
  }

  interface Raw {
    iv: Interval;
    iri: string;
    line: number;
    endUncertainty: number | null;
    endApproximate: boolean;
  }
  const raws: Raw[] = [];
  const nameOfIri = new Map<string, string>();

  for (const c of included) {
    const iri = c.value;
    const line = subjectLines.get(iri) ?? 0;
    const en = englishLabel(store, c);
    const name = en ?? localName(iri);
    if (en === null) {
      problems.push({
        interval: name,
        field: "name",
        message: `no English skos:prefLabel for <${iri}>; named by its IRI local name "${name}"`,
        rule: "source",
        line,
      });
    }
    nameOfIri.set(iri, name);
  }

  for (const c of included) {
    const iri = c.value;
    const name = nameOfIri.get(iri)!;
    const line = subjectLines.get(iri) ?? 0;
    const srcProblem = (field: string, message: string) =>
      problems.push({ interval: name, field, message, rule: "source", line });

    const rank = rankOf(c).rank!;

    const broader = objects(c, SKOS + "broader").map((o) => o.value);
    if (broader.length > 1) srcProblem("parent", `has ${broader.length} skos:broader parents (${broader.map(localName).join(", ")}); the first is used`);
    let parent: string | null = null;
    if (broader.length > 0) {
      const b = broader[0];
      if (excludedIris.has(b)) parent = null; // e.g. the Precambrian super-eon
      else parent = nameOfIri.get(b) ?? localName(b);
    }

    const position = (pred: string, which: "base" | "top") => {
      const node = first(c, TIME + pred);
      if (!node) {
        srcProblem(which === "base" ? "baseMa" : "topMa", `has no time:${pred}`);
        return { ma: Number.NaN, uncertainty: null, approximate: false };
      }
      const lit = first(node, ISCHART + "inMYA");
      const ma = lit ? Number(lit.value) : Number.NaN;
      if (!lit || !Number.isFinite(ma)) srcProblem(which === "base" ? "baseMa" : "topMa", `time:${pred} has no numeric ischart:inMYA`);
      const moe = first(node, SCHEMA + "marginOfError");
      const uncertainty = moe ? Number(moe.value) : null;
      const approximate = objects(node, SKOS + "note").some((n) => n.value.trim().toLowerCase() === "uncertain");
      return { ma, uncertainty, approximate };
    };
    const base = position("hasBeginning", "base");
    const top = position("hasEnd", "top");

    const color = first(c, SCHEMA + "color")?.value ?? "";
    const isTrue = (p: string) => objects(c, GTS + p).some((o) => o.value === "true" || o.value === "1");
    const gssp = hasRatification ? isTrue("ratifiedGSSP") || isTrue("ratifiedGSSA") : null;
    const markedGssp = isTrue("ratifiedGSSP");
    const markedGssa = isTrue("ratifiedGSSA");
    if (markedGssp && markedGssa) srcProblem("boundaryKind", "is marked both gts:ratifiedGSSP and gts:ratifiedGSSA; the boundary kind is left unstated");
    const boundaryKind: Interval["boundaryKind"] = markedGssp && markedGssa ? null : markedGssa ? "GSSA" : markedGssp ? "GSSP" : null;

    const names: Record<string, string> = {};
    const pref = objects(c, SKOS + "prefLabel").filter((o) => o.termType === "Literal" && (o as { language: string }).language);
    const alt = objects(c, SKOS + "altLabel").filter((o) => o.termType === "Literal" && (o as { language: string }).language);
    for (const o of [...alt, ...pref]) names[(o as { language: string }).language] = o.value; // prefLabel wins
    const sortedNames: Record<string, string> = {};
    for (const k of Object.keys(names).sort()) sortedNames[k] = names[k];

    raws.push({
      iv: {
        name,
        rank,
        parent,
        baseMa: base.ma,
        baseUncertaintyMa: base.uncertainty,
        topMa: top.ma,
        color,
        gssp,
        boundaryKind,
        approximate: base.approximate,
        names: sortedNames,
        order: 0,
      },
      iri,
      line,
      endUncertainty: top.uncertainty,
      endApproximate: top.approximate,
    });
  }

  // skos:narrower must be the inverse of skos:broader. Reported on the child, whose parent is
  // in question (the parent is read from skos:broader).
  const includedIris = new Set(included.map((c) => c.value));
  const lineOfIri = (iri: string) => subjectLines.get(iri) ?? 0;
  for (const c of included) {
    const parentName = nameOfIri.get(c.value)!;
    const narrower = new Set(objects(c, SKOS + "narrower").map((o) => o.value).filter((i) => includedIris.has(i)));
    const viaBroader = new Set(
      store.getSubjects(namedNode(SKOS + "broader"), c, null).map((s) => s.value).filter((i) => includedIris.has(i)),
    );
    for (const n of narrower) {
      if (!viaBroader.has(n)) {
        problems.push({ interval: nameOfIri.get(n)!, field: "parent", rule: "source", line: lineOfIri(n), message: `is listed as skos:narrower of "${parentName}", but its skos:broader does not name "${parentName}"` });
      }
    }
    for (const n of viaBroader) {
      if (!narrower.has(n)) {
        problems.push({ interval: nameOfIri.get(n)!, field: "parent", rule: "source", line: lineOfIri(n), message: `names "${parentName}" as skos:broader, but "${parentName}" does not list it as skos:narrower` });
      }
    }
  }

  // The top of an interval is the base of the next younger one: both ends of one boundary must
  // carry the same ± and "~" (the Interval keeps only the base's).
  const byBase = new Map<string, Raw[]>();
  for (const r of raws) {
    if (!Number.isFinite(r.iv.baseMa)) continue;
    const k = fmtMa(r.iv.baseMa);
    const list = byBase.get(k);
    if (list) list.push(r);
    else byBase.set(k, [r]);
  }
  for (const r of raws) {
    if (!Number.isFinite(r.iv.topMa)) continue;
    const starting = byBase.get(fmtMa(r.iv.topMa)) ?? [];
    const disagree = starting.filter(
      (s) =>
        s.iv.approximate !== r.endApproximate ||
        (s.iv.baseUncertaintyMa === null) !== (r.endUncertainty === null) ||
        (s.iv.baseUncertaintyMa !== null && r.endUncertainty !== null && !sameMa(s.iv.baseUncertaintyMa, r.endUncertainty)),
    );
    if (disagree.length > 0 && disagree.length === starting.length) {
      const s = disagree[0];
      const describe = (u: number | null, approx: boolean) => `${approx ? "~" : ""}${fmtMa(r.iv.topMa)}${u === null ? "" : ` ± ${fmtMa(u)}`} Ma`;
      problems.push({
        interval: r.iv.name,
        field: "topMa",
        rule: "source",
        line: r.line,
        message: `top is written ${describe(r.endUncertainty, r.endApproximate)} but the base of "${s.iv.name}" at the same age is ${describe(s.iv.baseUncertaintyMa, s.iv.approximate)}`,
      });
    }
  }

  // Chart order, then check().
  const index = chartOrderIndex(raws.map((r) => r.iv));
  const ordered = index.map((idx, i) => ({ ...raws[idx].iv, order: i + 1 }));
  const lines = index.map((idx) => raws[idx].line);
  const iris = index.map((idx) => raws[idx].iri);

  if (options.check !== false) problems.push(...check(ordered, { lines }));
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0));

  return { intervals: ordered, problems, meta, excluded, lines, iris };
}

function englishLabel(store: Store, c: Term): string | null {
  const labels = store.getObjects(c, namedNode(SKOS + "prefLabel"), null).filter((o) => o.termType === "Literal");
  const lang = (o: Quad_Object) => (o as { language: string }).language.toLowerCase();
  const en = labels.find((o) => lang(o) === "en") ?? labels.find((o) => lang(o).startsWith("en-"));
  return en ? en.value : null;
}

/** Map subject IRI → 1-based line where its description starts (a line beginning with the subject). */
function subjectLineIndex(text: string): Map<string, number> {
  const prefixes = new Map<string, string>();
  const out = new Map<string, number>();
  const lines = text.split(/\r\n|\n|\r/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i];
    const pm = /^\s*(?:@prefix|PREFIX)\s+([A-Za-z][\w.-]*)?:\s*<([^>]*)>/i.exec(line);
    if (pm) {
      prefixes.set(pm[1] ?? "", pm[2]);
      continue;
    }
    if (/^\s/.test(line) || line === "") continue;
    const m = /^(<[^>]*>|[A-Za-z][\w.-]*:[^\s;,.]*|:[^\s;,.]*)/.exec(line);
    if (!m) continue;
    const tok = m[1];
    let iri: string | undefined;
    if (tok.startsWith("<")) iri = tok.slice(1, -1);
    else {
      const idx = tok.indexOf(":");
      const ns = prefixes.get(tok.slice(0, idx));
      if (ns !== undefined) iri = ns + tok.slice(idx + 1);
    }
    if (iri && !out.has(iri)) out.set(iri, i + 1);
  }
  return out;
}
