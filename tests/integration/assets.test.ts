// Marker images end to end against the real s3rver and Postgres: upload (content-judged types,
// limits, pixel bombs), processing (sizes, print master, AVIF, no EXIF GPS anywhere, auto-orient),
// serving (ETag, 304, cache headers, who may see what), attaching with alt text and credit,
// deleting (objects gone after the change commits; the sweep removes orphans).
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import * as apiAsset from "../../app/routes/api.assets.$id.ts";
import * as apiAssets from "../../app/routes/api.assets.ts";
import * as media from "../../app/routes/media.$assetId.$file.ts";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import { Asset, AuditEvent, Exhibit, ImageUse, Marker, type Organisation } from "../../db/models/index.ts";
import { cleanupAsset, processAsset, processAvif, sweepAssets } from "../../server/assets/jobs.server.ts";
import { imagesForExhibit } from "../../server/assets/usage.server.ts";
import { sequelize } from "../../server/db.server.ts";
import { listObjects, putObject } from "../../server/storage/s3.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";
import { hasExifBlock, hasGps, HTML_PAGE, jpegWithGps, pngBomb, pngWithAlpha, SVG_WITH_SCRIPT, uploadRequest, useOwnBucket, zipArchive } from "../helpers/images.ts";
import { workerDatabase } from "../setup/test-env.ts";

let org: Organisation;
let designer: string;
let reviewer: string;
let outsider: string;

async function upload(files: { name: string; type: string; bytes: Uint8Array }[], cookie: string | null = designer) {
  const res = await apiAssets.action(routeArgs(uploadRequest(files, cookie ?? undefined)));
  return { status: res.status, body: (await res.json()) as { id?: number; status?: string; error?: { message: string } } };
}

async function getAsset(id: number, cookie?: string) {
  const res = await apiAsset.loader(routeArgs(getRequest(`/api/assets/${id}`, { cookie }), { id: String(id) }));
  return { status: res.status, body: (await res.json()) as Record<string, unknown> & { sizes: { width: number; format: string; url: string }[] } };
}

async function fetchMedia(url: string, cookie?: string, headers: Record<string, string> = {}) {
  const [, , id, file] = url.split("/");
  const request = new Request(`http://test.local${url}`, { headers: { ...(cookie ? { Cookie: cookie } : {}), ...headers } });
  return media.loader(routeArgs(request, { assetId: id, file }));
}

const counts = async () => ({ assets: await Asset.count(), objects: (await listObjects("assets/")).length });

const wall = { title: "Image wall", editionSlug: "ics-2024-12", mediumKind: "length", spanOlderValue: "538.8", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "wall", unitsPreference: "metric", lengthValue: "10.776", lengthUnit: "m" };

async function exhibitWithMarkers(slug: string) {
  const form = new FormData();
  for (const [k, v] of Object.entries({ ...wall, slug })) form.set(k, v);
  const res = await settle(() => newExhibit.action(routeArgs(new Request("http://test.local/studio/exhibits/new", { method: "POST", body: form, headers: { Cookie: designer } }))));
  expect(res.status).toBe(302);
  for (const [label, age] of [["Trilobite beds", "510"], ["Coal forest", "310"]]) {
    const r = await post(slug, { intent: "add-custom", label, ageValue: age, ageUnit: "Ma", source: "Invented for this test, not a real locality", text: "" });
    expect(r.status).toBe(302);
  }
  const exhibit = (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!;
  const markers = await Marker.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]] });
  return { exhibit, markers };
}

async function post(slug: string, fields: Record<string, string>, cookie = designer) {
  const revision = fields.revision ?? String((await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!.revision);
  return settle(() => composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, { ...fields, revision }, { cookie }), { slug })));
}

async function readyImage(width = 2000, height = 1400, cookie = designer) {
  const res = await upload([{ name: "site.jpg", type: "image/jpeg", bytes: await jpegWithGps(width, height) }], cookie);
  expect(res.status).toBe(201);
  expect(await processAsset(res.body.id!)).toBe("ready");
  return res.body.id!;
}

beforeAll(async () => {
  await useOwnBucket(`test-${workerDatabase()}`);
  org = await createOrganisation();
  designer = await cookieFor((await createMember(org, "designer")).user.id);
  reviewer = await cookieFor((await createMember(org, "reviewer")).user.id);
  outsider = await cookieFor((await createMember(await createOrganisation(), "designer")).user.id);
});

describe("upload, process, serve", () => {
  it("stores the original, makes WebP + JPEG web sizes and a print master, none with EXIF GPS, and serves them with ETag", async () => {
    const original = await jpegWithGps(2000, 1400);
    expect(hasGps((await sharp(original).metadata()).exif)).toBe(true);
    const res = await upload([{ name: "fossil.jpg", type: "image/jpeg", bytes: original }]);
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(Number), status: "processing" });
    const id = res.body.id!;
    expect((await getAsset(id, designer)).body.status).toBe("processing");
    expect(await AuditEvent.count({ where: { action: "asset.upload", objectId: String(id) } })).toBe(1);

    expect(await processAsset(id)).toBe("ready");
    const { status, body } = await getAsset(id, designer);
    expect(status).toBe(200);
    expect(body).toMatchObject({ id, status: "ready", width: 2000, height: 1400, alt: "", credit: "" });
    expect(body.sizes.map((s) => `${s.width}.${s.format}`).sort()).toEqual(["1600.jpeg", "1600.webp", "480.jpeg", "480.webp", "960.jpeg", "960.webp"]);

    for (const size of body.sizes) {
      const r = await fetchMedia(size.url, designer);
      expect(r.status).toBe(200);
      expect(r.headers.get("Content-Type")).toBe(size.format === "jpeg" ? "image/jpeg" : "image/webp");
      expect(r.headers.get("Cache-Control")).toBe("private, max-age=31536000, immutable");
      const bytes = Buffer.from(await r.arrayBuffer());
      const meta = await sharp(bytes).metadata();
      expect(meta.width).toBe(size.width);
      expect(meta.exif).toBeUndefined();
      expect(hasExifBlock(bytes)).toBe(false);
      const again = await fetchMedia(size.url, designer, { "If-None-Match": r.headers.get("ETag")! });
      expect(again.status).toBe(304);
    }
    const print = await fetchMedia(`/media/${id}/print.jpg`, designer);
    expect(print.status).toBe(200);
    const printMeta = await sharp(Buffer.from(await print.arrayBuffer())).metadata();
    expect([printMeta.width, printMeta.height, printMeta.exif, printMeta.space, Boolean(printMeta.icc)]).toEqual([2000, 1400, undefined, "srgb", true]);

    expect(await processAvif(id)).toBe("ready");
    const withAvif = await getAsset(id, designer);
    const avif = withAvif.body.sizes.filter((s) => s.format === "avif");
    expect(avif.map((s) => s.width)).toEqual([480, 960, 1600]);
    const avifBytes = Buffer.from(await (await fetchMedia(avif[0].url, designer)).arrayBuffer());
    expect((await sharp(avifBytes).metadata()).exif).toBeUndefined();
    // Keys are content-hashed: every made file's key carries its hash.
    const keys = (await listObjects(`assets/${id}/`)).map((o) => o.key);
    expect(keys).toContain(`assets/${id}/original`);
    expect(keys.filter((k) => /-[0-9a-f]{16}\.(webp|jpg|avif)$/.test(k))).toHaveLength(10);
  });

  it("auto-orients before stripping the orientation, and flattens transparency only in the JPEG fallback", async () => {
    const turned = await upload([{ name: "turned.jpg", type: "image/jpeg", bytes: await jpegWithGps(600, 400, { orientation: 6 }) }]);
    expect(turned.status).toBe(201);
    await processAsset(turned.body.id!);
    const a = await getAsset(turned.body.id!, designer);
    expect([a.body.width, a.body.height]).toEqual([400, 600]);
    const web = a.body.sizes.find((s) => s.format === "webp")!;
    const meta = await sharp(Buffer.from(await (await fetchMedia(web.url, designer)).arrayBuffer())).metadata();
    expect([meta.width, meta.height, meta.orientation]).toEqual([400, 600, undefined]);

    const png = await upload([{ name: "clear.png", type: "image/png", bytes: await pngWithAlpha(500, 300) }]);
    await processAsset(png.body.id!);
    const p = await getAsset(png.body.id!, designer);
    expect(p.body.sizes.map((s) => `${s.width}.${s.format}`)).toEqual(["480.jpeg", "480.webp", "500.jpeg", "500.webp"]);
    const webp = await sharp(Buffer.from(await (await fetchMedia(`/media/${png.body.id}/500.webp`, designer)).arrayBuffer())).metadata();
    const jpeg = await sharp(Buffer.from(await (await fetchMedia(`/media/${png.body.id}/500.jpg`, designer)).arrayBuffer())).metadata();
    expect([webp.hasAlpha, jpeg.hasAlpha]).toEqual([true, false]);
  });
});

describe("refusals store nothing", () => {
  const refused: [string, string, string, () => Uint8Array | Promise<Uint8Array>, number][] = [
    ["an SVG with a script", "drawing.svg", "image/svg+xml", () => Buffer.from(SVG_WITH_SCRIPT), 415],
    ["an SVG renamed .png", "drawing.png", "image/png", () => Buffer.from(SVG_WITH_SCRIPT), 415],
    ["an HTML page", "page.jpg", "image/jpeg", () => Buffer.from(HTML_PAGE), 415],
    ["a ZIP named .jpg", "photo.jpg", "image/jpeg", zipArchive, 415],
    ["a GIF", "anim.gif", "image/gif", () => sharp({ create: { width: 10, height: 10, channels: 3, background: "#000" } }).gif().toBuffer(), 415],
    ["a truncated JPEG header", "cut.jpg", "image/jpeg", async () => (await jpegWithGps(400, 300)).subarray(0, 40), 415],
    ["a pixel bomb (20,000 × 20,000 px PNG of a few bytes)", "bomb.png", "image/png", () => pngBomb(20_000, 20_000), 422],
  ];
  for (const [what, name, type, make, status] of refused) {
    it(`refuses ${what} with ${status} and a message`, async () => {
      const before = await counts();
      const res = await upload([{ name, type, bytes: await make() }]);
      expect(res.status).toBe(status);
      expect(res.body.error?.message).toMatch(status === 415 ? /not a JPEG, PNG, WebP, AVIF or TIFF image/ : /more than 120 megapixels/);
      expect(await counts()).toEqual(before);
    });
  }

  it("refuses a file over 60 MB with 413, two files with 400, no file with 400", async () => {
    const before = await counts();
    const big = await upload([{ name: "huge.jpg", type: "image/jpeg", bytes: new Uint8Array(60 * 1024 * 1024 + 10) }]);
    expect(big.status).toBe(413);
    expect(big.body.error?.message).toMatch(/larger than 60 MB/);
    const small = await jpegWithGps(100, 100);
    const two = await upload([{ name: "a.jpg", type: "image/jpeg", bytes: small }, { name: "b.jpg", type: "image/jpeg", bytes: small }]);
    expect([two.status, two.body.error?.message]).toEqual([400, "Send one image per upload, in the field “file”."]);
    const none = await apiAssets.action(routeArgs(formRequest("/api/assets", { x: "1" }, { cookie: designer })));
    expect(none.status).toBe(400);
    expect(await counts()).toEqual(before);
  });

  it("needs a signed-in designer (401 signed out, 403 for a reviewer)", async () => {
    const small = await jpegWithGps(100, 100);
    expect((await upload([{ name: "a.jpg", type: "image/jpeg", bytes: small }], null)).status).toBe(401);
    const r = await upload([{ name: "a.jpg", type: "image/jpeg", bytes: small }], reviewer);
    expect([r.status, r.body.error?.message]).toEqual([403, "Uploading images needs the designer role in your organisation."]);
  });
});

describe("who sees a draft's image", () => {
  it("answers 404 to another organisation and to signed-out visitors, for the API and the files", async () => {
    const id = await readyImage(900, 600);
    const { body } = await getAsset(id, designer);
    expect((await getAsset(id, reviewer)).status).toBe(200);
    for (const cookie of [outsider, undefined]) {
      expect((await getAsset(id, cookie)).status).toBe(404);
      expect((await fetchMedia(body.sizes[0].url, cookie)).status).toBe(404);
      expect((await fetchMedia(`/media/${id}/print.jpg`, cookie)).status).toBe(404);
    }
    expect((await fetchMedia(`/media/${id}/123.webp`, designer)).status).toBe(404);
    expect((await fetchMedia(`/media/${id}/original`, designer)).status).toBe(404);
  });
});

describe("attaching, replacing, removing", () => {
  it("attaches with alt text and credit per use, refuses bad input with the field, and replaces", async () => {
    const { exhibit, markers } = await exhibitWithMarkers("image-wall");
    const id = await readyImage(1200, 800);
    const long = await post("image-wall", { intent: "set-marker-image", markerId: String(markers[0].id), assetId: String(id), alt: "x".repeat(251), credit: "" });
    expect(long.status).toBe(400);
    expect((long.body as { fields: Record<string, string> }).fields.alt).toBe("Alt text: keep it to 250 characters or fewer.");
    const foreign = await readyImage(500, 400, outsider);
    const other = await post("image-wall", { intent: "set-marker-image", markerId: String(markers[0].id), assetId: String(foreign), alt: "A trilobite", credit: "" });
    expect(other.status).toBe(400);
    expect((other.body as { fields: Record<string, string> }).fields.assetId).toMatch(/not among your organisation's uploads/);
    expect(await ImageUse.count({ where: { exhibitId: exhibit.id } })).toBe(0);

    const ok = await post("image-wall", { intent: "set-marker-image", markerId: String(markers[0].id), assetId: String(id), alt: "A trilobite on a slab of grey shale", credit: "Drawing: Eonscale test" });
    expect(ok.status).toBe(302);
    await post("image-wall", { intent: "set-marker-image", markerId: String(markers[1].id), assetId: String(id), alt: "", credit: "" });
    const images = await imagesForExhibit(exhibit.id);
    expect(images.get(markers[0].id)).toMatchObject({ assetId: id, alt: "A trilobite on a slab of grey shale", credit: "Drawing: Eonscale test" });
    expect(images.get(markers[0].id)!.sizes.map((s) => s.url)).toContain(`/media/${id}/960.webp`);
    expect(images.get(markers[1].id)).toMatchObject({ assetId: id, alt: "" });
    expect((await Exhibit.findByPk(exhibit.id))!.revision).toBe(exhibit.revision + 2);

    // The composer page shows them.
    const page = (await composer.loader(routeArgs(getRequest("/studio/exhibits/image-wall", { cookie: designer }), { slug: "image-wall" }))) as { images: { markers: Record<string, { status: string }> } };
    expect(page.images.markers[String(markers[0].id)].status).toBe("ready");

    // Replace the first marker's image: the old one stays while the second marker uses it.
    const newer = await readyImage(800, 600);
    await post("image-wall", { intent: "set-marker-image", markerId: String(markers[0].id), assetId: String(newer), alt: "A trilobite, closer", credit: "" });
    expect(await cleanupAsset(id)).toBe("in use");
    // Removing the second use frees it; the cleanup removes the row and every object.
    const removed = await post("image-wall", { intent: "remove-image", markerId: String(markers[1].id) });
    expect(removed.status).toBe(302);
    expect(await cleanupAsset(id)).toBe("removed");
    expect(await Asset.findByPk(id)).toBeNull();
    expect(await listObjects(`assets/${id}/`)).toEqual([]);
    expect((await fetchMedia(`/media/${id}/960.webp`, designer)).status).toBe(404);
  });

  it("removing a marker queues its image's cleanup in the same transaction; a cover is one per exhibit", async () => {
    const { exhibit, markers } = await exhibitWithMarkers("cover-wall");
    const id = await readyImage(700, 500);
    await post("cover-wall", { intent: "set-marker-image", markerId: String(markers[0].id), assetId: String(id), alt: "Coal seam", credit: "" });
    const [{ n: before }] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'asset-cleanup' AND data->'assetIds' @> $1::jsonb`, { bind: [JSON.stringify([id])], type: "SELECT" as never });
    expect((await post("cover-wall", { intent: "remove-marker", markerId: String(markers[0].id) })).status).toBe(302);
    const [{ n: after }] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'asset-cleanup' AND data->'assetIds' @> $1::jsonb`, { bind: [JSON.stringify([id])], type: "SELECT" as never });
    expect(after).toBe(before + 1);
    expect(await ImageUse.count({ where: { assetId: id } })).toBe(0);

    const cover = await readyImage(1600, 900);
    expect((await post("cover-wall", { intent: "set-cover-image", assetId: String(cover), alt: "The wall in the museum's hall", credit: "Drawing: Eonscale test" })).status).toBe(302);
    expect((await post("cover-wall", { intent: "set-cover-image", assetId: String(cover), alt: "The wall, reworded", credit: "" })).status).toBe(302);
    expect(await ImageUse.count({ where: { exhibitId: exhibit.id, markerId: null } })).toBe(1);
    expect((await post("cover-wall", { intent: "remove-image", markerId: "cover" })).status).toBe(302);
    expect(await ImageUse.count({ where: { exhibitId: exhibit.id } })).toBe(0);
  });
});

describe("the sweep", () => {
  it("removes objects without a row after an hour, leaves live ones, and removes uploads never attached after a day", async () => {
    const live = await readyImage(500, 300);
    await putObject("assets/987654/original", Buffer.from("left by an interrupted upload"), "image/jpeg");
    const soon = await sweepAssets(new Date());
    expect(soon.orphanObjects).toBe(0);
    const later = await sweepAssets(new Date(Date.now() + 2 * 3600_000));
    expect(later.orphanObjects).toBe(1);
    expect(await listObjects("assets/987654/")).toEqual([]);
    expect((await listObjects(`assets/${live}/`)).length).toBeGreaterThan(0);
    const dayLater = await sweepAssets(new Date(Date.now() + 25 * 3600_000));
    expect(dayLater.unattachedAssets).toBeGreaterThan(0);
    expect(await Asset.findByPk(live)).toBeNull();
    expect(await listObjects(`assets/${live}/`)).toEqual([]);
  });
});
