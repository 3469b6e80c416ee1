// Visitor pages from the seeded publication (marrowby / riverside-walk, publication 1): the figures
// on the pages equal the snapshot's, drafts and unknown addresses are 404, language negotiation
// (?lang=, Accept-Language, the chart's own interval translations), QR codes decode to the marker's
// absolute URL with level Q and a 4-module quiet zone, and the HTTP layer (ETag from hash +
// language + build, 304 before rendering, same bytes, Vary, no Set-Cookie, framing only for embed).
import { once } from "node:events";
import type { AddressInfo } from "node:net";
import express from "express";
import jsQR from "jsqr";
import { QueryTypes } from "sequelize";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as exhibitRoute from "../../app/routes/visit.$org.$slug.tsx";
import * as markerRoute from "../../app/routes/visit.$org.$slug.$number.tsx";
import * as embedRoute from "../../app/routes/visit.$org.$slug.embed.tsx";
import * as qrPng from "../../app/routes/visit.$org.$slug.$number.qr-png.ts";
import * as qrSvg from "../../app/routes/visit.$org.$slug.$number.qr-svg.ts";
import type { PublicationSnapshot } from "../../app/lib/publication/types.ts";
import { sequelize } from "../../server/db.server.ts";
import { forgetVisitPages, visitorPages } from "../../server/visit/http.server.ts";
import { settle } from "../helpers/db.ts";

const ORG = "marrowby";
const SLUG = "riverside-walk";
let snapshot: PublicationSnapshot;
let sha256: string;

const req = (path: string, headers: Record<string, string> = {}) => new Request(new URL(path, "http://test.local"), { headers });
const args = (path: string, params: Record<string, string>, headers: Record<string, string> = {}) => ({ request: req(path, headers), params, context: {} }) as never;

beforeAll(async () => {
  const [row] = await sequelize.query<{ snapshot_canonical: string; sha256: string }>(
    `SELECT p.snapshot_canonical, p.sha256 FROM publications p JOIN exhibits e ON e.id = p.exhibit_id JOIN organisations o ON o.id = e.organisation_id
      WHERE o.slug = $1 AND e.slug = $2 ORDER BY p.number DESC LIMIT 1`,
    { bind: [ORG, SLUG], type: QueryTypes.SELECT },
  );
  snapshot = JSON.parse(row.snapshot_canonical);
  sha256 = row.sha256;
});

type ExhibitData = Awaited<ReturnType<typeof exhibitRoute.loader>>;

describe("exhibit and marker pages read the latest publication", () => {
  it("the exhibit page lists every marker of the snapshot with its sign number, age, distance, ± and walking times", async () => {
    const data = (await exhibitRoute.loader(args(`/visit/${ORG}/${SLUG}`, { org: ORG, slug: SLUG }))) as ExhibitData;
    const { view } = data;
    expect(view.rows.length).toBe(snapshot.markers.length);
    expect(view.rows.length).toBeGreaterThanOrEqual(40);
    snapshot.markers.forEach((m, i) => {
      const r = view.rows[i];
      expect(r.signNumber).toBe(m.signNumber);
      expect(r.ageText).toBe(m.ageText);
      expect(r.distance).toBe(m.distance.display.fromOlderEnd);
      expect(r.uncertainty).toBe(m.distance.display.uncertainty);
      expect(r.href).toBe(`/visit/${ORG}/${SLUG}/${m.signNumber}`);
    });
    // Walking at 1.2 m/s (FHWA-RD-98-107) and 0.9 m/s (MUTCD §4E.06): the marker 536 m from the start
    // is 536 / 1.2 = 447 s ≈ 7 min, 536 / 0.9 = 596 s ≈ 10 min.
    const acasta = view.rows.find((r) => r.label.startsWith("Oldest dated rock"))!;
    expect(acasta.walk).toBe("7 min (10 min slower)");
    expect(view.walking!.note).toContain("FHWA-RD-98-107");
    expect(view.walking!.note).toContain("MUTCD §4E.06");
    expect(view.scale.lines[0]).toBe(`On this path: ${snapshot.scale.statement.lengthPerTime}.`);
    expect(view.scale.durations.join("\n")).toContain("0.08 mm");
    // the span's young end at age 0 reads "the present", not "0 Ma" (the demo walk: 4,567 Ma to 0 Ma)
    expect(view.scale.lines[2]).toBe("The whole path is 4.567 km long and covers 4,567 Ma to the present.");
    expect(view.stripCaption).toContain("from 4,567 Ma (left) to the present (right)");
    expect(view.cautions).toEqual(snapshot.cautions);
    expect(view.page.checkedLine).toMatch(/^Checked against ICS 2024\/12 by a reviewer on \d{1,2} \w+ \d{4}\.$/);
    expect(view.page.publicationLine).toMatch(/^Publication 1, published /);
    // The route map: every placed marker is drawn, the track simplified to what the drawing shows.
    expect(view.map!.markers.length).toBe(snapshot.markers.length);
    expect(view.map!.drawnCount).toBeLessThanOrEqual(view.map!.vertexCount);
    expect(view.nearest!.markers.map((m) => m[0])).toEqual(snapshot.markers.map((m) => m.signNumber));
    expect(view.precache).toHaveLength(snapshot.markers.length + 1);
  });

  it("each marker page shows its snapshot figures and its neighbours", async () => {
    for (const [i, m] of snapshot.markers.entries()) {
      const res = await settle(() => markerRoute.loader(args(`/visit/${ORG}/${SLUG}/${m.signNumber}`, { org: ORG, slug: SLUG, number: String(m.signNumber) })));
      expect(res.status).toBe(200);
      const view = (res.body as { view: any }).view;
      expect(view.kind).toBe("marker");
      expect(view.label).toBe(m.label);
      expect(view.ageText).toBe(m.ageText);
      expect(view.source).toBe(m.source);
      expect(view.previous?.signNumber ?? null).toBe(snapshot.markers[i - 1]?.signNumber ?? null);
      expect(view.next?.signNumber ?? null).toBe(snapshot.markers[i + 1]?.signNumber ?? null);
      expect(view.positionText).toContain(m.distance.display.fromOlderEnd);
    }
  });

  it("the embed lists the markers beside the strip", async () => {
    const data = await embedRoute.loader(args(`/visit/${ORG}/${SLUG}/embed`, { org: ORG, slug: SLUG }));
    expect(data.view.rows.map((r) => r.signNumber)).toEqual(snapshot.markers.map((m) => m.signNumber));
    expect(data.view.strip.rows[0].rank).toBe("eon");
  });

  it("drafts, exhibits in review and unknown addresses are 404; so is a sign number the exhibit never had", async () => {
    for (const slug of ["school-rope", "corridor-wall", "no-such-exhibit"]) {
      const res = await settle(() => exhibitRoute.loader(args(`/visit/${ORG}/${slug}`, { org: ORG, slug })));
      expect(res.status, slug).toBe(404);
    }
    expect((await settle(() => exhibitRoute.loader(args(`/visit/nobody/${SLUG}`, { org: "nobody", slug: SLUG })))).status).toBe(404);
    expect((await settle(() => markerRoute.loader(args(`/visit/${ORG}/${SLUG}/999`, { org: ORG, slug: SLUG, number: "999" })))).status).toBe(404);
    expect((await settle(() => markerRoute.loader(args(`/visit/${ORG}/${SLUG}/x1`, { org: ORG, slug: SLUG, number: "x1" })))).status).toBe(404);
  });
});

describe("languages", () => {
  const exhibit = async (path: string, headers: Record<string, string> = {}) => ((await exhibitRoute.loader(args(path, { org: ORG, slug: SLUG }, headers))) as ExhibitData).view;
  it("Accept-Language picks German: German interface words and the chart's German interval names", async () => {
    const view = await exhibit(`/visit/${ORG}/${SLUG}`, { "Accept-Language": "de-AT,de;q=0.9,en;q=0.5" });
    expect(view.page.lang).toBe("de");
    expect(view.page.htmlLang).toBe("de");
    expect(view.page.t.markersHeading).toBe("Stationen entlang des Weges");
    expect(view.stripCaption).toContain("von 4,567 Ma (links) bis heute (rechts)");
    const hadean = snapshot.edition.intervals.find((i) => i.name === "Hadean")!;
    expect(view.strip.rows[0].bands[0].name).toBe(hadean.names.de);
    expect(view.strip.rows[0].bands[0].name).toBe("Hadaikum");
  });

  it("?lang= overrides Accept-Language; a language with interval names but no interface file keeps English words", async () => {
    const view = await exhibit(`/visit/${ORG}/${SLUG}?lang=fr`, { "Accept-Language": "de" });
    expect(view.page.lang).toBe("fr");
    expect(view.page.htmlLang).toBe("en");
    expect(view.strip.rows[0].bands[0].name).toBe("Hadéen");
    expect(view.rows[0].href).toBe(`/visit/${ORG}/${SLUG}/1?lang=fr`);
    expect(view.page.languages.find((l) => l.current)?.tag).toBe("fr");
  });

  it("an unknown language falls back: ?lang=xx → Accept-Language → English", async () => {
    expect((await exhibit(`/visit/${ORG}/${SLUG}?lang=xx`, { "Accept-Language": "ja;q=0.8, tlh" })).page.lang).toBe("ja");
    expect((await exhibit(`/visit/${ORG}/${SLUG}`, { "Accept-Language": "tlh, *;q=0.5" })).page.lang).toBe("en");
  });
});

/** The error correction level from the format information next to the top-left finder (ISO/IEC 18004 §7.9). */
function errorCorrectionLevel(pixels: Uint8ClampedArray, width: number, module: number, quiet: number): string {
  const dark = (row: number, col: number) => pixels[(((quiet + row) * module + module / 2) * width + (quiet + col) * module + module / 2) * 4] < 128;
  // Bits 14 and 13 of the format word sit at row 8, columns 0 and 1; the word is masked with 101010000010010.
  const b14 = Number(dark(8, 0)) ^ 1;
  const b13 = Number(dark(8, 1)) ^ 0;
  return ({ "01": "L", "00": "M", "11": "Q", "10": "H" } as Record<string, string>)[`${b14}${b13}`];
}

describe("QR codes", () => {
  const decode = async (image: Buffer) => {
    const { data, info } = await sharp(image).flatten({ background: "#ffffff" }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    const pixels = new Uint8ClampedArray(data.buffer, data.byteOffset, data.length);
    return { code: jsQR(pixels, info.width, info.height), pixels, width: info.width };
  };

  it("the PNG decodes to the marker page's absolute URL, level Q, with a quiet zone of 4 modules", async () => {
    const m = snapshot.markers[5];
    const res = (await qrPng.loader(args(`/visit/${ORG}/${SLUG}/${m.signNumber}/qr.png`, { org: ORG, slug: SLUG, number: String(m.signNumber) }))) as Response;
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Type")).toBe("image/png");
    const png = Buffer.from(await res.arrayBuffer());
    const { code, pixels, width } = await decode(png);
    expect(code?.data).toBe(`${process.env.APP_URL}/visit/${ORG}/${SLUG}/${m.signNumber}`);
    const modules = 17 + 4 * code!.version;
    const module = width / (modules + 8);
    expect(Number.isInteger(module)).toBe(true); // exactly 4 + modules + 4 across
    // The quiet zone: the first 4 modules of rows and columns are light.
    for (let x = 0; x < 4 * module; x++) expect(pixels[(x * width + Math.floor(width / 2)) * 4]).toBeGreaterThan(128);
    expect(errorCorrectionLevel(pixels, width, module, 4)).toBe("Q");
    // ETag: revalidation costs nothing.
    const again = (await qrPng.loader(args(`/visit/${ORG}/${SLUG}/${m.signNumber}/qr.png`, { org: ORG, slug: SLUG, number: String(m.signNumber) }, { "If-None-Match": res.headers.get("ETag")! }))) as Response;
    expect(again.status).toBe(304);
  });

  it("the SVG decodes to the same URL; unknown signs and drafts are 404", async () => {
    const res = (await qrSvg.loader(args(`/visit/${ORG}/${SLUG}/1/qr.svg`, { org: ORG, slug: SLUG, number: "1" }))) as Response;
    expect(res.headers.get("Content-Type")).toMatch(/^image\/svg\+xml/);
    const svg = Buffer.from(await res.arrayBuffer());
    const { code } = await decode(await sharp(svg, { density: 300 }).png().toBuffer());
    expect(code?.data).toBe(`${process.env.APP_URL}/visit/${ORG}/${SLUG}/1`);
    expect(((await qrSvg.loader(args("/", { org: ORG, slug: SLUG, number: "999" }))) as Response).status).toBe(404);
    expect(((await qrSvg.loader(args("/", { org: ORG, slug: "school-rope", number: "1" }))) as Response).status).toBe(404);
  });
});

describe("the visitor pages over HTTP (ETag, 304, same bytes, no cookie)", () => {
  let base: string;
  let renders = 0;
  let server: import("node:http").Server;
  beforeAll(async () => {
    forgetVisitPages();
    const app = express();
    // The real middleware with the real loaders; the page body here is the loader's data as JSON.
    app.use(
      visitorPages({
        buildId: async () => "build42",
        origin: "http://test.local",
        render: async (request) => {
          renders++;
          const url = new URL(request.url);
          const [, , org, slug, rest] = url.pathname.split("/");
          const result = await settle(() =>
            rest ? markerRoute.loader({ request, params: { org, slug, number: rest }, context: {} } as never) : exhibitRoute.loader({ request, params: { org, slug }, context: {} } as never),
          );
          return new Response(JSON.stringify(result.body), { status: result.status, headers: { "Content-Type": "application/json" } });
        },
      }),
    );
    app.use((_req, res) => res.status(404).send("fell through"));
    server = app.listen(0, "127.0.0.1");
    await once(server, "listening");
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => server.close());

  it("200 with an ETag of hash + language + build, public caching, Vary: Accept-Language, no Set-Cookie; 304 before rendering", async () => {
    const first = await fetch(`${base}/visit/${ORG}/${SLUG}/6`, { headers: { "Accept-Language": "de" } });
    expect(first.status).toBe(200);
    const etag = first.headers.get("ETag")!;
    expect(etag).toBe(`"${sha256.slice(0, 32)}-de-build42"`);
    expect(first.headers.get("Cache-Control")).toMatch(/^public, max-age=\d+, stale-while-revalidate=\d+$/);
    expect(first.headers.get("Vary")).toMatch(/Accept-Language/);
    expect(first.headers.get("Content-Language")).toBe("de");
    expect(first.headers.get("Set-Cookie")).toBeNull();
    const body = await first.text();
    const rendersBefore = renders;
    const second = await fetch(`${base}/visit/${ORG}/${SLUG}/6`, { headers: { "Accept-Language": "de" } });
    expect(await second.text()).toBe(body); // same bytes, from the cache
    const revalidated = await fetch(`${base}/visit/${ORG}/${SLUG}/6`, { headers: { "Accept-Language": "de", "If-None-Match": etag } });
    expect(revalidated.status).toBe(304);
    expect(await revalidated.text()).toBe("");
    expect(renders).toBe(rendersBefore);
    // Another language is another ETag; the old one no longer matches.
    const en = await fetch(`${base}/visit/${ORG}/${SLUG}/6`, { headers: { "Accept-Language": "en", "If-None-Match": etag } });
    expect(en.status).toBe(200);
    expect(en.headers.get("ETag")).toBe(`"${sha256.slice(0, 32)}-en-build42"`);
  });

  it("compressed once: gzip and Brotli bodies for clients that ask", async () => {
    const br = await fetch(`${base}/visit/${ORG}/${SLUG}`, { headers: { "Accept-Encoding": "br" } });
    expect(br.headers.get("Content-Encoding")).toBe("br");
    const gz = await fetch(`${base}/visit/${ORG}/${SLUG}`, { headers: { "Accept-Encoding": "gzip" } });
    expect(gz.headers.get("Content-Encoding")).toBe("gzip");
    expect(await br.text()).toBe(await gz.text());
  });

  it("unknown and draft exhibits fall through to React Router (its 404 page); a removed sign number is not cached as a page", async () => {
    expect(await (await fetch(`${base}/visit/${ORG}/school-rope`)).text()).toBe("fell through");
    expect(await (await fetch(`${base}/visit/${ORG}/nothing-here/3`)).text()).toBe("fell through");
    const missing = await fetch(`${base}/visit/${ORG}/${SLUG}/999`);
    expect(missing.status).toBe(404);
    expect(missing.headers.get("ETag")).toBeNull();
  });
});
