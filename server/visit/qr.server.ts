// QR codes for the signs: the absolute marker-page URL (APP_URL + /visit/:org/:slug/:number),
// error correction level Q (25 % of the code may be lost — outdoor signs get scratched) and a quiet
// zone of 4 modules on every side (ISO/IEC 18004), made by the qrcode package. Only for sign
// numbers of the latest publication. The picture depends only on the URL, so its ETag does too.
import { createHash } from "node:crypto";
import QRCode from "qrcode";
import { env } from "../env.server.ts";
import { publicJsonError } from "../editions/http.server.ts";
import { visitPublication } from "./pages.server.ts";

export const QR_ERROR_CORRECTION = "Q" as const;
export const QR_QUIET_ZONE_MODULES = 4;
const QR_CACHE_CONTROL = "public, max-age=86400, stale-while-revalidate=604800";

export function markerUrl(org: string, slug: string, number: number): string {
  return new URL(`/visit/${org}/${slug}/${number}`, env().APP_URL).toString();
}

export async function qrResponse(request: Request, org: string, slug: string, rawNumber: string, format: "svg" | "png"): Promise<Response> {
  if (!/^\d{1,9}$/.test(rawNumber)) return publicJsonError(404, "A sign number is a whole number.");
  const number = Number(rawNumber);
  const pub = await visitPublication(org, slug);
  if (!pub) return publicJsonError(404, "No published exhibit at this address.");
  if (!pub.snapshot.markers.some((m) => m.signNumber === number)) return publicJsonError(404, `This exhibit has no sign ${number}.`);
  const url = markerUrl(pub.head.org, pub.head.slug, number);
  const etag = `"${createHash("sha256").update(`${format}\n${url}`).digest("base64url").slice(0, 27)}"`;
  const headers = { ETag: etag, "Cache-Control": QR_CACHE_CONTROL, "Access-Control-Allow-Origin": "*" };
  if ((request.headers.get("If-None-Match") ?? "").split(",").some((t) => t.trim() === etag)) return new Response(null, { status: 304, headers });
  const options = { errorCorrectionLevel: QR_ERROR_CORRECTION, margin: QR_QUIET_ZONE_MODULES } as const;
  if (format === "svg") {
    const svg = await QRCode.toString(url, { ...options, type: "svg" });
    return new Response(svg, { headers: { ...headers, "Content-Type": "image/svg+xml; charset=utf-8" } });
  }
  const png = await QRCode.toBuffer(url, { ...options, type: "png", scale: 10 });
  return new Response(new Uint8Array(png), { headers: { ...headers, "Content-Type": "image/png" } });
}
