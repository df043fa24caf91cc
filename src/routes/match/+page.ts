// The match page's first view is prerendered like the Bench's (src/routes/+page.ts).
export const ssr = true;
