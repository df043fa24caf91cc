// The Hazard page's first view (the demo laser's estimate, its plot and every caution) is prerendered
// like the Bench's: it paints before any script runs. A returning user's page stays hidden until their
// own setup has replaced the demo (src/app.html, src/routes/+layout.svelte).
export const ssr = true;
