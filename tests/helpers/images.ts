// Test images made here with sharp (our own drawings and noise, no third-party photos) and the
// hostile files the upload must refuse.
import { crc32 } from "node:zlib";
import sharp from "sharp";

/** The GPS IFD pointer tag (0x8825) as it appears in a big-endian EXIF block. */
export const GPS_TAG = Buffer.from([0x88, 0x25]);

/** Does a file carry an EXIF block at all (the APP1/chunk header "Exif\0\0")? */
export function hasExifBlock(bytes: Uint8Array): boolean {
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).includes(Buffer.from("Exif\0\0", "latin1"));
}

/** Does an EXIF block (sharp's metadata().exif) hold a GPS directory? */
export function hasGps(exif: Buffer | undefined): boolean {
  return Boolean(exif && (exif.includes(GPS_TAG) || exif.includes(Buffer.from([0x25, 0x88]))));
}

/** A JPEG photo-like image with EXIF GPS (a protected site's position) and, optionally, an EXIF orientation. */
export async function jpegWithGps(width: number, height: number, opts: { orientation?: number; noise?: boolean } = {}): Promise<Buffer> {
  const drawing = Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><rect width="100%" height="100%" fill="#d8c7a0"/>` +
      `<path d="M0 ${height * 0.7} Q ${width * 0.3} ${height * 0.5} ${width * 0.6} ${height * 0.65} T ${width} ${height * 0.6} V ${height} H 0 Z" fill="#7a5a3a"/>` +
      `<circle cx="${width * 0.3}" cy="${height * 0.35}" r="${Math.min(width, height) * 0.15}" fill="#3d5a6c"/></svg>`,
  );
  let image = sharp(drawing);
  if (opts.noise) {
    const noise = await sharp({ create: { width, height, channels: 3, background: "#808080", noise: { type: "gaussian", mean: 128, sigma: 30 } } }).png({ compressionLevel: 1 }).toBuffer();
    image = sharp(await image.png({ compressionLevel: 1 }).toBuffer()).composite([{ input: noise, blend: "soft-light" }]);
  }
  let out = image.jpeg({ quality: 88 }).withExif({ IFD0: { Make: "Eonscale test camera" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "54/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "3/1 1/1 0/1" } });
  if (opts.orientation) out = out.withMetadata({ orientation: opts.orientation });
  return out.toBuffer();
}

/** A PNG with transparency. */
export function pngWithAlpha(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 4, background: { r: 40, g: 90, b: 60, alpha: 0.4 } } }).png().toBuffer();
}

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

/** A pixel bomb: a tiny PNG whose header claims width × height pixels. */
export function pngBomb(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 0, 0, 0, 0], 8); // 8-bit greyscale
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])), chunk("IEND", Buffer.alloc(0))]);
}

export const SVG_WITH_SCRIPT = `<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><script>alert(document.cookie)</script><rect width="100" height="100" fill="red"/></svg>`;
export const HTML_PAGE = `<!doctype html><html><body><img src=x onerror="alert(1)"></body></html>`;

/** A ZIP archive (local file header, one stored entry, central directory) — to be sent named .jpg. */
export function zipArchive(): Buffer {
  const name = Buffer.from("notes.txt");
  const content = Buffer.from("not an image\n");
  const crc = crc32(content) >>> 0;
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(10, 4);
  local.writeUInt32LE(crc, 14);
  local.writeUInt32LE(content.length, 18);
  local.writeUInt32LE(content.length, 22);
  local.writeUInt16LE(name.length, 26);
  const central = Buffer.alloc(46);
  central.writeUInt32LE(0x02014b50, 0);
  central.writeUInt16LE(10, 4);
  central.writeUInt16LE(10, 6);
  central.writeUInt32LE(crc, 16);
  central.writeUInt32LE(content.length, 20);
  central.writeUInt32LE(content.length, 24);
  central.writeUInt16LE(name.length, 28);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(central.length + name.length, 12);
  end.writeUInt32LE(local.length + name.length + content.length, 16);
  return Buffer.concat([local, name, content, central, name, end]);
}

/** A multipart upload request to POST /api/assets. */
export function uploadRequest(files: { name: string; type: string; bytes: Uint8Array }[], cookie?: string, base = "http://test.local") {
  const form = new FormData();
  for (const f of files) form.append("file", new File([f.bytes as Uint8Array<ArrayBuffer>], f.name, { type: f.type }));
  return new Request(`${base}/api/assets`, { method: "POST", body: form, headers: cookie ? { Cookie: cookie } : {} });
}

/**
 * Points this test process at its own bucket on the shared s3rver (created if missing), so its
 * objects and sweeps never meet another database's — test databases all number assets from 1.
 */
export async function useOwnBucket(name: string, endpoint?: string) {
  const { CreateBucketCommand } = await import("@aws-sdk/client-s3");
  const { resetEnvForTests } = await import("../../server/env.server.ts");
  const { storage } = await import("../../server/storage/s3.server.ts");
  process.env.S3_BUCKET = name.toLowerCase().replace(/[^a-z0-9-]/g, "-").slice(0, 63);
  if (endpoint) process.env.S3_ENDPOINT = endpoint;
  resetEnvForTests();
  const s = storage();
  await s.client.send(new CreateBucketCommand({ Bucket: s.bucket })).catch((error: { name?: string }) => {
    if (error.name !== "BucketAlreadyOwnedByYou" && error.name !== "BucketAlreadyExists") throw error;
  });
  return s.bucket;
}
