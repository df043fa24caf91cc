/** Save a text or blob as a file in the browser (nothing is uploaded). */
export function downloadBlob(blob: Blob, filename: string): void {
	const a = document.createElement('a');
	a.href = URL.createObjectURL(blob);
	a.download = filename;
	document.body.appendChild(a);
	a.click();
	a.remove();
	setTimeout(() => URL.revokeObjectURL(a.href), 2000);
}

export function downloadText(text: string, filename: string, type = 'text/csv;charset=utf-8'): void {
	downloadBlob(new Blob([text], { type }), filename);
}
