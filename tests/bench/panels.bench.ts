/**
 * Print-panel benchmark: `npm run bench:panels` (npx tsx tests/bench/panels.bench.ts).
 *
 * The demo's 46 m rope drawn as a banner (4,567 million years, 1 cm per million years) is written
 * as panels.pdf at 600 mm panels, 500 mm high, 20 mm overlap and 3 mm bleed — 80 panels,
 * ⌈(46000 − 20) / 580⌉ — by the export job's own writer, streamed to a file, in a fresh worker
 * process that reads the snapshot as JSON (as the job reads it from its row). The baseline, measured in the same run by the same kind of fresh process, loads the same
 * modules, lays out the same strip and writes a document with no panel. Reported: wall time, pages
 * per second, peak RSS of each process and the ratios. Target: the worker stays under 150 MB RSS.
 * The last line is JSON.
 */
import { execFileSync } from "node:child_process";
import { createWriteStream, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { finished } from "node:stream/promises";
import { fileURLToPath } from "node:url";
import type { PublicationSnapshot } from "../../app/lib/publication/types.ts";

const here = fileURLToPath(import.meta.url);
const OPTIONS = { widthMm: 600, heightMm: 500, overlapMm: 20, bleedMm: 3 };

interface WorkerReport {
  mode: "panels" | "baseline";
  ms: number;
  pages: number;
  bytes: number;
  peakRssMb: number;
}

/** The worker reads the snapshot as JSON, as the export job reads it from its row. */
async function worker(mode: WorkerReport["mode"], out: string, snapshotFile: string): Promise<WorkerReport> {
  const { panelsDocument, writePanels } = await import("../../server/exports/pdf/panels.server.ts");
  const { tilePanels } = await import("../../app/lib/fabrication/panels.ts");
  const snapshot = JSON.parse(readFileSync(snapshotFile, "utf8")) as PublicationSnapshot;
  const ctx = { draft: false, publication: { number: 1, hash: "bench", publishedAt: "2026-12-04T00:00:00Z", approvedBy: null, edition: { slug: snapshot.edition.slug, label: snapshot.edition.label } }, baseUrl: "http://localhost" };
  const t = performance.now();
  const doc = panelsDocument(snapshot, ctx);
  const file = createWriteStream(out);
  doc.pipe(file);
  let pages = 0;
  if (mode === "panels") await writePanels(doc, snapshot, OPTIONS, ctx, (done) => void (pages = done));
  else doc.end();
  await finished(file);
  const ms = Math.round(performance.now() - t);
  if (mode === "panels" && pages !== tilePanels(snapshot.scale.totalMetres * 1000, OPTIONS).length) throw new Error("page count differs from the tiling");
  return { mode, ms, pages, bytes: statSync(out).size, peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024) };
}

function runWorker(mode: WorkerReport["mode"], out: string, snapshotFile: string): WorkerReport {
  const text = execFileSync(process.execPath, ["--import", "tsx", here, "--worker", mode, out, snapshotFile], { encoding: "utf8", maxBuffer: 1 << 20 });
  return JSON.parse(text.trim().split("\n").pop()!);
}

async function main() {
  const dir = mkdtempSync(path.join(tmpdir(), "eonscale-panels-bench-"));
  try {
    const { demoSnapshot } = await import("../helpers/demo-snapshots.ts");
    const snapshotFile = path.join(dir, "snapshot.json");
    writeFileSync(snapshotFile, JSON.stringify(demoSnapshot("school-rope", { mediumType: "banner" })));
    const baseline = runWorker("baseline", path.join(dir, "baseline.pdf"), snapshotFile);
    const panels = runWorker("panels", path.join(dir, "panels.pdf"), snapshotFile);
    console.log(`baseline (modules, strip layout, empty document): ${baseline.ms} ms, peak RSS ${baseline.peakRssMb} MB`);
    console.log(`panels.pdf: ${panels.pages} pages of ${OPTIONS.widthMm + 2 * OPTIONS.bleedMm} × ${OPTIONS.heightMm + 2 * OPTIONS.bleedMm} mm in ${panels.ms} ms (${((panels.pages * 1000) / panels.ms).toFixed(1)} pages/s), ${(panels.bytes / 1048576).toFixed(2)} MB, peak RSS ${panels.peakRssMb} MB`);
    console.log(`ratios to the baseline: time ×${(panels.ms / Math.max(1, baseline.ms)).toFixed(2)}, peak RSS ×${(panels.peakRssMb / baseline.peakRssMb).toFixed(2)} (+${panels.peakRssMb - baseline.peakRssMb} MB for 80 pages)`);
    const result = {
      benchmark: "panels",
      exhibit: "school-rope as a 46 m banner",
      options: OPTIONS,
      pages: panels.pages,
      bytes: panels.bytes,
      ms: panels.ms,
      pagesPerSecond: Number(((panels.pages * 1000) / panels.ms).toFixed(1)),
      workerPeakRssMb: panels.peakRssMb,
      baseline: { ms: baseline.ms, peakRssMb: baseline.peakRssMb },
      rssRatio: Number((panels.peakRssMb / baseline.peakRssMb).toFixed(2)),
      timeRatio: Number((panels.ms / Math.max(1, baseline.ms)).toFixed(2)),
      targets: { workerPeakRssMb: 150 },
      withinTargets: panels.peakRssMb < 150 && panels.pages === 80,
    };
    console.log(JSON.stringify(result));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const at = process.argv.indexOf("--worker");
if (at > 0) {
  const report = await worker(process.argv[at + 1] as WorkerReport["mode"], process.argv[at + 2], process.argv[at + 3]);
  console.log(JSON.stringify(report));
} else {
  await main();
}
