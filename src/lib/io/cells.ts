/**
 * Single CSV cells: numbers with a decimal point or comma, quantities, and the spreadsheet-formula
 * escape of the exports. Kept apart from the reader (csv.ts) so that writing a CSV does not load the
 * CSV parser.
 */
const plainNumber = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/**
 * A number cell as a number, or null when it is not one. With `decimalComma`, one comma stands for
 * the decimal point ("1080,4" → 1080.4); a point and a comma together are refused as ambiguous.
 */
export function numberCell(text: string, decimalComma: boolean): number | null {
	let t = unescapeCell(text).trim();
	if (t.includes(',')) {
		if (!decimalComma || t.includes('.') || t.indexOf(',') !== t.lastIndexOf(',')) return null;
		t = t.replace(',', '.');
	}
	return plainNumber.test(t) ? Number(t) : null;
}

/** A quantity cell ("2,83 mm") with a decimal comma turned into a point when the separator allows it. */
export function quantityCell(text: string, decimalComma: boolean): string {
	const t = unescapeCell(text).trim();
	return decimalComma ? t.replace(/^([-+]?\d*),(\d)/, '$1.$2') : t;
}

/** Undo the export's formula escape: "'=x" → "=x" (only before = + - @, tab or CR). */
export function unescapeCell(text: string): string {
	return /^'[=+\-@\t\r]/.test(text) ? text.slice(1) : text;
}

/** Does a spreadsheet read this cell as a formula? (OWASP CSV Injection: = + - @ tab CR.) */
export function needsFormulaEscape(text: string): boolean {
	return /^[=+\-@\t\r]/.test(text) && !plainNumber.test(text);
}
