// The bench's first view (the demo beam) is prerendered: a fresh visitor sees the beam before any script runs.
export const ssr = true;
