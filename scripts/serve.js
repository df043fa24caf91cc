#!/usr/bin/env node
// Serves the static build (./build) on localhost. No dependencies: node:http only.
// Text files are sent compressed when the browser accepts it: brotli (`<file>.br`) first, then gzip
// (`<file>.gz`), both written at build time by scripts/compress.js; a file without them goes as is.
// Usage: node scripts/serve.js [--port 4173] [--quiet]
import { createServer } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import { extname, join, normalize, resolve } from 'node:path';

const args = process.argv.slice(2);
const portArg = args.indexOf('--port');
const port = portArg >= 0 ? Number(args[portArg + 1]) : Number(process.env.PORT ?? 4173);
const quiet = args.includes('--quiet');
const root = resolve(process.cwd(), 'build');

const types = {
	'.html': 'text/html; charset=utf-8',
	'.js': 'text/javascript; charset=utf-8',
	'.mjs': 'text/javascript; charset=utf-8',
	'.css': 'text/css; charset=utf-8',
	'.json': 'application/json; charset=utf-8',
	'.svg': 'image/svg+xml',
	'.png': 'image/png',
	'.csv': 'text/csv; charset=utf-8',
	'.txt': 'text/plain; charset=utf-8',
	'.webmanifest': 'application/manifest+json'
};

async function resolveFile(urlPath) {
	const clean = normalize(decodeURIComponent(urlPath.split('?')[0])).replace(/^(\.\.[/\\])+/, '');
	let file = join(root, clean);
	if (!file.startsWith(root)) return null;
	try {
		const s = await stat(file);
		if (s.isDirectory()) file = join(file, 'index.html');
		await stat(file);
		return file;
	} catch {
		try {
			await stat(file + '.html');
			return file + '.html';
		} catch {
			return null;
		}
	}
}

/** True when the Accept-Encoding header lists `token` with a q above 0. */
function accepts(header, token) {
	return header.split(',').some((part) => {
		const [name, ...params] = part.trim().split(';');
		if (name.trim().toLowerCase() !== token) return false;
		const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
		return q === undefined || Number(q.slice(2)) > 0;
	});
}

/**
 * What a path is answered with, kept in memory once read: a request then costs one `stat` (is the file
 * still the one read?) instead of the half-dozen file-system calls of reading it again. A rebuilt file
 * (newer mtime) is read afresh; a removed one is looked up again.
 */
const cache = new Map();

/** The file behind `urlPath` with its forms (raw, and the precompressed ones not older than it), or null. */
async function load(urlPath) {
	const file = await resolveFile(urlPath);
	if (!file) return null;
	const original = await stat(file);
	const entry = { file, mtimeMs: original.mtimeMs, raw: await readFile(file), br: null, gzip: null };
	for (const [token, ext] of [['br', '.br'], ['gzip', '.gz']]) {
		try {
			// A precompressed form older than the file itself is stale (the file was rebuilt or edited).
			if ((await stat(file + ext)).mtimeMs < original.mtimeMs) continue;
			entry[token] = await readFile(file + ext);
		} catch {
			/* no precompressed form */
		}
	}
	return entry;
}

async function lookup(urlPath) {
	const key = urlPath.split('?')[0];
	const known = cache.get(key);
	if (known) {
		try {
			if ((await stat(known.file)).mtimeMs === known.mtimeMs) return known;
		} catch {
			/* removed: look it up again */
		}
	}
	const entry = await load(key);
	if (entry) cache.set(key, entry);
	else cache.delete(key);
	return entry;
}

const server = createServer(async (req, res) => {
	const entry = await lookup(req.url ?? '/');
	if (!entry) {
		res.writeHead(404, { 'content-type': 'text/plain' });
		res.end('not found');
		return;
	}
	const accept = String(req.headers['accept-encoding'] ?? '');
	const headers = {
		'content-type': types[extname(entry.file)] ?? 'application/octet-stream',
		'cache-control': entry.file.includes('/_app/immutable/') ? 'public, max-age=31536000, immutable' : 'no-cache',
		vary: 'Accept-Encoding'
	};
	let body = entry.raw;
	for (const token of ['br', 'gzip']) {
		if (entry[token] && accepts(accept, token)) {
			body = entry[token];
			headers['content-encoding'] = token;
			break;
		}
	}
	headers['content-length'] = body.length;
	res.writeHead(200, headers);
	res.end(req.method === 'HEAD' ? undefined : body);
});

// Without --port, a busy default port moves on to the next free one.
let tryPort = port;
server.on('error', (err) => {
	if (err.code === 'EADDRINUSE' && portArg < 0 && tryPort < port + 20) {
		tryPort++;
		server.listen(tryPort, '127.0.0.1');
	} else {
		console.error(`cannot serve on port ${tryPort}: ${err.message}`);
		process.exit(1);
	}
});
server.on('listening', () => {
	if (!quiet) console.log(`Beamwright is running at http://localhost:${tryPort}/  (Ctrl+C to stop)`);
});
server.listen(tryPort, '127.0.0.1');
