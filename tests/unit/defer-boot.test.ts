// The build-time rewrite that lets a prerendered page paint before its scripts
// (src/lib/boot/deferBoot.ts). The page below has the shape SvelteKit 2 writes for a prerendered page;
// the rewritten boot script is then run with a stand-in document, to see what it does and when.
import { describe, expect, it } from 'vitest';
import { BootMarkupError, deferBoot } from '../../src/lib/boot/deferBoot';

const page = (body: string) => `<!doctype html><html><head>
<link href="./_app/immutable/entry/start.A.js" rel="modulepreload">
<link href="./_app/immutable/chunks/B.js" rel="modulepreload">
<link href="./_app/immutable/entry/app.C.js" rel="modulepreload">
<style>main{color:red}</style></head>
<body><div style="display: contents">${body}
<script>
	{
		__sveltekit_x1 = { base: new URL(".", location).pathname.slice(0, -1) };
		const element = document.currentScript.parentElement;
		Promise.all([import("./_app/immutable/entry/start.A.js"), import("./_app/immutable/entry/app.C.js")]).then(([kit, app]) => { kit.start(app, element, { node_ids: [0, 2] }); });
	}
</script></div></body></html>`;

/** Runs the page's (rewritten) boot script against a stand-in document; returns what it did. */
function runBoot(html: string, restoring: boolean) {
	const script = /<script>([\s\S]*?)<\/script>/.exec(html)![1];
	const log: string[] = [];
	const frames: (() => void)[] = [];
	const timers: { fn: () => void; ms: number }[] = [];
	const currentScript = { parentElement: 'the-body-div' };
	const document = {
		currentScript,
		documentElement: { hasAttribute: (n: string) => n === 'data-restoring' && restoring },
		createElement: () => ({ rel: '', href: '' }),
		head: { appendChild: (l: { rel: string; href: string }) => log.push(`${l.rel} ${l.href}`) }
	};
	const kit = { start: (_app: unknown, el: unknown) => log.push(`start on ${el}`) };
	const sessionStorage = {
		get length() {
			log.push('sessionStorage opened');
			return 0;
		}
	};
	const fn = new Function('document', 'requestAnimationFrame', 'setTimeout', '__import', 'location', 'sessionStorage', script.replaceAll('import(', '__import('));
	const imports: Promise<unknown>[] = [];
	const globalScope = globalThis as Record<string, unknown>;
	fn(
		document,
		(f: () => void) => frames.push(f),
		(f: () => void, ms: number) => timers.push({ fn: f, ms }),
		(spec: string) => {
			log.push(`import ${spec}`);
			const p = Promise.resolve(spec.includes('start') ? kit : {});
			imports.push(p);
			return p;
		},
		'http://x/',
		sessionStorage
	);
	delete globalScope.__sveltekit_x1;
	return { log, frames, timers, imports };
}

describe('deferBoot: a prerendered page paints before its scripts load (build-time rewrite)', () => {
	it('takes the module preloads out of the head and boots once the first frame is drawn', async () => {
		const out = deferBoot(page('<main><p>prerendered view</p></main>'));
		expect(out).not.toMatch(/rel="modulepreload"/);
		expect(out).toContain('<style>main{color:red}</style>');
		const run = runBoot(out, false);
		// Nothing before the first frame.
		expect(run.log).toEqual([]);
		expect(run.frames).toHaveLength(1);
		run.frames[0]();
		const afterFrame = run.timers.find((t) => t.ms === 0)!;
		afterFrame.fn();
		// The same preloads, in the page's order; the session storage opened while they load (SvelteKit's
		// client reads it as it starts); then SvelteKit's own boot on the same element.
		expect(run.log.slice(0, 3)).toEqual(['modulepreload ./_app/immutable/entry/start.A.js', 'modulepreload ./_app/immutable/chunks/B.js', 'modulepreload ./_app/immutable/entry/app.C.js']);
		expect(run.log[3]).toBe('sessionStorage opened');
		expect(run.log.slice(4)).toEqual(['import ./_app/immutable/entry/start.A.js', 'import ./_app/immutable/entry/app.C.js']);
		await Promise.all(run.imports);
		await new Promise((r) => setTimeout(r, 0));
		expect(run.log.at(-1)).toBe('start on the-body-div');
		// The fallback timer (a hidden tab draws no frames) does not boot it twice.
		const n = run.log.length;
		run.timers.find((t) => t.ms > 0)!.fn();
		expect(run.log.length).toBe(n);
	});

	it('boots at once for a returning user, whose page is hidden until their own setup replaces the demo', () => {
		const run = runBoot(deferBoot(page('<main><p>prerendered view</p></main>')), true);
		expect(run.frames).toHaveLength(0);
		expect(run.log.filter((l) => l.startsWith('modulepreload'))).toHaveLength(3);
		expect(run.log.filter((l) => l.startsWith('import'))).toHaveLength(2);
	});

	it('boots in a hidden tab too (no frames drawn): a timer stands in for the frame', () => {
		const run = runBoot(deferBoot(page('<main><p>prerendered view</p></main>')), false);
		run.timers.find((t) => t.ms > 0)!.fn();
		expect(run.log.filter((l) => l.startsWith('import'))).toHaveLength(2);
	});

	it('leaves a page rendered only in the browser as it is (its scripts are all it has)', () => {
		const shell = page('');
		expect(deferBoot(shell)).toBe(shell);
	});

	it('fails the build, by name, when the page no longer has the expected shape', () => {
		expect(() => deferBoot('<main></main><script>boot()</script>')).toThrow(BootMarkupError);
		expect(() => deferBoot(page('<main></main>').replaceAll(/<link[^>]*>/g, ''))).toThrow(/no module preloads/);
	});
});
