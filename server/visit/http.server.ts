// HTTP for the visitor pages (/visit/:org/:slug, /visit/:org/:slug/:number, /visit/:org/:slug/embed),
// in front of React Router: the language is chosen (?lang=, then Accept-Language), the ETag is made
// from the publication hash + language + build id and a matching If-None-Match is answered 304
// before anything is rendered; rendered pages are kept (compressed once, gzip and Brotli) in a small
// cache keyed by address + language + ETag, so the same publication, language and build always give
// the same bytes. No session is read and no cookie is set; headers say Vary: Accept-Language.
import { brotliCompressSync, constants as zlib, gzipSync } from "node:zlib";
import type { NextFunction, Request as ExpressRequest, Response as ExpressResponse } from "express";
import { negotiateLanguage } from "../../app/lib/visit/language.ts";
import { logger } from "../logger.server.ts";
import { visitHead } from "./pages.server.ts";

/** Pages change only with a new publication or a new build: a CDN may serve a copy for five minutes and revalidate after. */
export const VISIT_CACHE_CONTROL = "public, max-age=300, stale-while-revalidate=86400";
const CACHE_BYTES = 32 * 1024 * 1024;

/** /visit/:org/:slug, /visit/:org/:slug/:number and /visit/:org/:slug/embed (QR images are resource routes of their own). */
const PAGE = /^\/visit\/([a-z0-9][a-z0-9-]{0,99})\/([a-z0-9][a-z0-9-]{0,99})(?:\/(embed|\d{1,9}))?\/?$/;

/** Is this a visitor page address (no per-request nonce, no framing rules of the studio)? */
export function isVisitorPath(path: string): boolean {
  return path === "/visit" || path.startsWith("/visit/");
}

export function isEmbedPath(path: string): boolean {
  return /^\/visit\/[^/]+\/[^/]+\/embed\/?$/.test(path);
}

interface Kept {
  status: number;
  contentType: string;
  identity: Buffer;
  gzip: Buffer;
  br: Buffer;
}

const kept = new Map<string, Kept>();
let keptBytes = 0;

function keep(key: string, page: Kept) {
  const size = page.identity.length + page.gzip.length + page.br.length;
  if (size > CACHE_BYTES / 8) return;
  while (keptBytes + size > CACHE_BYTES && kept.size) {
    const [oldest, old] = kept.entries().next().value!;
    kept.delete(oldest);
    keptBytes -= old.identity.length + old.gzip.length + old.br.length;
  }
  kept.set(key, page);
  keptBytes += size;
}

/** Tests and the benchmark: drop the rendered pages. */
export function forgetVisitPages() {
  kept.clear();
  keptBytes = 0;
}

export function visitEtag(sha256: string, lang: string, buildId: string): string {
  return `"${sha256.slice(0, 32)}-${lang}-${buildId}"`;
}

function ifNoneMatch(header: string | undefined, etag: string): boolean {
  if (!header) return false;
  const bare = etag.replace(/^W\//, "");
  return header.split(",").some((t) => t.trim() === "*" || t.trim().replace(/^W\//, "") === bare);
}

function pickEncoding(accept: string | undefined): "br" | "gzip" | null {
  const a = (accept ?? "").toLowerCase();
  if (/\bbr\b(?!;q=0(\.0*)?\b)/.test(a)) return "br";
  if (/\bgzip\b(?!;q=0(\.0*)?\b)/.test(a)) return "gzip";
  return null;
}

export interface VisitorPagesOptions {
  /** The React Router build's version (changes with every build). */
  buildId: () => Promise<string>;
  /** Renders one page through React Router (a Fetch Request in, a Response out). */
  render: (request: Request) => Promise<Response>;
  /** The public base URL (for the Request handed to React Router). */
  origin: string;
}

export function visitorPages(options: VisitorPagesOptions) {
  return async (req: ExpressRequest, res: ExpressResponse, next: NextFunction) => {
    if (req.method !== "GET" && req.method !== "HEAD") return next();
    const m = PAGE.exec(req.path);
    if (!m) return next();
    try {
      const [, org, slug, rest] = m;
      const head = await visitHead(org, slug);
      if (!head) return next(); // React Router answers 404 with the page that says so
      const query = typeof req.query.lang === "string" ? req.query.lang : null;
      if (head.moved) {
        const search = req.originalUrl.includes("?") ? req.originalUrl.slice(req.originalUrl.indexOf("?")) : "";
        res.redirect(301, `/visit/${head.org}/${head.slug}${rest ? `/${rest}` : ""}${search}`);
        return;
      }
      const lang = negotiateLanguage(query, req.get("Accept-Language"), head.languages);
      const etag = visitEtag(head.sha256, lang, await options.buildId());
      res.set({ ETag: etag, "Cache-Control": VISIT_CACHE_CONTROL, Vary: "Accept-Language, Accept-Encoding", "Content-Language": lang });
      if (ifNoneMatch(req.get("If-None-Match"), etag)) {
        res.status(304).end();
        return;
      }
      const key = `${req.path}\u0000${lang}\u0000${etag}`;
      let page = kept.get(key);
      if (!page) {
        const url = new URL(req.originalUrl, options.origin);
        const response = await options.render(new Request(url, { headers: { "Accept-Language": req.get("Accept-Language") ?? "", Accept: "text/html" } }));
        if (response.status !== 200) {
          // Redirects (an absorbed sign) and 404s / 410s pass through, not cached here.
          res.removeHeader("ETag");
          res.set("Cache-Control", response.status >= 300 && response.status < 400 ? VISIT_CACHE_CONTROL : "public, max-age=60");
          res.status(response.status);
          const location = response.headers.get("Location");
          if (location) res.set("Location", location);
          res.type(response.headers.get("Content-Type") ?? "text/html");
          res.end(Buffer.from(await response.arrayBuffer())); // end, not send: no Express ETag on a page that is not kept
          return;
        }
        const identity = Buffer.from(await response.arrayBuffer());
        page = {
          status: 200,
          contentType: response.headers.get("Content-Type") ?? "text/html; charset=utf-8",
          identity,
          gzip: gzipSync(identity, { level: 9 }),
          br: brotliCompressSync(identity, { params: { [zlib.BROTLI_PARAM_QUALITY]: 11, [zlib.BROTLI_PARAM_SIZE_HINT]: identity.length } }),
        };
        keep(key, page);
      }
      const encoding = pickEncoding(req.get("Accept-Encoding"));
      const body = encoding ? page[encoding] : page.identity;
      res.status(page.status).set({ "Content-Type": page.contentType, "Content-Length": String(body.length) });
      if (encoding) res.set("Content-Encoding", encoding);
      if (req.method === "HEAD") res.end();
      else res.end(body);
    } catch (error) {
      logger.error({ err: error }, "visitor page failed");
      next(error);
    }
  };
}

/** Lets any site frame this response (the embeddable strip); every other page keeps refusing it. */
export function allowFraming(res: ExpressResponse) {
  res.removeHeader("X-Frame-Options");
  const csp = res.getHeader("Content-Security-Policy");
  if (typeof csp === "string") res.setHeader("Content-Security-Policy", csp.replace(/frame-ancestors [^;]*/, "frame-ancestors *"));
}
