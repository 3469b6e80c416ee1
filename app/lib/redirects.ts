// Where the app may send someone after a form or a sign-in: a path on this site, nothing else.
// One rule for every user-supplied destination (`redirectTo` on /login, /studio/editions, …).
//
// The rule is strict on purpose. A destination is kept only when
//   - it is text of printable ASCII (U+0021–U+007E): no space, tab, CR, LF, NUL or other control
//     character, and no character outside ASCII such as U+3000 (the browser's URL parser drops tab
//     and newlines, so "/\t/evil.example" would become "//evil.example"; CR/LF cannot go in a header);
//     our own links percent-encode everything else, so nothing legitimate is lost;
//   - it starts with one "/" (not "//", which is another host) and holds no "\" anywhere (browsers
//     read "\" as "/" in http(s) URLs);
//   - resolved against a placeholder origin (WHATWG URL, as browsers resolve a Location header), it
//     stays on that origin.
// The answer is the resolved path, query and fragment, so dot segments are already applied.
// Anything else gives the fallback; the function never throws.

const PLACEHOLDER_ORIGIN = "https://same-site.invalid";
const MAX_LENGTH = 2000;

/** `to` when it is a path on this site (normalised), else `fallback`. */
export function safeRedirectPath(to: unknown, fallback: string): string {
  if (typeof to !== "string" || to.length === 0 || to.length > MAX_LENGTH) return fallback;
  if (!/^[\x21-\x7e]+$/.test(to)) return fallback;
  if (!to.startsWith("/") || to.startsWith("//") || to.includes("\\")) return fallback;
  let url: URL;
  try {
    url = new URL(to, PLACEHOLDER_ORIGIN);
  } catch {
    return fallback;
  }
  if (url.origin !== PLACEHOLDER_ORIGIN) return fallback;
  const path = url.pathname + url.search + url.hash;
  // Re-check the result: a path that normalises to "//…" would be read as another host.
  return path.startsWith("/") && !path.startsWith("//") ? path : fallback;
}
