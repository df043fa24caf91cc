// scripts/serve.js, the static server of the README's run command and of the browser bench: it sends a
// file's precompressed form when the browser accepts it, and keeps what it read in memory. A rebuilt
// file must be sent as rebuilt (never a stale copy or a stale compressed form), a removed one not at all.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, mkdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { brotliCompressSync, brotliDecompressSync } from 'node:zlib';

const PORT = 4391;
let dir = '';
let server: ChildProcess;

function get(path: string, encoding?: string): Promise<{ status: number; encoding?: string; body: string }> {
	return new Promise((done, fail) => {
		const req = request({ host: '127.0.0.1', port: PORT, path, headers: encoding ? { 'accept-encoding': encoding } : {} }, (res) => {
			const parts: Buffer[] = [];
			res.on('data', (c: Buffer) => parts.push(c));
			res.on('end', () => {
				const raw = Buffer.concat(parts);
				const enc = res.headers['content-encoding'] as string | undefined;
				done({ status: res.statusCode ?? 0, encoding: enc, body: (enc === 'br' ? brotliDecompressSync(raw) : raw).toString() });
			});
		});
		req.on('error', fail);
		req.end();
	});
}

/** Sets a file's modification time `s` seconds from now (file systems keep whole seconds or better). */
const touch = (file: string, s: number) => utimesSync(file, new Date(Date.now() + s * 1000), new Date(Date.now() + s * 1000));

beforeAll(async () => {
	dir = mkdtempSync(join(tmpdir(), 'bw-serve-'));
	mkdirSync(join(dir, 'build'));
	writeFileSync(join(dir, 'build', 'index.html'), '<p>first</p>');
	writeFileSync(join(dir, 'build', 'app.js'), 'export const v = 1;');
	writeFileSync(join(dir, 'build', 'app.js.br'), brotliCompressSync('export const v = 1;'));
	touch(join(dir, 'build', 'app.js'), -60);
	server = spawn(process.execPath, [resolve('scripts/serve.js'), '--port', String(PORT), '--quiet'], { cwd: dir, stdio: 'ignore' });
	for (let i = 0; i < 100; i++) {
		try {
			await get('/');
			return;
		} catch {
			await new Promise((r) => setTimeout(r, 50));
		}
	}
});

afterAll(() => {
	server?.kill();
	rmSync(dir, { recursive: true, force: true });
});

describe('scripts/serve.js', () => {
	it('sends the brotli form to a browser that accepts it, the file itself to one that does not', async () => {
		const br = await get('/app.js', 'gzip, deflate, br');
		expect(br).toMatchObject({ status: 200, encoding: 'br', body: 'export const v = 1;' });
		const plain = await get('/app.js');
		expect(plain).toMatchObject({ status: 200, encoding: undefined, body: 'export const v = 1;' });
		expect(await get('/')).toMatchObject({ status: 200, body: '<p>first</p>' });
	});

	it('sends a rebuilt file as rebuilt, not the copy it kept nor a compressed form older than it', async () => {
		await get('/app.js', 'br');
		writeFileSync(join(dir, 'build', 'app.js'), 'export const v = 2;');
		touch(join(dir, 'build', 'app.js'), 60);
		const after = await get('/app.js', 'br');
		expect(after).toMatchObject({ status: 200, encoding: undefined, body: 'export const v = 2;' });
		writeFileSync(join(dir, 'build', 'index.html'), '<p>second</p>');
		touch(join(dir, 'build', 'index.html'), 120);
		expect((await get('/')).body).toBe('<p>second</p>');
	});

	it('answers 404 for a file removed after it was sent, and for a path outside the build', async () => {
		writeFileSync(join(dir, 'build', 'gone.txt'), 'here');
		expect((await get('/gone.txt')).status).toBe(200);
		rmSync(join(dir, 'build', 'gone.txt'));
		expect((await get('/gone.txt')).status).toBe(404);
		expect((await get('/../package.json')).status).toBe(404);
	});
});
