// Eonscale's service worker for visitor pages (scope /visit/): keeps a whole exhibit — its page,
// every marker page, the styles and this site's small script — so a walker can read it with no
// signal. One cache per exhibit ("eonscale-visit:<org>/<slug>"), replaced as a whole when a newer
// publication is kept. Pages go to the network first (revalidating with the server) and fall back
// to the kept copy (also when a weak signal is too slow); styles and scripts come from the copy first.
"use strict";

const PREFIX = "eonscale-visit:";
const META = "/visit/__kept__";

self.addEventListener("install", () => self.skipWaiting());
self.addEventListener("activate", (event) => event.waitUntil(self.clients.claim()));

async function keep({ org, slug, version, urls }) {
  const name = `${PREFIX}${org}/${slug}`;
  const fresh = `${name}#${version}`;
  await caches.delete(fresh);
  const cache = await caches.open(fresh);
  let bytes = 0;
  for (const url of urls) {
    const response = await fetch(url, { cache: "no-cache", credentials: "omit" });
    if (!response.ok) throw new Error(`${url} answered ${response.status}`);
    bytes += (await response.clone().arrayBuffer()).byteLength;
    await cache.put(url, response);
  }
  const savedAt = new Date().toISOString();
  await cache.put(META, new Response(JSON.stringify({ org, slug, version, savedAt, count: urls.length, bytes }), { headers: { "Content-Type": "application/json" } }));
  // The new copy is complete: drop every older copy of this exhibit.
  for (const key of await caches.keys()) if (key.startsWith(`${name}#`) && key !== fresh) await caches.delete(key);
  return { savedAt, bytes };
}

self.addEventListener("message", (event) => {
  const port = event.ports[0];
  const data = event.data || {};
  if (data.type === "from-kept?" && port) {
    port.postMessage({ fromKept: servedFromKept.has(data.url) });
    return;
  }
  if (data.type !== "keep" || !port) return;
  event.waitUntil(
    keep(data).then(
      (result) => port.postMessage({ ok: true, ...result }),
      (error) => port.postMessage({ ok: false, reason: String(error && error.message ? error.message : error) }),
    ),
  );
});

async function fromKept(request) {
  for (const key of await caches.keys()) {
    if (!key.startsWith(PREFIX)) continue;
    const hit = await (await caches.open(key)).match(request, { ignoreVary: true });
    if (hit) return hit;
  }
  return undefined;
}

const SLOW_MS = 6000;
/** Page addresses answered from the kept copy lately (the page asks, to say "you are offline"). */
const servedFromKept = new Set();

async function networkOrKept(request) {
  const network = fetch(request, { cache: "no-cache" });
  const slow = new Promise((resolve) => setTimeout(() => resolve("slow"), SLOW_MS));
  let first;
  try {
    first = await Promise.race([network, slow]);
  } catch (error) {
    first = error;
  }
  if (first instanceof Response) {
    servedFromKept.delete(request.url);
    return first;
  }
  const kept = await fromKept(request);
  if (kept) {
    servedFromKept.add(request.url);
    return kept;
  }
  return network; // nothing kept: wait for the network after all (or its error)
}

self.addEventListener("fetch", (event) => {
  const request = event.request;
  if (request.method !== "GET") return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (request.mode === "navigate" || url.pathname.startsWith("/visit/")) {
    // Network first, always revalidated with the server (never a stale HTTP-cache copy); the kept
    // copy when there is no signal, or when a weak signal has not answered within SLOW_MS.
    event.respondWith(networkOrKept(request));
    return;
  }
  if (url.pathname.startsWith("/assets/") || url.pathname === "/visit.js" || url.pathname === "/favicon.svg") {
    event.respondWith(fromKept(request).then((kept) => kept || fetch(request)));
  }
});
