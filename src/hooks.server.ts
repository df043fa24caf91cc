import type { Handle } from '@sveltejs/kit';
import { deferBoot } from '$lib/boot/deferBoot';

// Runs at build time only (every page is prerendered): a page with a prerendered view paints before
// its scripts load (src/lib/boot/deferBoot.ts).
export const handle: Handle = ({ event, resolve }) => resolve(event, { transformPageChunk: ({ html, done }) => (done ? deferBoot(html) : html) });
