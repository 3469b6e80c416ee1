// No shared cache (CDN, proxy) ever keeps a studio page or a signed-in response. Set in front of
// every route (server/app.ts), decided just before the headers go out:
//   - a studio page or its data (/studio, /studio/…, /studio.data), a request carrying the session
//     cookie, or a response setting a cookie → `Cache-Control: private, no-store`, unless the route
//     already said `private` (its own choice, e.g. a draft image's private caching);
//   - a route's explicit `public` (published, identical for everyone) is kept on signed-in requests,
//     but never on a response that sets a cookie.
import type { NextFunction, Request, RequestHandler, Response } from "express";
import type { ServerResponse } from "node:http";

export const PRIVATE_NO_STORE = "private, no-store";
const SESSION_COOKIE = /(?:^|;\s*)en_session=/;

export function isStudioPath(path: string): boolean {
  return path === "/studio" || path.startsWith("/studio/") || path.startsWith("/studio.");
}

/** The Cache-Control a response must carry, given what the route set (pure). */
export function cacheControlFor(input: { studio: boolean; signedIn: boolean; setsCookie: boolean; routeValue: string }): string {
  const value = input.routeValue.toLowerCase();
  const says = (word: string) => new RegExp(`(^|[\\s,])${word}($|[\\s,=])`).test(value);
  if (input.setsCookie && !says("private")) return PRIVATE_NO_STORE;
  if ((input.studio || input.signedIn) && !says("private") && !(says("public") && !input.studio)) return PRIVATE_NO_STORE;
  return input.routeValue;
}

export function privateResponses(): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    const studio = isStudioPath(req.path);
    const signedIn = SESSION_COOKIE.test(req.headers.cookie ?? "");
    const writeHead = res.writeHead;
    res.writeHead = function (this: ServerResponse, ...args: unknown[]) {
      const routeValue = String(this.getHeader("Cache-Control") ?? "");
      const value = cacheControlFor({ studio, signedIn, setsCookie: this.hasHeader("Set-Cookie"), routeValue });
      if (value !== routeValue) this.setHeader("Cache-Control", value);
      return (writeHead as (...a: unknown[]) => ServerResponse).apply(this, args);
    } as typeof res.writeHead;
    next();
  };
}
