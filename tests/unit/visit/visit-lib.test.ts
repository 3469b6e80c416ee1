// The pure parts of the visitor pages: language negotiation (RFC 9110 §12.5.4 q-values), the
// interface translation files, walking times (FHWA-RD-98-107 1.2 m/s; MUTCD §4E.06 0.9 m/s), the
// route map's line simplification on a 10⁵-vertex track, and the strip's bands.
import { describe, expect, it } from "vitest";
import de from "../../../app/locales/de.json";
import en from "../../../app/locales/en.json";
import { geodesicDirect } from "../../../app/lib/geo/geodesic.ts";
import { prepareRoute } from "../../../app/lib/geo/route.ts";
import { contrastRatio } from "../../../app/lib/chart/colour.ts";
import { matchTag, negotiateLanguage, parseAcceptLanguage } from "../../../app/lib/visit/language.ts";
import { fill, interfaceLanguage, messagesFor } from "../../../app/lib/visit/messages.ts";
import { localFrame, nearestData, routeMapModel, simplifyTrack, toLocal } from "../../../app/lib/visit/route-map.ts";
import { durationText, walkSeconds } from "../../../app/lib/visit/walking.ts";

const CHART = ["az", "ca", "cs", "de", "en", "es", "es-a", "eu", "fi", "fr", "hu", "id", "it", "ja", "ko", "lt", "nl", "nl-be", "no", "pl", "pt", "pt-br", "ru", "sk", "tr", "zh"];

describe("language negotiation", () => {
  it("reads q-values, best first, ties in the order given; q=0 means not wanted", () => {
    expect(parseAcceptLanguage("fr-CH, fr;q=0.9, en;q=0.8, de;q=0.7, *;q=0.5")).toEqual([
      { tag: "fr-ch", q: 1 },
      { tag: "fr", q: 0.9 },
      { tag: "en", q: 0.8 },
      { tag: "de", q: 0.7 },
      { tag: "*", q: 0.5 },
    ]);
    expect(parseAcceptLanguage("de;q=0, en")).toEqual([{ tag: "en", q: 1 }]);
    expect(parseAcceptLanguage("<script>, en;q=bad")).toEqual([{ tag: "en", q: 1 }]);
  });

  it("a tag matches itself, then its primary subtag", () => {
    expect(matchTag("pt-BR", CHART)).toBe("pt-br");
    expect(matchTag("pt-PT", CHART)).toBe("pt");
    expect(matchTag("de-AT", CHART)).toBe("de");
    expect(matchTag("gsw", CHART)).toBeNull();
  });

  it("?lang= first, then Accept-Language, then English", () => {
    expect(negotiateLanguage("fr", "de", CHART)).toBe("fr");
    expect(negotiateLanguage("xx", "nl-BE,nl;q=0.8", CHART)).toBe("nl-be");
    expect(negotiateLanguage(null, "gsw, de;q=0.8", CHART)).toBe("de");
    expect(negotiateLanguage(null, "tlh", CHART)).toBe("en");
    expect(negotiateLanguage(null, null, ["en"])).toBe("en");
  });
});

describe("interface words", () => {
  it("German has every English key, no placeholder English lacks, and no empty text", () => {
    expect(Object.keys(de).sort()).toEqual(Object.keys(en).sort());
    const holes = (s: string) => [...s.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort();
    for (const key of Object.keys(en) as (keyof typeof en)[]) {
      for (const hole of holes(de[key])) expect(holes(en[key]), key).toContain(hole);
      expect(de[key].trim(), key).not.toBe("");
    }
  });

  it("a chart language without a translation file keeps English words", () => {
    expect(interfaceLanguage("fr")).toBe("en");
    expect(interfaceLanguage("de")).toBe("de");
    expect(messagesFor("ja").markersHeading).toBe("Markers along the way");
    expect(fill("{a} and {b}", { a: 1 })).toBe("1 and {b}");
  });
});

describe("walking times", () => {
  const t = messagesFor("en");
  it("1.2 m/s design speed (FHWA-RD-98-107) and 0.9 m/s slower walkers (MUTCD §4E.06)", () => {
    expect(walkSeconds(4567, 1.2)).toBeCloseTo(3805.8, 1); // the demo route: 63.4 min
    expect(walkSeconds(4567, 0.9)).toBeCloseTo(5074.4, 1); // 84.6 min
    expect(durationText(walkSeconds(4567, 1.2), t)).toBe("1 h 3 min");
    expect(durationText(walkSeconds(4567, 0.9), t)).toBe("1 h 25 min");
    expect(durationText(0, t)).toBe("0 min");
    expect(durationText(20, t)).toBe("under 1 min");
    expect(durationText(walkSeconds(536, 1.2), t)).toBe("7 min");
    expect(durationText(walkSeconds(4567, 0.9), messagesFor("de"))).toBe("1 Std. 25 Min.");
    expect(() => walkSeconds(10, 0)).toThrow(RangeError);
  });
});

/**
 * A winding riverside track of n vertices from (lon, lat), `step` m apart (made with the geodesic
 * direct problem), with bends every few hundred metres and ±2 cm of GPS-like jitter.
 */
function track(n: number, step = 0.05): number[][] {
  const out: number[][] = [[-2.9876, 54.4321]];
  let azi = 60;
  for (let i = 1; i < n; i++) {
    azi += (Math.sin((i * step) / 150) * step) / 4 + Math.sin(i * 12.9898) * 0.02;
    const [lon, lat] = out[i - 1];
    const d = geodesicDirect(lat, lon, azi, step);
    out.push([d.lon2, d.lat2]);
  }
  return out;
}

describe("route map and nearest-marker data", () => {
  it("a 10⁵-vertex track is simplified to what a 400-unit drawing shows, within half a unit of the track", () => {
    const coords = track(100_000);
    const map = routeMapModel(coords, [{ signNumber: 1, label: "a", lon: coords[0][0], lat: coords[0][1] }]);
    expect(map.vertexCount).toBe(100_000);
    expect(map.drawnCount).toBeLessThan(1_000);
    // Every dropped vertex lies within the tolerance of the kept line (checked in local metres).
    const frame = localFrame(coords);
    const scale = (map.width - 36) / 5000; // at least: the track spans under 5 km
    const kept = simplifyTrack(coords, frame, 0.5 / scale);
    let worst = 0;
    for (let k = 0; k + 1 < kept.length; k++) {
      const a = kept[k], b = kept[k + 1];
      for (let i = a.i + 1; i < b.i; i++) {
        const [x, y] = toLocal(frame, coords[i][0], coords[i][1]);
        const dx = b.x - a.x, dy = b.y - a.y;
        const u = Math.max(0, Math.min(1, ((x - a.x) * dx + (y - a.y) * dy) / (dx * dx + dy * dy || 1)));
        worst = Math.max(worst, Math.hypot(x - (a.x + u * dx), y - (a.y + u * dy)));
      }
    }
    expect(worst).toBeLessThanOrEqual(0.5 / scale + 1e-9);
    expect(map.path.startsWith("M")).toBe(true);
  });

  it("the nearest-marker track keeps distances along the full track (not the simplified one)", () => {
    const coords = track(20_000, 0.25);
    const full = prepareRoute(coords.flatMap(([lon, lat]) => [lon, lat]));
    const data = nearestData(coords, [{ signNumber: 7, label: "x", alongMetres: 1234.5, url: "/v/7" }]);
    const along = data.track.filter((_, k) => k % 3 === 2);
    expect(along[0]).toBe(0);
    expect(along.at(-1)).toBeCloseTo(full.totalMetres, 0);
    expect(data.track.length / 3).toBeLessThan(coords.length);
    expect(data.markers).toEqual([[7, 1234.5, "x", "/v/7"]]);
    // The local frame's metres per degree against the geodesic: 100 m east and north of the centre.
    const east = geodesicDirect(data.frame.lat0, data.frame.lon0, 90, 100);
    const north = geodesicDirect(data.frame.lat0, data.frame.lon0, 0, 100);
    expect((east.lon2 - data.frame.lon0) * data.frame.kx).toBeCloseTo(100, 0);
    expect((north.lat2 - data.frame.lat0) * data.frame.ky).toBeCloseTo(100, 0);
  });

  it("markers that would cover a numbered neighbour are drawn as dots", () => {
    const coords = track(2_000, 2);
    const at = (i: number, n: number) => ({ signNumber: n, label: String(n), lon: coords[i][0], lat: coords[i][1] });
    const map = routeMapModel(coords, [at(0, 1), at(1, 2), at(1_500, 3)]);
    expect(map.markers.map((m) => m.numbered)).toEqual([true, false, true]);
  });
});

describe("chart colours", () => {
  it("black or white text on every standard colour of the demo strip reaches 4.5:1 (WCAG 2.2 1.4.3)", async () => {
    const { textOn } = await import("../../../app/lib/chart/colour.ts");
    for (const c of ["#AE027E", "#F0047F", "#F73563", "#9AD9DD", "#009270", "#F2F91D", "#FFF2AE"]) expect(contrastRatio(c, textOn(c))).toBeGreaterThanOrEqual(4.5);
  });
});
