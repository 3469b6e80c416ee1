/**
 * Image benchmark: `npm run bench:media` (npx tsx tests/bench/media.bench.ts).
 *
 * A 24-megapixel JPEG (6000 × 4000, a drawing overlaid with photographic grain) carrying EXIF GPS
 * is made here with sharp. A fresh worker process (sharp concurrency 1, as on a shared server) then
 * runs the processing job's own functions: the web sizes (WebP + JPEG at 480, 960, 1600 px) and the
 * full-resolution print master; it reports the wall time of each and its peak RSS. The AVIF job is
 * timed apart, in a second fresh process. Every output is checked for EXIF (none allowed).
 * Targets on the 2-core machine: web sizes ≤ 2.5 s, worker peak RSS ≤ 400 MB. The last line is JSON.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

const here = fileURLToPath(import.meta.url);

interface WorkerReport {
  webSizesMs?: number;
  printMasterMs?: number;
  avifMs?: number;
  outputs: { file: string; width: number; height: number; bytes: number; exif: boolean; gps: boolean }[];
  peakRssMb: number;
}

async function worker(file: string, mode: "web" | "avif"): Promise<WorkerReport> {
  process.env.SHARP_CONCURRENCY = "1";
  const { makeAvifFiles, makePrintMaster, makeWebFiles } = await import("../../server/assets/process.server.ts");
  const sharp = (await import("sharp")).default;
  const { hasExifBlock, hasGps } = await import("../helpers/images.ts");
  const original = new Uint8Array(readFileSync(file));
  const report: WorkerReport = { outputs: [], peakRssMb: 0 };
  const made = [];
  if (mode === "web") {
    let t = performance.now();
    made.push(...(await makeWebFiles(original)));
    report.webSizesMs = Math.round(performance.now() - t);
    t = performance.now();
    made.push(await makePrintMaster(original));
    report.printMasterMs = Math.round(performance.now() - t);
  } else {
    const t = performance.now();
    made.push(...(await makeAvifFiles(original)));
    report.avifMs = Math.round(performance.now() - t);
  }
  report.peakRssMb = Math.round(process.resourceUsage().maxRSS / 1024);
  for (const f of made) {
    const meta = await sharp(f.bytes).metadata();
    report.outputs.push({ file: f.file, width: f.width, height: f.height, bytes: f.bytes.byteLength, exif: Boolean(meta.exif), gps: hasGps(meta.exif) || hasExifBlock(f.bytes) });
  }
  return report;
}

function runWorker(file: string, mode: "web" | "avif"): WorkerReport {
  const out = execFileSync(process.execPath, ["--import", "tsx", here, "--worker", mode, file], { encoding: "utf8", env: { ...process.env, SHARP_CONCURRENCY: "1" }, maxBuffer: 1 << 20 });
  return JSON.parse(out.trim().split("\n").pop()!);
}

async function main() {
  const { hasExifBlock, jpegWithGps, hasGps } = await import("../helpers/images.ts");
  const sharp = (await import("sharp")).default;
  const dir = mkdtempSync(path.join(tmpdir(), "eonscale-media-bench-"));
  try {
    const original = await jpegWithGps(6000, 4000, { noise: true });
    const meta = await sharp(original).metadata();
    if (!hasGps(meta.exif) || !hasExifBlock(original)) throw new Error("the benchmark image lacks EXIF GPS");
    const file = path.join(dir, "site-24mp.jpg");
    writeFileSync(file, original);
    console.log(`input: ${meta.width} × ${meta.height} JPEG, ${(original.byteLength / 1048576).toFixed(1)} MB, EXIF GPS present`);

    const web = runWorker(file, "web");
    const avif = runWorker(file, "avif");
    for (const o of [...web.outputs, ...avif.outputs]) console.log(`  ${o.file.padEnd(10)} ${String(o.width).padStart(5)} × ${String(o.height).padEnd(5)} ${(o.bytes / 1024).toFixed(0).padStart(7)} KB  exif: ${o.exif ? "YES" : "none"}`);
    const outputs = [...web.outputs, ...avif.outputs];
    const result = {
      benchmark: "media",
      input: { width: meta.width, height: meta.height, megapixels: Math.round(((meta.width ?? 0) * (meta.height ?? 0)) / 1e5) / 10, bytes: original.byteLength, exifGps: true },
      sharpConcurrency: 1,
      webSizesMs: web.webSizesMs,
      printMasterMs: web.printMasterMs,
      webAndPrintMs: (web.webSizesMs ?? 0) + (web.printMasterMs ?? 0),
      workerPeakRssMb: web.peakRssMb,
      avifMs: avif.avifMs,
      avifWorkerPeakRssMb: avif.peakRssMb,
      outputs: outputs.length,
      outputsWithExif: outputs.filter((o) => o.exif).length,
      outputsWithGps: outputs.filter((o) => o.gps).length,
      targets: { webSizesMs: 2500, workerPeakRssMb: 400 },
      withinTargets: (web.webSizesMs ?? Infinity) <= 2500 && web.peakRssMb <= 400 && outputs.every((o) => !o.gps),
    };
    console.log(JSON.stringify(result));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const at = process.argv.indexOf("--worker");
if (at > 0) {
  const report = await worker(process.argv[at + 2], process.argv[at + 1] as "web" | "avif");
  console.log(JSON.stringify(report));
} else {
  await main();
}
