#!/usr/bin/env node
// `npm run mutate [-- id …]`: deliberate bugs (mutants) that the tests must catch.
//
// tests/mutants.json is an array of
//   { "id": "short-kebab-id", "file": "src/…/file.ts", "find": "text occurring exactly once in that file",
//     "replace": "the mutated text", "tests": ["tests/reference/x.test.ts", …], "why": "the bug it simulates" }
// ("tests" may be left out: then every unit, reference and property test runs; other keys are ignored).
//
// For each mutant: the listed tests first run on the unchanged code (they must pass, else the mutant
// proves nothing and is reported "broken"), then the file is mutated, the tests run again, and the
// file is restored byte for byte. A mutant is "killed" when some test fails, "survived" when all pass.
// Exit code 0 when every mutant is killed; 1 otherwise (survived, broken, or an entry that is invalid
// or whose `find` text no longer occurs exactly once — update the entry when you edit that code).
import { readFileSync, writeFileSync, existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const listFile = join(root, 'tests', 'mutants.json');
const vitest = join(root, 'node_modules', 'vitest', 'vitest.mjs');
const only = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const quiet = !process.argv.includes('--verbose');

/** Occurrences of `needle` in `hay` (non-overlapping). */
function count(hay, needle) {
	let n = 0;
	for (let i = hay.indexOf(needle); i >= 0; i = hay.indexOf(needle, i + needle.length)) n++;
	return n;
}

/** Problems with one entry, or [] when it can be applied. */
export function checkEntry(m) {
	const problems = [];
	for (const k of ['id', 'file', 'find', 'replace']) if (typeof m?.[k] !== 'string' || m[k] === '') problems.push(`"${k}" must be a non-empty string`);
	if (problems.length) return problems;
	if (m.find === m.replace) problems.push('"replace" equals "find"');
	if (m.tests !== undefined && !(Array.isArray(m.tests) && m.tests.every((t) => typeof t === 'string'))) problems.push('"tests" must be an array of test file paths');
	const path = join(root, m.file);
	if (!existsSync(path)) problems.push(`file ${m.file} does not exist`);
	else {
		const n = count(readFileSync(path, 'utf8'), m.find);
		if (n !== 1) problems.push(`"find" occurs ${n} times in ${m.file} (must be exactly once)`);
	}
	for (const t of m.tests ?? []) if (!existsSync(join(root, t))) problems.push(`test file ${t} does not exist`);
	return problems;
}

/** Run vitest on the given files (all when empty); true when every test passed. */
function testsPass(tests) {
	const r = spawnSync(process.execPath, [vitest, 'run', '--bail=1', '--reporter=dot', ...tests], { cwd: root, encoding: 'utf8', env: { ...process.env, CI: '1' } });
	if (!quiet) process.stdout.write(r.stdout + r.stderr);
	return r.status === 0;
}

let restore = null;
for (const sig of ['SIGINT', 'SIGTERM']) {
	process.on(sig, () => {
		if (restore) restore();
		process.exit(130);
	});
}

const all = JSON.parse(readFileSync(listFile, 'utf8'));
if (!Array.isArray(all)) throw new Error('tests/mutants.json must hold a JSON array');
const mutants = only.length ? all.filter((m) => only.includes(m?.id)) : all;
const unknown = only.filter((id) => !all.some((m) => m?.id === id));
if (unknown.length) console.log(`not in tests/mutants.json: ${unknown.join(', ')}`);

const results = [];
for (const [i, m] of mutants.entries()) {
	const label = `${String(i + 1).padStart(2)}/${mutants.length} ${m?.id ?? '(no id)'}`;
	const problems = checkEntry(m);
	if (problems.length) {
		results.push({ id: m?.id, verdict: 'invalid', detail: problems.join('; ') });
		console.log(`${label}: INVALID — ${problems.join('; ')}`);
		continue;
	}
	const tests = m.tests ?? [];
	const t0 = Date.now();
	if (!testsPass(tests)) {
		results.push({ id: m.id, verdict: 'broken', detail: 'its tests fail on the unchanged code' });
		console.log(`${label}: BROKEN — its tests fail without the mutant`);
		continue;
	}
	const path = join(root, m.file);
	const original = readFileSync(path, 'utf8');
	restore = () => writeFileSync(path, original);
	let killed;
	try {
		writeFileSync(path, original.replace(m.find, () => m.replace));
		killed = !testsPass(tests);
	} finally {
		restore();
		restore = null;
	}
	const s = ((Date.now() - t0) / 1000).toFixed(1);
	results.push({ id: m.id, verdict: killed ? 'killed' : 'survived', detail: m.why ?? '' });
	console.log(`${label}: ${killed ? 'killed' : 'SURVIVED'} (${s} s) — ${m.why ?? ''}`);
}

const tally = (v) => results.filter((r) => r.verdict === v).length;
console.log(`\n${tally('killed')} killed, ${tally('survived')} survived, ${tally('broken')} broken, ${tally('invalid')} invalid — of ${results.length}`);
process.exitCode = results.length > 0 && results.every((r) => r.verdict === 'killed') && !unknown.length ? 0 : 1;
