#!/usr/bin/env node
// Precompresses the static build after `vite build`: beside every text file of ./build it writes
// `<file>.gz` (gzip level 9) and `<file>.br` (brotli quality 11), which scripts/serve.js sends to
// browsers that accept them. Run by `npm run build`, `npm start` and `npm run test:e2e`.
// Usage: node scripts/compress.js [dir]
import { readdirSync, readFileSync, writeFileSync, statSync } from 'node:fs';
import { join, extname, resolve } from 'node:path';
import { gzipSync, brotliCompressSync, constants } from 'node:zlib';

const root = resolve(process.argv[2] ?? 'build');
const textTypes = new Set(['.html', '.js', '.mjs', '.css', '.json', '.svg', '.csv', '.txt', '.webmanifest', '.xml']);

/** The compressed forms of one file's bytes (exported for the bench, which counts what is sent). */
export function compressForms(body) {
	return {
		gz: gzipSync(body, { level: 9 }),
		br: brotliCompressSync(body, { params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_SIZE_HINT]: body.length } })
	};
}

function walk(dir, out) {
	for (const name of readdirSync(dir)) {
		const p = join(dir, name);
		if (statSync(p).isDirectory()) walk(p, out);
		else if (textTypes.has(extname(p))) out.push(p);
	}
	return out;
}

if (import.meta.url === `file://${process.argv[1]}`) {
	let raw = 0;
	let gz = 0;
	let br = 0;
	const files = walk(root, []);
	for (const f of files) {
		const body = readFileSync(f);
		const c = compressForms(body);
		raw += body.length;
		// A form no smaller than the file is not worth sending; serve.js then sends the file itself.
		if (c.gz.length < body.length) writeFileSync(f + '.gz', c.gz);
		if (c.br.length < body.length) writeFileSync(f + '.br', c.br);
		gz += Math.min(c.gz.length, body.length);
		br += Math.min(c.br.length, body.length);
	}
	const kB = (n) => (n / 1024).toFixed(0);
	console.log(`precompressed ${files.length} files in ${root}: ${kB(raw)} kB → gzip ${kB(gz)} kB, brotli ${kB(br)} kB`);
}
