// Images in publications, against the real Postgres and s3rver: the seeded riverside-walk
// publication names its markers' images by stable /media/:assetId/:file URLs that the image worker
// then serves to anyone; an image a publication uses is public for a signed-out visitor and stays
// (row and S3 objects) after its marker is removed from the draft, while an image only a draft used
// is removed.
import { beforeAll, describe, expect, it } from "vitest";
import * as apiAssets from "../../app/routes/api.assets.ts";
import * as latest from "../../app/routes/api.exhibits.$org.$slug.ts";
import * as media from "../../app/routes/media.$assetId.$file.ts";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import * as review from "../../app/routes/studio/exhibits.$slug.review.tsx";
import type { PublicationSnapshot, SnapshotMarker } from "../../app/lib/publication/types.ts";
import { Asset, Exhibit, ImageUse, Marker, type Organisation } from "../../db/models/index.ts";
import { cleanupAsset, processAsset } from "../../server/assets/jobs.server.ts";
import { sizesOf } from "../../server/assets/usage.server.ts";
import { listObjects } from "../../server/storage/s3.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";
import { jpegWithGps, uploadRequest, useOwnBucket } from "../helpers/images.ts";
import { workerDatabase } from "../setup/test-env.ts";

async function publicJson(org: string, slug: string) {
  const res = (await latest.loader(routeArgs(getRequest(`/api/exhibits/${org}/${slug}`), { org, slug }))) as Response;
  expect(res.status).toBe(200);
  return (await res.json()) as { publication: { number: number; hash: string }; snapshot: PublicationSnapshot };
}

async function fetchMedia(url: string, cookie?: string) {
  const [, , assetId, file] = url.split("/");
  return media.loader(routeArgs(getRequest(url, { cookie }), { assetId, file }));
}

describe("the seeded publication's images", () => {
  it("riverside-walk publication 1 carries its markers' images (asset id, alt, credit, /media URLs) and every URL is served to a signed-out visitor once processed", async () => {
    const { snapshot } = await publicJson("marrowby", "riverside-walk");
    const withImage = snapshot.markers.filter((m): m is SnapshotMarker & { image: NonNullable<SnapshotMarker["image"]> } => m.image !== null);
    expect(withImage.map((m) => m.label).sort()).toEqual(["Base of the Jurassic", "Cambrian explosion begins", "Marrowby mill built"]);
    const exhibit = (await Exhibit.findOne({ where: { slug: "riverside-walk" } }))!;
    for (const m of withImage) {
      const use = (await ImageUse.findOne({ where: { exhibitId: exhibit.id, markerId: Number(m.id) } }))!;
      expect(m.image.assetId).toBe(use.assetId);
      expect(m.image.alt).toBe(use.alt);
      expect(m.image.credit).toBe(use.credit);
      expect(m.image.alt.length).toBeGreaterThan(20);
      // The demo drawings are 1600 px wide: three widths, WebP and JPEG each.
      expect(m.image.sizes.map((s) => s.url)).toEqual(
        [480, 960, 1600].flatMap((w) => [`/media/${use.assetId}/${w}.jpg`, `/media/${use.assetId}/${w}.webp`]),
      );
      // Before the worker has made them, the files do not exist yet.
      expect((await fetchMedia(m.image.sizes[0].url)).status).toBe(404);

      // What the worker makes when the server starts is what the snapshot names.
      expect(await processAsset(use.assetId)).toBe("ready");
      const asset = (await Asset.findByPk(use.assetId))!;
      expect(sizesOf(asset)).toEqual(m.image.sizes);
      for (const size of m.image.sizes) {
        const res = await fetchMedia(size.url);
        expect(res.status, size.url).toBe(200);
        expect(res.headers.get("Cache-Control")).toBe("public, max-age=31536000, immutable");
        expect(res.headers.get("Content-Type")).toBe(size.format === "jpeg" ? "image/jpeg" : "image/webp");
        expect((await res.arrayBuffer()).byteLength).toBeGreaterThan(1000);
      }
    }
  });
});

describe("an image a publication uses", () => {
  let org: Organisation;
  let designer: string;
  let reviewer: string;

  const revisionOf = async (slug: string) => String((await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!.revision);
  const post = async (slug: string, fields: Record<string, string>, cookie = designer) =>
    settle(async () => composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, { ...fields, revision: await revisionOf(slug) }, { cookie }), { slug })));

  async function readyImage(width: number, height: number) {
    const res = await apiAssets.action(routeArgs(uploadRequest([{ name: "slab.jpg", type: "image/jpeg", bytes: await jpegWithGps(width, height) }], designer)));
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as { id: number };
    expect(await processAsset(id)).toBe("ready");
    return id;
  }

  beforeAll(async () => {
    // Uploads number from the template's last asset in every test database: a bucket of our own keeps the objects apart.
    await useOwnBucket(`test-pubimg-${workerDatabase()}`);
    org = await createOrganisation();
    designer = await cookieFor((await createMember(org, "designer")).user.id);
    reviewer = await cookieFor((await createMember(org, "reviewer")).user.id);
  });

  it("is public at /media/:assetId/:file for a signed-out visitor, and stays (row and S3 objects) after its marker is removed from the draft", async () => {
    const slug = "slab-wall";
    const form = new FormData();
    for (const [k, v] of Object.entries({ slug, title: "Slab wall", editionSlug: "ics-2024-12", mediumKind: "length", spanOlderValue: "538.8", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "wall", unitsPreference: "metric", lengthValue: "10.776", lengthUnit: "m" })) form.set(k, v);
    expect((await settle(() => newExhibit.action(routeArgs(new Request("http://test.local/studio/exhibits/new", { method: "POST", body: form, headers: { Cookie: designer } }))))).status).toBe(302);
    for (const [label, age] of [["Trilobite slab", "510"], ["Coal forest", "310"]]) {
      expect((await post(slug, { intent: "add-custom", label, ageValue: age, ageUnit: "Ma", source: "Invented for this test, not a real locality", text: "" })).status).toBe(302);
    }
    const exhibit = (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!;
    const [slab, coal] = await Marker.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]] });
    const published = await readyImage(1200, 800);
    expect((await post(slug, { intent: "set-marker-image", markerId: String(slab.id), assetId: String(published), alt: "A trilobite on a slab of grey shale", credit: "Drawing: Eonscale test" })).status).toBe(302);

    // A signed-out visitor cannot see a draft's image.
    expect((await fetchMedia(`/media/${published}/960.webp`)).status).toBe(404);

    // Submit, approve (another person), publish.
    expect((await post(slug, { intent: "submit-for-review" })).status).toBe(302);
    const approved = await settle(async () => review.action(routeArgs(formRequest(`/studio/exhibits/${slug}/review`, { intent: "approve", revision: await revisionOf(slug) }, { cookie: reviewer }), { slug })));
    expect(approved.status).toBe(302);
    expect((await post(slug, { intent: "publish" })).status).toBe(302);

    const { snapshot } = await publicJson(org.slug, slug);
    const image = snapshot.markers.find((m) => m.id === String(slab.id))!.image!;
    expect(image).toMatchObject({ assetId: published, alt: "A trilobite on a slab of grey shale", credit: "Drawing: Eonscale test" });
    expect(image.sizes.map((s) => s.url)).toContain(`/media/${published}/960.webp`);
    expect(snapshot.markers.find((m) => m.id === String(coal.id))!.image).toBeNull();
    const servedTo = async (cookie?: string) => Promise.all(image.sizes.map(async (s) => (await fetchMedia(s.url, cookie)).status));
    expect(await servedTo()).toEqual(image.sizes.map(() => 200));
    const objectsBefore = (await listObjects(`assets/${published}/`)).map((o) => o.key).sort();
    expect(objectsBefore.length).toBe(image.sizes.length + 2); // the sizes, the print master and the original

    // A draft-only image on the other marker, for contrast.
    const draftOnly = await readyImage(900, 600);
    expect((await post(slug, { intent: "set-marker-image", markerId: String(coal.id), assetId: String(draftOnly), alt: "Coal with fern impressions", credit: "" })).status).toBe(302);

    // Remove both markers from the draft: the published image stays, the draft-only one goes.
    expect((await post(slug, { intent: "remove-marker", markerId: String(slab.id) })).status).toBe(302);
    expect((await post(slug, { intent: "remove-marker", markerId: String(coal.id) })).status).toBe(302);
    expect(await ImageUse.count({ where: { exhibitId: exhibit.id } })).toBe(0);
    expect(await cleanupAsset(published)).toBe("in use");
    expect(await cleanupAsset(draftOnly)).toBe("removed");
    expect(await Asset.findByPk(published)).not.toBeNull();
    expect((await listObjects(`assets/${published}/`)).map((o) => o.key).sort()).toEqual(objectsBefore);
    expect(await listObjects(`assets/${draftOnly}/`)).toEqual([]);
    expect(await servedTo()).toEqual(image.sizes.map(() => 200));
    expect((await fetchMedia(image.sizes[0].url)).headers.get("Set-Cookie")).toBeNull();
  });
});
