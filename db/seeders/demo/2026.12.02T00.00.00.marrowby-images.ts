// Demo images (invented, drawn here): three riverside-walk markers get pictures made from our own
// SVG drawings with sharp — a trilobite, an ammonite, the Marrowby mill. No third-party photos.
// The originals go to S3 and the assets start as "processing": the app's image worker makes the
// sizes when the server starts (it picks up every asset still processing). Without S3 settings
// (S3_ENDPOINT, S3_BUCKET) the images are skipped.
import { CreateBucketCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import sharp from "sharp";
import type { Migration } from "../../migrator.ts";

const W = 1600;
const H = 1000;
const frame = (body: string, sky = "#e9dfc8") =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}"><rect width="${W}" height="${H}" fill="${sky}"/>${body}</svg>`;

function trilobite(): string {
  const segments = Array.from({ length: 11 }, (_, i) => {
    const y = 330 + i * 38;
    const half = 190 - i * 9;
    return `<path d="M ${800 - half} ${y} Q 800 ${y + 26} ${800 + half} ${y}" stroke="#4a3b2a" stroke-width="9" fill="none"/>`;
  }).join("");
  return frame(
    `<rect y="760" width="${W}" height="240" fill="#9c8f7a"/>` +
      `<ellipse cx="800" cy="500" rx="260" ry="330" fill="#7d6a52"/>` +
      `<path d="M 560 300 Q 800 120 1040 300 L 1000 340 Q 800 230 600 340 Z" fill="#5b4a36"/>` +
      `<ellipse cx="720" cy="265" rx="26" ry="18" fill="#2e2418"/><ellipse cx="880" cy="265" rx="26" ry="18" fill="#2e2418"/>` +
      `<rect x="770" y="320" width="60" height="480" rx="30" fill="#6a5843"/>` +
      segments,
  );
}

function ammonite(): string {
  const turns: string[] = [];
  let r = 340;
  for (let i = 0; i < 5; i++, r *= 0.62) turns.push(`<circle cx="800" cy="500" r="${r.toFixed(1)}" fill="none" stroke="#3f4f5a" stroke-width="${(16 - i * 2).toFixed(0)}"/>`);
  const ribs = Array.from({ length: 36 }, (_, i) => {
    const a = (i / 36) * Math.PI * 2;
    const x1 = 800 + Math.cos(a) * 215;
    const y1 = 500 + Math.sin(a) * 215;
    const x2 = 800 + Math.cos(a) * 335;
    const y2 = 500 + Math.sin(a) * 335;
    return `<line x1="${x1.toFixed(1)}" y1="${y1.toFixed(1)}" x2="${x2.toFixed(1)}" y2="${y2.toFixed(1)}" stroke="#56697a" stroke-width="7"/>`;
  }).join("");
  return frame(`<circle cx="800" cy="500" r="350" fill="#b7c2c4"/>${ribs}${turns.join("")}`, "#d9d3c3");
}

function mill(): string {
  return frame(
    `<rect y="700" width="${W}" height="300" fill="#5d7f95"/>` +
      `<path d="M 0 700 Q 400 660 800 700 T 1600 690 V 720 H 0 Z" fill="#7fa0b3"/>` +
      `<rect x="520" y="330" width="520" height="380" fill="#b5654a"/>` +
      `<path d="M 490 340 L 780 170 L 1070 340 Z" fill="#5a3b30"/>` +
      Array.from({ length: 6 }, (_, i) => `<rect x="${570 + (i % 3) * 160}" y="${400 + Math.floor(i / 3) * 140}" width="80" height="90" fill="#f1e6c8"/>`).join("") +
      `<circle cx="470" cy="600" r="150" fill="none" stroke="#3b2f28" stroke-width="22"/>` +
      Array.from({ length: 8 }, (_, i) => {
        const a = (i / 8) * Math.PI;
        return `<line x1="${(470 - Math.cos(a) * 150).toFixed(1)}" y1="${(600 - Math.sin(a) * 150).toFixed(1)}" x2="${(470 + Math.cos(a) * 150).toFixed(1)}" y2="${(600 + Math.sin(a) * 150).toFixed(1)}" stroke="#3b2f28" stroke-width="12"/>`;
      }).join(""),
    "#cfe0e6",
  );
}

const CREDIT = "Drawing: Marrowby Museum of the Earth (invented demo), made for Eonscale";
const PICTURES = [
  { labels: ["Cambrian explosion begins", "Base of the Phanerozoic, Paleozoic and Cambrian", "Base of the Cambrian"], svg: trilobite, alt: "Drawing of a trilobite seen from above: a rounded head shield with two eyes and a body of curved segments.", file: "trilobite.jpg" },
  { labels: ["Base of the Jurassic"], svg: ammonite, alt: "Drawing of an ammonite shell: a flat coil of whorls with fine ribs, grey-blue like polished shale.", file: "ammonite.jpg" },
  { labels: ["Marrowby mill built"], svg: mill, alt: "Drawing of the red-brick Marrowby mill by the river, with its wooden water wheel turning.", file: "mill.jpg" },
];

function client() {
  const { S3_ENDPOINT: endpoint, S3_BUCKET: bucket, S3_REGION: region = "us-east-1", S3_ACCESS_KEY_ID: accessKeyId, S3_SECRET_ACCESS_KEY: secretAccessKey } = process.env;
  if (!endpoint || !bucket) return null;
  const s3 = new S3Client({
    endpoint,
    region,
    forcePathStyle: true,
    credentials: accessKeyId && secretAccessKey ? { accessKeyId, secretAccessKey } : undefined,
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return { s3, bucket };
}

export const up: Migration = async ({ sequelize }) => {
  const storage = client();
  if (!storage) {
    console.warn("[demo] S3 is not configured (S3_ENDPOINT, S3_BUCKET): the demo images are skipped.");
    return;
  }
  await storage.s3.send(new CreateBucketCommand({ Bucket: storage.bucket })).catch((error: { name?: string }) => {
    if (error.name !== "BucketAlreadyOwnedByYou" && error.name !== "BucketAlreadyExists") throw error;
  });
  try {
    await sequelize.transaction(async (transaction) => {
      const [exhibits] = (await sequelize.query(
        `SELECT e.id, e.organisation_id, (SELECT id FROM users WHERE email = 'designer@marrowby.example') AS designer
         FROM exhibits e JOIN organisations o ON o.id = e.organisation_id WHERE o.slug = 'marrowby' AND e.slug = 'riverside-walk'`,
        { transaction },
      )) as [{ id: number; organisation_id: number; designer: number | null }[], unknown];
      const walk = exhibits[0];
      if (!walk) return;
      const now = new Date();
      for (const p of PICTURES) {
        const [markers] = (await sequelize.query(`SELECT id FROM markers WHERE exhibit_id = $1 AND label = ANY($2) ORDER BY array_position($2, label::text), id LIMIT 1`, { bind: [walk.id, p.labels], transaction })) as [{ id: number }[], unknown];
        if (!markers[0]) continue;
        const [used] = (await sequelize.query(`SELECT 1 FROM image_uses WHERE marker_id = $1`, { bind: [markers[0].id], transaction })) as [unknown[], unknown];
        if (used.length) continue;
        const bytes = await sharp(Buffer.from(p.svg())).jpeg({ quality: 90 }).toBuffer();
        const [[{ id }]] = (await sequelize.query(`SELECT nextval(pg_get_serial_sequence('assets', 'id'))::int AS id`, { transaction })) as [{ id: number }[], unknown];
        const key = `assets/${id}/original`;
        await storage.s3.send(new PutObjectCommand({ Bucket: storage.bucket, Key: key, Body: bytes, ContentType: "image/jpeg", ContentLength: bytes.byteLength, CacheControl: "private, no-store" }));
        await sequelize.query(
          `INSERT INTO assets (id, organisation_id, uploaded_by_id, original_key, original_name, format, bytes, width, height, status, alt, credit, created_at, updated_at)
           VALUES ($1, $2, $3, $4, $5, 'jpeg', $6, $7, $8, 'processing', $9, $10, $11, $11)`,
          { bind: [id, walk.organisation_id, walk.designer, key, p.file, bytes.byteLength, W, H, p.alt, CREDIT, now], transaction },
        );
        await sequelize.query(`INSERT INTO image_uses (exhibit_id, marker_id, asset_id, alt, credit, created_at, updated_at) VALUES ($1, $2, $3, $4, $5, $6, $6)`, {
          bind: [walk.id, markers[0].id, id, p.alt, CREDIT, now],
          transaction,
        });
      }
    });
  } finally {
    storage.s3.destroy();
  }
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(
    `DELETE FROM image_uses WHERE exhibit_id IN (SELECT e.id FROM exhibits e JOIN organisations o ON o.id = e.organisation_id WHERE o.slug = 'marrowby' AND e.slug = 'riverside-walk')`,
  );
};
