/**
 * Updates of the offline copy: a new build's service worker installs in the background and then
 * waits (src/service-worker.ts no longer takes over on its own), so the page never runs on a stale
 * version silently. The layout tells the user that a new version is ready and reloads when asked.
 */

/** Call `onWaiting` when a new service worker has installed and waits to take over from the current one. */
export function watchForUpdate(reg: ServiceWorkerRegistration, onWaiting: (w: ServiceWorker) => void): void {
	const follow = (w: ServiceWorker | null) => {
		w?.addEventListener('statechange', () => {
			if (w.state === 'installed' && navigator.serviceWorker.controller) onWaiting(w);
		});
	};
	if (reg.waiting && navigator.serviceWorker.controller) onWaiting(reg.waiting);
	else follow(reg.installing);
	reg.addEventListener('updatefound', () => follow(reg.installing));
}

/** Let the waiting worker take over, then reload the page on the new version (the setup is saved first). */
export function activateUpdate(w: ServiceWorker, beforeReload: () => void): void {
	navigator.serviceWorker.addEventListener(
		'controllerchange',
		() => {
			beforeReload();
			location.reload();
		},
		{ once: true }
	);
	w.postMessage({ type: 'skip-waiting' });
}
