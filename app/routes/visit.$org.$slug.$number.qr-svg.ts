/** GET /visit/:org/:slug/:number/qr.svg — the sign's QR code (error correction Q, quiet zone 4 modules) as SVG. */
import { qrResponse } from "#server/visit/qr.server.ts";
import type { Route } from "./+types/visit.$org.$slug.$number.qr-svg";

export function loader({ request, params }: Route.LoaderArgs) {
  return qrResponse(request, params.org, params.slug, params.number, "svg");
}
