#!/usr/bin/env node
// CLI entry: runs the compiled CLI (dist/cli.js, built from src/cli by `npm run build` and `prepare`).
// In a source checkout where it has not been built yet, it runs src/cli through tsx (a dev dependency).
import { existsSync } from 'node:fs';

const compiled = new URL('../dist/cli.js', import.meta.url);
let main;
if (existsSync(compiled)) ({ main } = await import(compiled.href));
else {
	const { register } = await import('tsx/esm/api');
	register();
	({ main } = await import('../src/cli/main.ts'));
}
process.exitCode = await main(process.argv.slice(2));
