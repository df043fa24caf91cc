/// <reference types="@sveltejs/kit" />
/// <reference no-default-lib="true"/>
/// <reference lib="esnext" />
/// <reference lib="webworker" />
/**
 * Offline support: after the first visit every file of this build is cached, so the app opens and works
 * with no network (labs often have none near the optical tables). A new build's worker installs and
 * then waits: the page tells the user a new version is ready and sends "skip-waiting" when they choose
 * to reload (src/lib/ui/swUpdate.ts); only the very first install takes over at once.
 * Nothing the user enters is sent anywhere; this worker only serves the app's own files.
 */
import { build, files, prerendered, version } from '$service-worker';

const sw = self as unknown as ServiceWorkerGlobalScope;
const CACHE = `beamwright-${version}`;
const ASSETS = [...build, ...files, ...prerendered];

sw.addEventListener('install', (event) => {
	event.waitUntil(
		caches
			.open(CACHE)
			.then((cache) => cache.addAll(ASSETS))
			// First install: take over at once. An update waits until the user reloads (see above).
			.then(() => (sw.registration.active ? undefined : sw.skipWaiting()))
	);
});

sw.addEventListener('message', (event) => {
	if ((event.data as { type?: string } | null)?.type === 'skip-waiting') void sw.skipWaiting();
});

sw.addEventListener('activate', (event) => {
	event.waitUntil(
		caches
			.keys()
			.then((keys) => Promise.all(keys.filter((k) => k !== CACHE).map((k) => caches.delete(k))))
			.then(() => sw.clients.claim())
	);
});

sw.addEventListener('fetch', (event) => {
	const req = event.request;
	if (req.method !== 'GET') return;
	const url = new URL(req.url);
	if (url.origin !== sw.location.origin) return;
	event.respondWith(
		(async () => {
			const cache = await caches.open(CACHE);
			// Immutable build files: cache first.
			if (ASSETS.includes(url.pathname)) {
				const hit = await cache.match(url.pathname);
				if (hit) return hit;
			}
			// Pages: network first, falling back to the cached shell when offline.
			try {
				const res = await fetch(req);
				if (res.ok && res.type === 'basic') cache.put(req, res.clone());
				return res;
			} catch {
				const hit = (await cache.match(req)) ?? (await cache.match(url.pathname + (url.pathname.endsWith('/') ? '' : '/')));
				if (hit) return hit;
				const shell = await cache.match('/');
				if (shell) return shell;
				return new Response('Beamwright is offline and this page was not cached yet.', { status: 503, headers: { 'content-type': 'text/plain; charset=utf-8' } });
			}
		})()
	);
});
