// Where requests come from and what the public address is, decided once in front of every route
// (server/app.ts mounts these before the React Router handler, so pages, resource routes without
// a component and /api/* are all covered).
//
// - The public origin is APP_URL's. React Router builds request.url from the Host header and the
//   connection's scheme; behind a TLS proxy with TRUST_PROXY=false that would be http:// and the
//   framework's own origin check would refuse every form. `publicUrl` makes every request's URL the
//   public one, so links, redirects and checks agree with the address people use.
// - A state-changing request (any method but GET, HEAD, OPTIONS) from a browser must come from a
//   page of this origin (OWASP CSRF Prevention Cheat Sheet, "Verifying Origin With Standard
//   Headers"; Fetch Metadata): `Origin` must be the public origin; without Origin, `Sec-Fetch-Site`
//   must be same-origin, or else `Referer` must be on the public origin. A request with none of the
//   three comes from no browser (scripts, other servers) and carries no ambient browser credentials;
//   it is let through to the route's own checks.
import type { NextFunction, Request, RequestHandler, Response } from "express";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export type OriginVerdict = { ok: true } | { ok: false; reason: string };

/** Is this state-changing request's origin the public one? Pure: headers in, verdict out. */
export function checkOrigin(headers: { origin?: string; referer?: string; secFetchSite?: string }, publicOrigin: string): OriginVerdict {
  const { origin, referer, secFetchSite } = headers;
  if (origin !== undefined) {
    return origin === publicOrigin ? { ok: true } : { ok: false, reason: `it was sent from ${origin === "null" ? "a page without an address" : origin}` };
  }
  if (secFetchSite !== undefined) {
    return secFetchSite === "same-origin" ? { ok: true } : { ok: false, reason: `it was sent from another site (${secFetchSite})` };
  }
  if (referer !== undefined) {
    let from: string;
    try {
      from = new URL(referer).origin;
    } catch {
      return { ok: false, reason: "its Referer is not an address" };
    }
    return from === publicOrigin ? { ok: true } : { ok: false, reason: `it was sent from ${from}` };
  }
  return { ok: true };
}

/** Refuses state-changing requests from other origins with 403 (JSON under /api/, text elsewhere). */
export function originGuard(appUrl: string): RequestHandler {
  const publicOrigin = new URL(appUrl).origin;
  return (req: Request, res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const verdict = checkOrigin(
      { origin: req.get("origin"), referer: req.get("referer"), secFetchSite: req.get("sec-fetch-site") },
      publicOrigin,
    );
    if (verdict.ok) return next();
    const message = `This request was refused because ${verdict.reason}, not from ${publicOrigin}. Open Eonscale at ${publicOrigin} and try again.`;
    res.status(403).set("Cache-Control", "no-store");
    if (req.path.startsWith("/api/")) res.json({ error: message });
    else res.type("text/plain").send(message);
  };
}

/**
 * Every request's URL as the framework sees it is on the public origin (APP_URL): scheme, host and
 * port from APP_URL, path and query from the request. Forwarded host headers are dropped.
 */
export function publicUrl(appUrl: string): RequestHandler {
  const url = new URL(appUrl);
  const protocol = url.protocol.replace(/:$/, "");
  return (req: Request, _res: Response, next: NextFunction) => {
    req.headers.host = url.host;
    delete req.headers["x-forwarded-host"];
    Object.defineProperty(req, "protocol", { value: protocol, configurable: true });
    Object.defineProperty(req, "hostname", { value: url.hostname, configurable: true });
    next();
  };
}
