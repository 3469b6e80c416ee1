/** GET /visit/:org/:slug/:number/qr.png — the sign's QR code (error correction Q, quiet zone 4 modules) as PNG, 10 px per module. */
import { qrResponse } from "#server/visit/qr.server.ts";
import type { Route } from "./+types/visit.$org.$slug.$number.qr-png";

export function loader({ request, params }: Route.LoaderArgs) {
  return qrResponse(request, params.org, params.slug, params.number, "png");
}
