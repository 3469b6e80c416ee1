// records.ts keeps one object of each shape of the per-marker records alive, so that a full
// collection with no result alive does not drop the code compiled for those shapes. That only works
// if the kept objects have the very shapes (V8 maps) of the real results: checked here in a Node
// process with V8's natives syntax, on a route exhibit and a length exhibit of the demo.
import { execFileSync } from "node:child_process";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "../../..");

const SCRIPT = `
const { computeExhibit, standardDurations } = await import(${JSON.stringify(path.join(ROOT, "app/lib/exhibit/index.ts"))});
const { keptShapes } = await import(${JSON.stringify(path.join(ROOT, "app/lib/scale/records.ts"))});
const { demoExhibits } = await import(${JSON.stringify(path.join(ROOT, "tests/unit/scale/demo-exhibits.ts"))});
const same = new Function("a", "b", "return %HaveSameMap(a, b)");
const kept = keptShapes();
const shared = (x) => kept.some((k) => same(k, x));
const seen = { points: 0, labels: 0, walking: 0, places: 0, unshared: [] };
for (const demo of demoExhibits()) {
  const r = computeExhibit(demo.spec, demo.markers, standardDurations(80));
  if (!r.ok) continue;
  for (const p of r.result.points) {
    for (const [what, x] of [["point", p], ["label", p.display], ["place", p.position], ["walking", p.walking]]) {
      if (x === undefined) continue;
      if (!shared(x)) seen.unshared.push(demo.slug + " " + what + " " + p.id);
    }
    seen.points++;
    if (p.walking) seen.walking++;
  }
}
console.log(JSON.stringify({ kept: kept.length, ...seen, unshared: seen.unshared.slice(0, 5), unsharedCount: seen.unshared.length }));
`;

describe("kept record shapes", () => {
  it("are the shapes of the demo exhibits' points, labels, places and walking figures", () => {
    const out = execFileSync(process.execPath, ["--allow-natives-syntax", "--import", "tsx", "--input-type=module", "-e", SCRIPT], { cwd: ROOT, encoding: "utf8" });
    const r = JSON.parse(out.trim().split("\n").pop()!);
    expect(r.kept).toBeGreaterThanOrEqual(8);
    expect(r.points).toBeGreaterThan(40);
    expect(r.walking).toBeGreaterThan(0); // a route exhibit among them
    expect(r.unshared, `${r.unsharedCount} objects of another shape`).toEqual([]);
  }, 30_000);
});
