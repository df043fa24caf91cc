/**
 * Share a setup as a link: the whole setup document, deflate-compressed and base64url-encoded, in the
 * URL fragment (`#setup=…`). The fragment never reaches a server, so a shared link works from any copy
 * of the app, online or offline. Decoding validates like any import; a bad link is refused with a reason.
 */
import { MAX_SETUP_CHARS, parseSetupJson, type SetupDoc } from './schema';

export const SHARE_PREFIX = '#setup=';
/** Longest link fragment read (characters); browsers themselves cap URLs at a few MB. */
export const MAX_SHARE_CHARS = 4_000_000;

function toBase64Url(bytes: Uint8Array): string {
	let bin = '';
	for (let i = 0; i < bytes.length; i++) bin += String.fromCharCode(bytes[i]);
	return btoa(bin).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(text: string): Uint8Array {
	const b64 = text.replace(/-/g, '+').replace(/_/g, '/') + '==='.slice((text.length + 3) % 4);
	const bin = atob(b64);
	const out = new Uint8Array(bin.length);
	for (let i = 0; i < bin.length; i++) out[i] = bin.charCodeAt(i);
	return out;
}

async function pipe(bytes: Uint8Array, stream: CompressionStream | DecompressionStream, maxBytes = Infinity): Promise<Uint8Array> {
	const reader = new Blob([bytes as BlobPart]).stream().pipeThrough(stream).getReader();
	const parts: Uint8Array[] = [];
	let total = 0;
	for (;;) {
		const { done, value } = await reader.read();
		if (done) break;
		total += value.length;
		// A small link that unpacks to gigabytes stops here (read in chunks, never all at once).
		if (total > maxBytes) {
			await reader.cancel();
			throw new RangeError('too large');
		}
		parts.push(value);
	}
	const out = new Uint8Array(total);
	let at = 0;
	for (const p of parts) {
		out.set(p, at);
		at += p.length;
	}
	return out;
}

/** The fragment (starting with `#setup=`) that carries this setup. */
export async function encodeSetupFragment(doc: SetupDoc): Promise<string> {
	const json = new TextEncoder().encode(JSON.stringify(doc));
	return SHARE_PREFIX + toBase64Url(await pipe(json, new CompressionStream('deflate-raw')));
}

/** Read a setup back from a fragment; never throws. */
export async function decodeSetupFragment(fragment: string): Promise<{ ok: true; doc: SetupDoc } | { ok: false; reason: string }> {
	if (!fragment.startsWith(SHARE_PREFIX)) return { ok: false, reason: 'the link carries no setup' };
	if (fragment.length > MAX_SHARE_CHARS)
		return { ok: false, reason: `the link is ${(fragment.length / 1e6).toFixed(1)} million characters long — links up to ${MAX_SHARE_CHARS / 1e6} million are read; share a saved file instead` };
	let json: string;
	try {
		const bytes = await pipe(fromBase64Url(fragment.slice(SHARE_PREFIX.length)), new DecompressionStream('deflate-raw'), MAX_SETUP_CHARS);
		json = new TextDecoder().decode(bytes);
	} catch (e) {
		if (e instanceof RangeError && e.message === 'too large') return { ok: false, reason: `the setup in the link unpacks to more than ${MAX_SETUP_CHARS / 1e6} MB — it is not a setup this app wrote` };
		return { ok: false, reason: 'the link is damaged or cut short (the setup in it cannot be unpacked)' };
	}
	return parseSetupJson(json);
}
