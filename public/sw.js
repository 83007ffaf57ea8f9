/*
 * Rigline service worker: the driver screens keep working without signal.
 *
 * - Driver pages (/drive…) are fetched from the network first; a good answer is kept, and when
 *   there is no network the kept copy is shown (any query string, same page).
 * - The app's built files (/_next/static/…) never change under one name: kept on first use and
 *   served from the phone after that.
 * - Pages ask it to "warm" the driver's vehicle pages, checklist and defect form, so they open
 *   without signal even if the driver never opened each one while online.
 * - Reports are not sent from here: the page keeps them in IndexedDB and sends them itself.
 * - Kept pages belong to one signed-in person: a different person, or a sign-in page answering
 *   instead of a driver page, empties them.
 */
const VERSION = "v1";
const PAGES = `rigline-pages-${VERSION}`;
const ASSETS = `rigline-assets-${VERSION}`;
const META = `rigline-meta-${VERSION}`;
const OFFLINE_PREFIX = "/drive";
const ASSET_PATTERN = /(?:\/_next\/)?static\/(?:chunks|css|media)\/[^"'\\\s)<>]+/g;

self.addEventListener("install", () => {
  self.skipWaiting();
});

self.addEventListener("activate", (event) => {
  event.waitUntil(
    (async () => {
      const keep = new Set([PAGES, ASSETS, META]);
      for (const name of await caches.keys()) if (name.startsWith("rigline-") && !keep.has(name)) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

const isDriverPath = (pathname) => pathname === OFFLINE_PREFIX || pathname.startsWith(`${OFFLINE_PREFIX}/`);
const pageKey = (url) => new Request(new URL(url, self.location.origin).pathname);
const isAsset = (url) => url.pathname.startsWith("/_next/static/") || url.pathname === "/icon.svg" || url.pathname === "/manifest.webmanifest";

async function keepPage(url, response) {
  if (!response || !response.ok || response.redirected || response.type !== "basic") return false;
  const type = response.headers.get("content-type") || "";
  if (!type.includes("text/html")) return false;
  const cache = await caches.open(PAGES);
  await cache.put(pageKey(url), response);
  return true;
}

async function forgetPages() {
  await caches.delete(PAGES);
}

async function assetFromCacheOrNetwork(request) {
  const cache = await caches.open(ASSETS);
  const hit = await cache.match(request, { ignoreVary: true });
  if (hit) return hit;
  const response = await fetch(request);
  if (response.ok && response.type === "basic") await cache.put(request, response.clone());
  return response;
}

const OFFLINE_HTML = `<!doctype html><html lang="en-AU"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>No signal · Rigline</title>
<style>body{font-family:system-ui,sans-serif;background:#fbf9f4;color:#131e33;margin:0;padding:24px;font-size:18px;line-height:1.5}a{display:inline-block;margin-top:16px;padding:14px 20px;background:#283c61;color:#fbf9f4;border-radius:8px;font-weight:700;text-decoration:none}</style></head>
<body><h1>No signal</h1><p>This page was not saved on this phone. Your vehicles, checks and defect form still open without signal.</p><a href="/drive">My vehicles</a></body></html>`;

async function driverNavigation(request) {
  const url = new URL(request.url);
  try {
    const response = await fetch(request);
    if (response.redirected && new URL(response.url).pathname.startsWith("/sign-in")) {
      // Signed out: what the phone kept belongs to someone who is not here any more.
      await forgetPages();
    } else {
      await keepPage(url, response.clone());
    }
    return response;
  } catch {
    const cache = await caches.open(PAGES);
    const kept = (await cache.match(pageKey(url))) || (await cache.match(pageKey("/drive")));
    if (kept) return kept;
    return new Response(OFFLINE_HTML, { status: 503, headers: { "content-type": "text/html; charset=utf-8" } });
  }
}

self.addEventListener("fetch", (event) => {
  const request = event.request;
  if (request.method !== "GET") return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (isAsset(url)) {
    event.respondWith(assetFromCacheOrNetwork(request));
    return;
  }
  if (request.mode === "navigate" && isDriverPath(url.pathname)) {
    event.respondWith(driverNavigation(request));
  }
  // Everything else (API calls, other pages, the router's data requests) goes to the network
  // as usual; the driver pages use plain links, so without signal they navigate as documents.
});

/** Fetches each page, keeps it, and keeps every built file it refers to. */
async function warm(urls, userId) {
  const meta = await caches.open(META);
  const owner = await meta.match("/owner");
  const previous = owner ? await owner.text() : null;
  if (userId && previous !== userId) {
    await forgetPages();
    await meta.put("/owner", new Response(userId));
  }
  const assets = await caches.open(ASSETS);
  let kept = 0;
  for (const path of urls) {
    const url = new URL(path, self.location.origin);
    if (!isDriverPath(url.pathname)) continue;
    try {
      const response = await fetch(url, { credentials: "same-origin", headers: { accept: "text/html" } });
      if (!(await keepPage(url, response.clone()))) continue;
      kept++;
      const html = await response.text();
      const found = new Set();
      for (const match of html.matchAll(ASSET_PATTERN)) {
        const asset = match[0].startsWith("/_next/") ? match[0] : `/_next/${match[0]}`;
        found.add(asset);
      }
      for (const asset of found) {
        if (await assets.match(asset)) continue;
        try {
          const r = await fetch(asset);
          if (r.ok) await assets.put(asset, r);
        } catch {
          // A file that did not come now will be kept when a page next loads it.
        }
      }
    } catch {
      // No signal while warming: what was kept before stays.
    }
  }
  return kept;
}

async function keepAssets(urls) {
  const cache = await caches.open(ASSETS);
  for (const u of urls) {
    const url = new URL(u, self.location.origin);
    if (url.origin !== self.location.origin || !isAsset(url)) continue;
    if (await cache.match(url.pathname + url.search)) continue;
    try {
      const r = await fetch(url);
      if (r.ok) await cache.put(url.pathname + url.search, r);
    } catch {
      // Kept next time.
    }
  }
}

self.addEventListener("message", (event) => {
  const data = event.data || {};
  const reply = (message) => event.source && event.source.postMessage(message);
  if (data.type === "warm") {
    event.waitUntil(
      (async () => {
        await keepAssets(Array.isArray(data.assets) ? data.assets : []);
        const kept = await warm(Array.isArray(data.urls) ? data.urls : [], typeof data.userId === "string" ? data.userId : null);
        reply({ type: "warmed", kept });
      })(),
    );
  } else if (data.type === "forget") {
    event.waitUntil(forgetPages().then(() => reply({ type: "forgotten" })));
  }
});
