// Demo scenario (invented): Marrowby's review and publication state.
//  - curator@marrowby.example (password deep-time-demo) holds both the designer and reviewer roles,
//    as a small museum's curator might (the four-eyes rule still stops them approving their own edits);
//  - every demo exhibit's current revision is kept (history starts here);
//  - riverside-walk is approved by the reviewer (Rhona Basalt) and published by the designer (Dev
//    Lindqvist) as publication 1, so visitors and GET /api/exhibits/marrowby/riverside-walk have
//    something to open;
//  - school-rope is in review.
// The demo images (the seeder before this one) are in the publication: each marker's image with its
// alt text, credit and the stable /media/:assetId/:file URLs of the sizes the image worker makes
// when the server starts (the same entries a publication made in the app carries).
// db/ knows nothing of the web server, so this builds the publication from the models and the pure
// code the server uses too (resolveMarkers, computeExhibit, runChecks, planSigns, buildSnapshot,
// canonicalJson); marker texts are rendered with the same Markdown policy as server/markdown.server.ts.
import { createHash } from "node:crypto";
import bcrypt from "bcryptjs";
import { marked } from "marked";
import sanitizeHtml from "sanitize-html";
import type { Sequelize, Transaction } from "sequelize";
import { computeExhibit, standardDurations } from "../../../app/lib/exhibit/compose.ts";
import { mediumSpecOf, resolveMarkers, type EventAge } from "../../../app/lib/exhibit/resolve.ts";
import type { ExhibitSpec, InsetSpec } from "../../../app/lib/exhibit/types.ts";
import { mediaUrl, plannedWebSizes, sizeFileName } from "../../../app/lib/images.ts";
import { buildSnapshot } from "../../../app/lib/publication/build.ts";
import { canonicalJson } from "../../../app/lib/publication/canonical.ts";
import { planSigns } from "../../../app/lib/publication/signs.ts";
import type { SnapshotImage } from "../../../app/lib/publication/types.ts";
import { failuresInWords, runChecks } from "../../../app/lib/review/checks.ts";
import { revisionContent } from "../../../app/lib/review/content.ts";
import type { Interval } from "../../../app/lib/timescale/types.ts";
import type { Migration } from "../../migrator.ts";
import { DEMO_PASSWORD } from "./2026.12.01T00.00.00.marrowby-team.ts";
import { readSeededEdition, type SEEDED_EDITIONS } from "../reference/2026.12.01T01.00.00.ics-editions.ts";

export const DEMO_CURATOR = { email: "curator@marrowby.example", name: "Cal Moraine", roles: ["designer", "reviewer"] } as const;

// The Markdown policy of server/markdown.server.ts (marker texts: a few inline and block tags).
const MARKDOWN_POLICY: sanitizeHtml.IOptions = {
  allowedTags: ["p", "em", "strong", "a", "ul", "ol", "li", "br", "sup", "sub", "code", "blockquote"],
  allowedAttributes: { a: ["href", "title"] },
  allowedSchemes: ["https", "http", "mailto"],
  transformTags: { a: sanitizeHtml.simpleTransform("a", { rel: "noopener noreferrer" }) },
};
const render = (text: string) => (text.trim() ? sanitizeHtml(marked.parse(text, { async: false, gfm: true, breaks: false }) as string, MARKDOWN_POLICY).trim() : "");
const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");

/**
 * The images of an exhibit's markers as a publication names them (server/assets/usage.server.ts's
 * imagesForExhibit): the served sizes once processed, else the sizes processing will make.
 */
async function markerImages(sequelize: Sequelize, exhibitId: number, transaction: Transaction): Promise<Map<string, SnapshotImage>> {
  const [rows] = (await sequelize.query(
    `SELECT u.marker_id AS "markerId", u.asset_id AS "assetId", u.alt, u.credit, a.width, a.files FROM image_uses u JOIN assets a ON a.id = u.asset_id
      WHERE u.exhibit_id = $1 AND u.marker_id IS NOT NULL ORDER BY u.id`,
    { bind: [exhibitId], transaction },
  )) as [{ markerId: number; assetId: number; alt: string; credit: string; width: number; files: { role: string; width: number; format: "webp" | "jpeg" | "avif" }[] }[], unknown];
  return new Map(
    rows.map((r) => {
      const served = r.files
        .filter((f) => f.role === "web")
        .sort((a, b) => a.width - b.width || a.format.localeCompare(b.format))
        .map((f) => ({ width: f.width, format: f.format, url: mediaUrl(r.assetId, sizeFileName(f.width, f.format)) }));
      return [String(r.markerId), { assetId: r.assetId, alt: r.alt, credit: r.credit || null, sizes: served.length ? served : plannedWebSizes(r.assetId, r.width) }];
    }),
  );
}

async function load(sequelize: Sequelize, organisationId: number, slug: string, transaction: Transaction) {
  const m = await import("../../models/index.ts");
  const exhibit = await m.Exhibit.findOne({ where: { organisationId, slug }, include: [{ model: m.ExhibitMedium, as: "medium" }, { model: m.ChartEdition, as: "edition" }], transaction });
  if (!exhibit) return null;
  const edition = exhibit.edition!;
  const data = readSeededEdition(edition.slug as (typeof SEEDED_EDITIONS)[number]);
  const rows = await m.Interval.findAll({ where: { editionId: edition.id }, attributes: ["id", "name"], transaction });
  const byName = new Map<string, Interval>(data.intervals.map((iv) => [iv.name, iv]));
  const intervalIds = new Map(rows.map((r) => [r.id, byName.get(r.name)!]));
  const markerRows = await m.Marker.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]], transaction });
  const eventRows = await m.DatedEvent.findAll({ where: { id: markerRows.filter((r) => r.datedEventId).map((r) => r.datedEventId!) }, transaction });
  const events = new Map<number, EventAge>(eventRows.map((e) => [e.id, { name: e.name, ageMa: Number(e.ageMa), uncertaintyMa: e.uncertaintyMa == null ? null : Number(e.uncertaintyMa), citation: e.citation }]));
  const insets: InsetSpec[] = (await m.Inset.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]], transaction })).map((r) => ({ id: `inset-${r.id}`, label: r.label, olderMa: Number(r.olderMa), youngerMa: Number(r.youngerMa), magnification: r.magnification }));
  const markers = resolveMarkers(markerRows, intervalIds, events, data.intervals, edition);
  const spec: ExhibitSpec = {
    spanOlder: { value: Number(exhibit.spanOlderValue), unit: exhibit.spanOlderUnit },
    spanYounger: { value: Number(exhibit.spanYoungerValue), unit: exhibit.spanYoungerUnit },
    medium: mediumSpecOf(exhibit.medium!),
    legibility: exhibit.legibility ?? {},
    unitsPreference: exhibit.unitsPreference,
    insets,
  };
  let geometrySha256: string | null = null;
  if (exhibit.medium!.geometry) {
    const text = JSON.stringify(exhibit.medium!.geometry);
    geometrySha256 = sha256(text);
    await sequelize.query(`INSERT INTO exhibit_route_geometries (sha256, geometry, created_at) VALUES ($1, $2::jsonb, now()) ON CONFLICT (sha256) DO NOTHING`, { bind: [geometrySha256, text], transaction });
  }
  const content = revisionContent({
    title: exhibit.title,
    slug,
    edition: { id: edition.id, slug: edition.slug, label: edition.label },
    spec,
    markers,
    decaySystems: new Map(markerRows.map((r) => [String(r.id), r.decaySystemId])),
    medium: { vertexCount: exhibit.medium!.routeVertexCount, geometrySha256 },
  });
  return { exhibit, edition, intervals: data.intervals, markers, spec, content };
}

export const up: Migration = async ({ sequelize }) => {
  const models = await import("../../models/index.ts");
  models.initModels(sequelize);
  const { Organisation, User, ExhibitRevision, ExhibitReview, Publication, MarkerSign } = models;
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await sequelize.transaction(async (transaction) => {
    const org = await Organisation.findOne({ where: { slug: "marrowby" }, transaction });
    const [designer, reviewer] = await Promise.all(["designer@marrowby.example", "reviewer@marrowby.example"].map((email) => User.findOne({ where: { email }, transaction })));
    if (!org || !designer || !reviewer) throw new Error("the Marrowby team and exhibits must be seeded first");
    const now = new Date();
    const [[curator]] = (await sequelize.query(
      `INSERT INTO users (email, name, password_hash, created_at, updated_at) VALUES ($1, $2, $3, $4, $4)
       ON CONFLICT (email) DO UPDATE SET name = EXCLUDED.name RETURNING id`,
      { bind: [DEMO_CURATOR.email, DEMO_CURATOR.name, hash, now], transaction },
    )) as [{ id: number }[], unknown];
    await sequelize.query(
      `INSERT INTO memberships (user_id, organisation_id, roles, created_at, updated_at) VALUES ($1, $2, ARRAY['designer', 'reviewer']::enum_memberships_roles[], $3, $3)
       ON CONFLICT (user_id, organisation_id) DO NOTHING`,
      { bind: [curator.id, org.id, now], transaction },
    );

    for (const slug of ["riverside-walk", "corridor-wall", "school-rope"]) {
      const loaded = await load(sequelize, org.id, slug, transaction);
      if (!loaded) continue;
      const { exhibit, content } = loaded;
      const kept = await ExhibitRevision.findOne({ where: { exhibitId: exhibit.id, revision: exhibit.revision }, transaction });
      if (!kept) await ExhibitRevision.create({ exhibitId: exhibit.id, revision: exhibit.revision, authorId: exhibit.updatedById ?? designer.id, action: "create", content }, { transaction });
      if (slug === "school-rope" && exhibit.status === "draft") {
        await exhibit.update({ status: "in_review", statusChangedAt: now }, { transaction, silent: true });
      }
      if (slug !== "riverside-walk" || (await Publication.count({ where: { exhibitId: exhibit.id }, transaction })) > 0) continue;

      // Approved by the reviewer, against the checks as the server computes them.
      const { markers, spec, intervals, edition } = loaded;
      const [boundaries] = (await sequelize.query(
        `SELECT m.id AS "markerId", i.name AS "intervalName", i.edition_id AS "editionId", i.base_ma AS "baseMa" FROM markers m JOIN intervals i ON i.id = m.interval_id WHERE m.exhibit_id = $1`,
        { bind: [exhibit.id], transaction },
      )) as [{ markerId: number; intervalName: string; editionId: number; baseMa: string }[], unknown];
      const images = await markerImages(sequelize, exhibit.id, transaction);
      const report = runChecks({
        revision: exhibit.revision,
        spec,
        markers,
        edition: { id: edition.id, slug: edition.slug, label: edition.label, intervals },
        boundaries: boundaries.map((b) => ({ markerId: String(b.markerId), intervalName: b.intervalName, editionId: b.editionId, baseMa: Number(b.baseMa) })),
        acknowledgements: [],
        images: new Map([...images].map(([id, image]) => [id, { alt: image.alt }])),
        recheck: null,
      });
      if (report.overall === "fail") throw new Error(`riverside-walk fails its checks: ${failuresInWords(report)}`);
      const approvedAt = new Date(now.getTime() - 60_000);
      await ExhibitReview.create({ exhibitId: exhibit.id, revision: exhibit.revision, reviewerId: reviewer.id, decision: "approved", comment: "Every boundary matches ICS 2024/12; sources are given. Approved for the riverside signs.", checks: report }, { transaction });

      // Published by the designer: publication 1, sign numbers 1…N from the older end.
      const computed = computeExhibit(spec, markers, standardDurations());
      if (!computed.ok) throw new Error(`riverside-walk does not compute: ${computed.message}`);
      const plan = planSigns(markers, [], 1);
      const snapshot = buildSnapshot({
        organisation: { slug: org.slug, name: org.name },
        exhibit: { slug, title: exhibit.title, revision: exhibit.revision },
        spec,
        markers,
        result: computed.result,
        edition: { slug: edition.slug, label: edition.label, source: edition.source, licence: edition.licence },
        intervals,
        html: new Map(markers.map((x) => [x.id, render(x.text)])),
        decay: new Map(),
        images,
        signs: plan.numbers,
        retiredSigns: plan.retiredSigns,
      });
      const canonical = canonicalJson(snapshot);
      const digest = sha256(canonical);
      for (const s of plan.created) await MarkerSign.create({ exhibitId: exhibit.id, number: s.number, markerId: Number(s.markerId), label: s.label, firstPublication: 1, retiredAtPublication: null, absorbedByNumber: null }, { transaction });
      await Publication.create(
        {
          exhibitId: exhibit.id, number: 1, revision: exhibit.revision, editionId: edition.id, approvedById: reviewer.id, publishedById: designer.id, approvedAt, publishedAt: now,
          meta: { number: 1, hash: digest, publishedAt: now.toISOString(), approvedBy: reviewer.name, edition: { slug: edition.slug, label: edition.label } },
          snapshot, snapshotCanonical: canonical, sha256: digest,
        },
        { transaction },
      );
      await exhibit.update({ status: "published", approvedRevision: exhibit.revision, approvedById: reviewer.id, approvedAt, statusChangedAt: now }, { transaction, silent: true });
    }
  });
};

// Publications are immutable (the database refuses to delete them): only the curator and the
// lifecycle state are undone; riverside-walk's publication stays.
export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`DELETE FROM users WHERE email = $1`, { bind: [DEMO_CURATOR.email] });
  await sequelize.query(`UPDATE exhibits SET status = 'draft' WHERE slug = 'school-rope' AND status = 'in_review'`);
};
