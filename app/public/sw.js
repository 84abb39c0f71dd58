// Dutymark's service worker: keeps the field-check pages usable without a network. Hand-written
// (see DEVELOPERS.md, "Decisions"): it only knows the field pages, their scripts and styles and
// the manifest; every other request goes to the network untouched.
//
// - Field pages (/field, /field/selections/:id, /field/checks/:id) and their `.data` twins:
//   network first; a good answer replaces the copy; without a network, the copy.
// - Built assets (/assets/…, content-hashed): cache first.
// - The page asks for copies ("keep" message): pages it lists and the assets it names, plus the
//   assets each kept page refers to (so a selection's route chunk is there before it is opened).
// Posts (recording a check) are never cached or replayed here: the page's own queue sends them.
const CACHE = "dutymark-field-v1";
const FIELD_PAGE = /^\/field(\/selections\/\d+|\/checks\/\d+)?(\.data)?$/;
const STATIC = /^\/(assets\/|icons\/|field\.webmanifest$)/;

self.addEventListener("install", () => self.skipWaiting());
self.addEventListener("activate", (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys()) if (name.startsWith("dutymark-field-") && name !== CACHE) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

const sameOrigin = (url) => url.origin === self.location.origin;

async function keepPage(cache, path) {
  const res = await fetch(path, { credentials: "same-origin", redirect: "follow" });
  // A sign-in redirect or an error is not a copy of the page.
  if (!res.ok || res.redirected || !(res.headers.get("content-type") ?? "").includes("text/html")) return [];
  await cache.put(path, res.clone());
  const html = await res.text();
  return [...html.matchAll(/["'](\/assets\/[^"'\s?#]+)["']/g)].map((m) => m[1]);
}

self.addEventListener("message", (event) => {
  const msg = event.data;
  if (!msg || msg.type !== "keep") return;
  event.waitUntil(
    (async () => {
      const cache = await caches.open(CACHE);
      const assets = new Set((msg.assets ?? []).map((a) => new URL(a, self.location.origin)).filter((u) => sameOrigin(u) && STATIC.test(u.pathname)).map((u) => u.pathname));
      assets.add("/field.webmanifest");
      for (const page of msg.pages ?? []) {
        const url = new URL(page, self.location.origin);
        if (!sameOrigin(url) || !FIELD_PAGE.test(url.pathname)) continue;
        try {
          for (const a of await keepPage(cache, url.pathname)) assets.add(a);
        } catch {
          // offline now: keep what we have
        }
      }
      const fonts = new Set();
      for (const a of assets) {
        if (await cache.match(a)) continue;
        try {
          const res = await fetch(a);
          if (!res.ok) continue;
          await cache.put(a, res.clone());
          // Fonts named by the style sheets (url(/assets/…)): the Latin subsets, as the pages are in English.
          if (a.endsWith(".css")) for (const m of (await res.text()).matchAll(/url\((\/assets\/[^)\s?#]+)\)/g)) if (/-latin-(ext-)?\d+-normal/.test(m[1])) fonts.add(m[1]);
        } catch {}
      }
      for (const f of fonts) {
        if (await cache.match(f)) continue;
        try {
          const res = await fetch(f);
          if (res.ok) await cache.put(f, res);
        } catch {}
      }
      for (const client of await self.clients.matchAll()) client.postMessage({ type: "kept", key: msg.key, pages: msg.pages ?? [] });
    })(),
  );
});

self.addEventListener("fetch", (event) => {
  const req = event.request;
  const url = new URL(req.url);
  if (!sameOrigin(url)) return;
  // Signing out drops the copies: the next person on this phone must not see them.
  if (req.method === "POST" && /^\/signout(\.data)?$/.test(url.pathname)) event.waitUntil(caches.delete(CACHE));
  if (req.method !== "GET") return;
  if (STATIC.test(url.pathname)) {
    event.respondWith(
      (async () => {
        const cache = await caches.open(CACHE);
        const hit = await cache.match(url.pathname);
        if (hit) return hit;
        const res = await fetch(req);
        if (res.ok) await cache.put(url.pathname, res.clone());
        return res;
      })(),
    );
    return;
  }
  if (FIELD_PAGE.test(url.pathname) && !url.search) {
    event.respondWith(
      (async () => {
        const cache = await caches.open(CACHE);
        try {
          const res = await fetch(req);
          if (res.ok && !res.redirected) await cache.put(url.pathname, res.clone());
          return res;
        } catch (e) {
          const hit = await cache.match(url.pathname);
          if (hit) return hit;
          throw e;
        }
      })(),
    );
  }
});
