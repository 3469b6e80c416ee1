// Who uses an image: markers and covers (image_uses), publication snapshots and kept revisions.
// Snapshots and revisions are JSON documents of the review/publication feature; an image is
// mentioned there by its `"assetId": <id>` key or a /media/<id>/ URL. Their tables are found by name
// (publication… / …revision…) and their JSON columns from the catalogue, so this keeps working as
// that feature's tables change, and asks nothing while they do not exist.
import { QueryTypes, type Transaction } from "sequelize";
import { mediaUrl, PRINT_FILE, type ComposerImage, type ImageSize, type UsedImage } from "../../app/lib/images.ts";
import { Asset, Exhibit, ImageUse } from "../../db/models/index.ts";
import type { AssetFile } from "../../db/models/asset.ts";
import { sequelize } from "../db.server.ts";

interface JsonColumn {
  table: string;
  column: string;
}

async function jsonColumns(kind: "publications" | "kept", transaction?: Transaction): Promise<JsonColumn[]> {
  const pattern = kind === "publications" ? "%publication%" : "%revision%";
  return sequelize.query<JsonColumn>(
    `SELECT c.table_name AS "table", c.column_name AS "column" FROM information_schema.columns c
     JOIN information_schema.tables t ON t.table_schema = c.table_schema AND t.table_name = c.table_name AND t.table_type = 'BASE TABLE'
     WHERE c.table_schema = current_schema() AND c.data_type IN ('jsonb', 'json') AND c.table_name LIKE $1 AND c.table_name NOT IN ('assets', 'image_uses')`,
    { bind: [pattern], type: QueryTypes.SELECT, transaction },
  );
}

async function mentionedIn(columns: JsonColumn[], assetId: number, transaction?: Transaction): Promise<boolean> {
  for (const { table, column } of columns) {
    const [row] = await sequelize.query<{ hit: boolean }>(
      `SELECT EXISTS (SELECT 1 FROM "${table.replace(/"/g, "")}" WHERE "${column.replace(/"/g, "")}"::text ~ $1 OR strpos("${column.replace(/"/g, "")}"::text, $2) > 0) AS hit`,
      { bind: [`"assetId": ?${assetId}[,} ]`, `/media/${assetId}/`], type: QueryTypes.SELECT, transaction },
    );
    if (row?.hit) return true;
  }
  return false;
}

/** Does a publication use the image? Then it is public, and its files are never removed. */
export async function publishedUse(assetId: number): Promise<boolean> {
  return mentionedIn(await jsonColumns("publications"), assetId);
}

/** Does a publication or a kept revision mention the image? */
export async function assetMentioned(assetId: number, transaction?: Transaction): Promise<boolean> {
  return mentionedIn([...(await jsonColumns("publications", transaction)), ...(await jsonColumns("kept", transaction))], assetId, transaction);
}

/** May this viewer (their active organisation, or null when signed out) see the asset and its files? */
export async function canViewAsset(asset: Asset, organisationId: number | null): Promise<boolean> {
  return asset.organisationId === organisationId || (await publishedUse(asset.id));
}

/** The served web sizes of an asset (WebP, JPEG and, once made, AVIF). */
export function sizesOf(asset: Pick<Asset, "id" | "files">): ImageSize[] {
  return (asset.files as AssetFile[])
    .filter((f) => f.role === "web")
    .sort((a, b) => a.width - b.width || a.format.localeCompare(b.format))
    .map((f) => ({ width: f.width, format: f.format, url: mediaUrl(asset.id, f.file) }));
}

/** The print master's URL and size, once processed. */
export function printOf(asset: Pick<Asset, "id" | "files">): { url: string; width: number; height: number } | null {
  const f = (asset.files as AssetFile[]).find((x) => x.role === "print");
  return f ? { url: mediaUrl(asset.id, PRINT_FILE), width: f.width, height: f.height } : null;
}

/** GET /api/assets/:id's body. */
export function assetJson(asset: Asset) {
  return {
    id: asset.id,
    status: asset.status,
    width: asset.width,
    height: asset.height,
    alt: asset.alt,
    credit: asset.credit,
    sizes: asset.status === "ready" ? sizesOf(asset) : [],
    ...(asset.status === "failed" ? { error: asset.error ?? "Processing failed." } : {}),
  };
}

async function usesOf(exhibitId: number): Promise<ImageUse[]> {
  return ImageUse.findAll({ where: { exhibitId }, include: [{ model: Asset, as: "asset" }], order: [["id", "ASC"]] });
}

function usedImage(use: ImageUse): UsedImage {
  const asset = use.asset!;
  return { assetId: asset.id, alt: use.alt, credit: use.credit, sizes: asset.status === "ready" ? sizesOf(asset) : [] };
}

/**
 * The images of an exhibit's markers, by marker id: `{ assetId, alt, credit, sizes: [{ width,
 * format, url }] }` (sizes empty while processing). Review checks and publication snapshots read this.
 */
export async function imagesForExhibit(exhibitId: number): Promise<Map<number, UsedImage>> {
  const uses = await usesOf(exhibitId);
  return new Map(uses.filter((u) => u.markerId !== null).map((u) => [u.markerId!, usedImage(u)]));
}

/** The exhibit's cover image (same shape), or null. */
export async function coverImageOf(exhibitId: number): Promise<UsedImage | null> {
  const cover = (await usesOf(exhibitId)).find((u) => u.markerId === null);
  return cover ? usedImage(cover) : null;
}

export interface ComposerImages {
  cover: ComposerImage | null;
  markers: Record<string, ComposerImage>;
}

/** What the composer shows: every use with its processing state. */
export async function composerImages(organisationId: number, slug: string): Promise<ComposerImages> {
  const exhibit = await Exhibit.findOne({ where: { organisationId, slug }, attributes: ["id"] });
  const uses = exhibit ? await usesOf(exhibit.id) : [];
  const view = (u: ImageUse): ComposerImage => ({ ...usedImage(u), status: u.asset!.status, error: u.asset!.error ?? null, width: u.asset!.width, height: u.asset!.height });
  const cover = uses.find((u) => u.markerId === null);
  return { cover: cover ? view(cover) : null, markers: Object.fromEntries(uses.filter((u) => u.markerId !== null).map((u) => [String(u.markerId), view(u)])) };
}
