/**
 * A prerendered page paints before any of its scripts: the page's HTML is rewritten at build time
 * (src/hooks.server.ts) so that
 * - its module preloads (`<link rel="modulepreload">`) leave the head: fetched and compiled at once, they
 *   compete with the first paint for the main thread on a small machine;
 * - its boot script (SvelteKit's inline `start`) runs once the first frame with the prerendered view has
 *   been drawn, and then adds the same preloads, so every module is fetched at once, not one import
 *   level after another. While they load it opens the session storage: SvelteKit's client reads it as its
 *   module is evaluated, and the first read of a tab's storage waits for the browser (measured with a CPU
 *   profile: ~5–9 ms on this 2-core machine), which is then off the path to the page answering input.
 * A returning user's page is hidden until their own setup replaces the demo (app.html, `data-restoring`):
 * there is no view to show first, so it boots at once.
 * A page rendered only in the browser (no prerendered view) is left as it is.
 */

const PRELOAD = /<link\b[^>]*\brel="modulepreload"[^>]*>/g;
const HREF = /\bhref="([^"]+)"/;
const BOOT = /<script>(\s*\{\s*__sveltekit_[\s\S]*?)<\/script>/;

/** Fails the build, naming what it did not find, when SvelteKit's page markup changes shape. */
export class BootMarkupError extends Error {}

/** The rewritten page (see the module comment); `html` must hold one SvelteKit boot script. */
export function deferBoot(html: string): string {
	if (!/<main[\s>]/.test(html)) return html;
	const boot = BOOT.exec(html);
	if (!boot) throw new BootMarkupError('deferBoot: no SvelteKit boot script (<script>{ __sveltekit_… }</script>) in the page');
	if (!boot[1].includes('document.currentScript')) throw new BootMarkupError('deferBoot: the boot script no longer reads document.currentScript');
	const hrefs: string[] = [];
	const page = html.replace(PRELOAD, (tag) => {
		const href = HREF.exec(tag)?.[1];
		if (href) hrefs.push(href);
		return '';
	});
	if (hrefs.length === 0) throw new BootMarkupError('deferBoot: the page links no module preloads');
	const body = boot[1].replaceAll('document.currentScript', '__bw_script');
	const script =
		'<script>((__bw_script) => {' +
		`const go = () => { if (go.done) return; go.done = true;` +
		`for (const href of ${JSON.stringify(hrefs)}) { const l = document.createElement('link'); l.rel = 'modulepreload'; l.href = href; document.head.appendChild(l); }` +
		`try { sessionStorage.length; } catch {}` + // storage blocked (privacy settings): SvelteKit copes too
		`${body}};` +
		// After the first frame: a task queued from a frame callback runs once that frame is drawn. A hidden
		// tab draws no frames, hence the timer.
		`if (document.documentElement.hasAttribute('data-restoring')) go();` +
		`else { requestAnimationFrame(() => setTimeout(go, 0)); setTimeout(go, 200); }` +
		'})(document.currentScript)</script>';
	return page.replace(boot[0], () => script);
}
