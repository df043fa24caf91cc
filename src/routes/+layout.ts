// A static app: every route is prerendered, as a shell that renders in the browser unless the route
// renders its first view at build time (`ssr = true` in its +page.ts: every workspace; their pages paint
// before any script runs, src/lib/boot/deferBoot.ts). All work happens in the browser.
export const prerender = true;
export const ssr = false;
export const trailingSlash = 'always';
