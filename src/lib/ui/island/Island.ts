/**
 * An island: a part of a prerendered page that the browser takes over in a task of its own, after the
 * rest of the page. Taking a prerendered page over (hydration) is one task in Svelte; a heavy part
 * (a plot with its derived geometry) made that task long enough to hold input back. Inside an island,
 * the prerendered HTML stays as it is during the page's take-over and is taken over in the next task,
 * with the props as they are then (a returning user's setup included), or at once, inside the event,
 * when input is aimed at it before then. The layout marks the page ready once every island that takes
 * input is armed for that (an island marked `drawing` takes none), and keeps a returning user's page
 * hidden until every island is taken over (src/lib/ui/island/pending.ts). On a page built in the
 * browser (a link followed inside the app) the part is built at once, in the same task as the page.
 *
 * Usage: `<Island of={Plot} props={{ result, get svg() { return svg; }, set svg(v) { svg = v; } }} id="plot" />`.
 * The part reads each prop through a derived of its own over `props` (liveProps.svelte.ts); a bindable
 * prop goes through a getter/setter pair. `id` is unique in the page (prefix of the part's own ids, and the wrapper's `data-island`).
 * The part sees the page's context.
 */
// `#island` (package.json "imports"): IslandClient.svelte where the "browser" condition holds (the
// app's bundle), IslandServer.svelte elsewhere (prerendering). Chosen when the module is resolved, so the
// server renderer it needs never reaches the browser.
export { default as Island } from '#island';
