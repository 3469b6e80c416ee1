import { describe, expect, it } from "vitest";
import { formatCountTwoFigures, formatDuration } from "../../../app/lib/scale/format";
import { clean } from "../../../app/lib/units";
import { formatCountTwoFiguresCached, formatDurationCached, walkingAt, type WalkingSettings } from "../../../app/lib/scale/walking";

// walking.ts keeps the texts it has made (durations, counts and the parts of the walking sentence);
// every cached text must be the one format.ts writes.
let seed = 99;
const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;

/** The walking sentence as format.ts words it, part by part. */
function sentence(d: number, w: WalkingSettings): string {
  const steps = Math.round(d / w.stepLength);
  const upTo = Math.round(d / w.shortStep);
  const range = steps === upTo ? formatCountTwoFigures(steps) : `${formatCountTwoFigures(steps)}–${formatCountTwoFigures(upTo)}`;
  return `${formatDuration(d / w.walkingSpeed)} walk (${formatDuration(d / w.accessibleSpeed)} at ${w.speedText}), about ${range} steps`;
}

describe("cached walking texts", () => {
  it("formatDurationCached is formatDuration for every second up to 110 hours, every 7 s to 510 hours, around each rounding edge and far beyond", () => {
    const wrong: number[] = [];
    for (let s = 0; s < 110 * 3600; s += 1) {
      for (const x of [s, s + 0.5, s + 0.4999999]) if (formatDurationCached(x) !== formatDuration(x)) wrong.push(x);
    }
    expect(wrong).toEqual([]);
    // the table reaches 500 hours: every 7 s up to 510 h, and each side of its end
    for (let s = 110 * 3600; s < 510 * 3600; s += 7) if (formatDurationCached(s) !== formatDuration(s)) wrong.push(s);
    expect(wrong).toEqual([]);
    for (const s of [29.5, 59.49, 59.5, 59.99, 60, 89.99, 90, 3569.99, 3570, 359_970, 359_969.9, 1_799_969.9, 1_799_970, 1_800_000, 1e9, -0.3, -0, NaN, Infinity]) {
      expect(formatDurationCached(s), String(s)).toBe(formatDuration(s));
    }
  }, 30_000);

  it("formatCountTwoFiguresCached is formatCountTwoFigures for every count to 300,000 and random counts to 2^53", () => {
    const wrong: number[] = [];
    for (let n = 0; n <= 300_000; n++) if (formatCountTwoFiguresCached(n) !== formatCountTwoFigures(n)) wrong.push(n);
    for (let k = 0; k < 20_000; k++) {
      const n = Math.round(10 ** (16 * rand()));
      if (formatCountTwoFiguresCached(n) !== formatCountTwoFigures(n)) wrong.push(n);
    }
    expect(wrong).toEqual([]);
    // (both sides of each power of ten, where a count's slot changes its power, and of 2^31)
    for (const n of [995, 9950, 99_499, 99_500, 999_999_999, 1e9, 1e9 + 1, 2 ** 31 - 1, 2 ** 31, 2 ** 31 + 1, 9_999_999_999, 1e10, 2 ** 53 - 1, 2 ** 53, 1e20, -5, 0.5, 99.5]) expect(formatCountTwoFiguresCached(n), String(n)).toBe(formatCountTwoFigures(n));
  }, 60_000);

  it("walkingAt writes format.ts's sentence and the clean figures, whatever the settings and their order", () => {
    const settings: WalkingSettings[] = [
      { walkingSpeed: 1.2, accessibleSpeed: 0.9, stepLength: 0.76, shortStep: 0.66, speedText: "0.9 m/s" },
      { walkingSpeed: 1.2, accessibleSpeed: 0.9, stepLength: 0.76, shortStep: 0.66, speedText: "3 ft/s" },
      { walkingSpeed: 1.4, accessibleSpeed: 0.8, stepLength: 0.7, shortStep: 0.7, speedText: "0.8 m/s" },
      { walkingSpeed: 1.4, accessibleSpeed: 0.8, stepLength: 0.7, shortStep: 0.695, speedText: "0.8 m/s" },
    ];
    for (let k = 0; k < 30_000; k++) {
      const w = settings[k % settings.length];
      const d = 10 ** (7 * rand()) - 1;
      const got = walkingAt(d, w);
      const want = { distanceFromStartMetres: clean(d), seconds: clean(d / w.walkingSpeed), accessibleSeconds: clean(d / w.accessibleSpeed), steps: Math.round(d / w.stepLength), stepsUpTo: Math.round(d / w.shortStep), text: sentence(d, w) };
      if (JSON.stringify(got) !== JSON.stringify(want)) expect(got, `${d} m, settings ${k % settings.length}`).toEqual(want);
    }
  });

  it("keeps a range whose ends read alike apart from a single count", () => {
    const range = { walkingSpeed: 1.2, accessibleSpeed: 0.9, stepLength: 0.7, shortStep: 0.69, speedText: "0.9 m/s" };
    const one = { ...range, shortStep: 0.7 };
    for (let k = 0; k < 3; k++) {
      expect(walkingAt(1000, range).text).toBe("14 min walk (19 min at 0.9 m/s), about 1,400–1,400 steps"); // 1,429 and 1,449 steps
      expect(walkingAt(1000, one).text).toBe("14 min walk (19 min at 0.9 m/s), about 1,400 steps");
    }
  });

  it("words a 1 km walk", () => {
    const w = { walkingSpeed: 1.2, accessibleSpeed: 0.9, stepLength: 0.76, shortStep: 0.66, speedText: "0.9 m/s" };
    // 833 s ≈ 14 min, 1,111 s ≈ 19 min, 1,316 and 1,515 steps to two figures
    expect(walkingAt(1000, w).text).toBe("14 min walk (19 min at 0.9 m/s), about 1,300–1,500 steps");
    expect(walkingAt(10, w).text).toBe("8 s walk (11 s at 0.9 m/s), about 13–15 steps");
    expect(walkingAt(10_000, { ...w, stepLength: 0.7, shortStep: 0.7 }).text).toBe("2 h 19 min walk (3 h 05 min at 0.9 m/s), about 14,000 steps");
  });
});

describe("the walking sentence's kept halves", () => {
  it("stay right for many speeds, step lengths and distances (speed tables dropped past eight, entries taken over by other pairs on the way)", async () => {
    const { walkingAt: at } = await import("../../../app/lib/scale/walking");
    const { formatCountTwoFigures: count, formatDuration: dur } = await import("../../../app/lib/scale/format");
    for (let s = 0; s < 20; s++) {
      // two step ranges and two slow speeds take turns: a kept half's first slot meets other second slots
      const w = { walkingSpeed: 1 + s / 10, accessibleSpeed: 0.5 + s / 20, stepLength: s % 2 ? 0.76 : 0.8, shortStep: s % 2 ? 0.66 : 0.5, speedText: `${0.5 + (s % 10) / 20} m/s` };
      for (let k = 0; k < 3000; k++) {
        const d = k * 37.3 + s;
        const steps = Math.round(d / w.stepLength);
        const upTo = Math.round(d / w.shortStep);
        const range = steps === upTo ? count(steps) : `${count(steps)}–${count(upTo)}`;
        const want = `${dur(d / w.walkingSpeed)} walk (${dur(d / w.accessibleSpeed)} at ${w.speedText}), about ${range} steps`;
        if (at(d, w).text !== want) expect(at(d, w).text, `${d} m at speed set ${s}`).toBe(want);
      }
    }
  });
});
