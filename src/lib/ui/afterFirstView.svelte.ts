import { onMount } from 'svelte';

/**
 * For the parts of a long page that lie below its first screen: `ready` turns true in the browser once
 * the page has been taken over, in a task after its next frame (or after 250 ms in a tab that draws no
 * frames). Those parts are then neither in the prerendered HTML nor in the take-over (hydration), which
 * stays one short task; they are built just after it, in a task of their own. Until then the page keeps
 * an empty element with each heading id they hold (links to them stay valid); a link to one (`#id`) is
 * followed again once they are there. Never true on the server.
 * Call it during component initialisation.
 */
export function afterFirstView(): { readonly ready: boolean } {
	let ready = $state(false);
	onMount(() => {
		const wanted = location.hash.length > 1 ? decodeURIComponent(location.hash.slice(1)) : null;
		let timer: ReturnType<typeof setTimeout> | undefined;
		const show = () => {
			if (ready) return;
			ready = true;
			if (wanted) requestAnimationFrame(() => document.getElementById(wanted)?.scrollIntoView());
		};
		const frame = requestAnimationFrame(() => (timer = setTimeout(show, 0)));
		const fallback = setTimeout(show, 250);
		return () => {
			cancelAnimationFrame(frame);
			clearTimeout(timer);
			clearTimeout(fallback);
		};
	});
	return {
		get ready() {
			return ready;
		}
	};
}
