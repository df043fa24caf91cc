// A static app: every route is prerendered, as a shell that renders in the browser unless the route
// renders its first view at build time (the Bench, src/routes/+page.ts). All work happens in the browser.
export const prerender = true;
export const ssr = false;
export const trailingSlash = 'always';
