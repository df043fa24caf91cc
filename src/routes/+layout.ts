// A static, client-rendered app: every route is prerendered as a shell; all work happens in the browser.
export const prerender = true;
export const ssr = false;
export const trailingSlash = 'always';
