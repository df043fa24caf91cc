/**
 * Read a text file as the app reads a chosen file (`File.text()`): UTF-8 decoding that drops a leading
 * byte-order mark and replaces invalid bytes (WHATWG Encoding Standard, "UTF-8 decode"). So a setup
 * or CSV saved with a BOM by a spreadsheet or editor reads the same in the CLI and in the browser.
 */
import { readFile } from 'node:fs/promises';

const utf8 = new TextDecoder('utf-8');

export async function readText(path: string): Promise<string> {
	return utf8.decode(await readFile(path));
}
