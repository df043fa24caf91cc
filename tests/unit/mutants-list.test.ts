// The list behind `npm run mutate` stays applicable: an edit that moves or rewrites a mutated line
// must update its entry, or the mutant silently stops being tried (as happened when the CSV cell
// helpers moved to their own file). Checked here so that `npm test` catches it, not only `npm run mutate`.
import { readFileSync, existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

interface Mutant {
	id: string;
	file: string;
	find: string;
	replace: string;
	tests?: string[];
}
const mutants: Mutant[] = JSON.parse(readFileSync('tests/mutants.json', 'utf8'));

function occurrences(hay: string, needle: string): number {
	let n = 0;
	for (let i = hay.indexOf(needle); i >= 0; i = hay.indexOf(needle, i + needle.length)) n++;
	return n;
}

describe('tests/mutants.json', () => {
	it('has unique ids', () => {
		const ids = mutants.map((m) => m.id);
		expect(new Set(ids).size).toBe(ids.length);
	});
	it.each(mutants.map((m) => [m.id, m] as const))('%s: its text occurs exactly once and its tests exist', (_id, m) => {
		expect(existsSync(m.file), m.file).toBe(true);
		expect(occurrences(readFileSync(m.file, 'utf8'), m.find), `"${m.find}" in ${m.file}`).toBe(1);
		expect(m.replace).not.toBe(m.find);
		for (const t of m.tests ?? []) expect(existsSync(t), t).toBe(true);
	});
});
