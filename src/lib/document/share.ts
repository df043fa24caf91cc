/**
 * Share a setup as a link: the whole setup document, deflate-compressed and base64url-encoded, in the
 * URL fragment (`#setup=…`). The fragment never reaches a server, so a shared link works from any copy
 * of the app, online or offline. Decoding validates like any import; a bad link is refused with a reason.
 */
import { parseSetupJson, type SetupDoc } from './schema';

export const SHARE_PREFIX = '#setup=';

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

async function pipe(bytes: Uint8Array, stream: CompressionStream | DecompressionStream): Promise<Uint8Array> {
	const out = new Blob([bytes as BlobPart]).stream().pipeThrough(stream);
	return new Uint8Array(await new Response(out).arrayBuffer());
}

/** The fragment (starting with `#setup=`) that carries this setup. */
export async function encodeSetupFragment(doc: SetupDoc): Promise<string> {
	const json = new TextEncoder().encode(JSON.stringify(doc));
	return SHARE_PREFIX + toBase64Url(await pipe(json, new CompressionStream('deflate-raw')));
}

/** Read a setup back from a fragment; never throws. */
export async function decodeSetupFragment(fragment: string): Promise<{ ok: true; doc: SetupDoc } | { ok: false; reason: string }> {
	if (!fragment.startsWith(SHARE_PREFIX)) return { ok: false, reason: 'the link carries no setup' };
	let json: string;
	try {
		const bytes = await pipe(fromBase64Url(fragment.slice(SHARE_PREFIX.length)), new DecompressionStream('deflate-raw'));
		json = new TextDecoder().decode(bytes);
	} catch {
		return { ok: false, reason: 'the link is damaged or cut short (the setup in it cannot be unpacked)' };
	}
	return parseSetupJson(json);
}
