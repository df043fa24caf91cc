#!/usr/bin/env node
// `npm run bench`: prints every figure the issues name. Each bench/*.bench.ts exports
// `run(): Promise<Row[]>` (bench/stats.ts): figure, min / median / max, the reference measured in the
// same run, the ratio to it, and the goal stated as that ratio. Verdicts judge the ratio, so they hold
// when other processes load the machine; the absolute figures are printed only beside their reference.
// `npm run bench -- browser` runs the files whose name contains "browser"; a second word picks a part of
// that file, passed on as BW_BENCH_PART (the browser bench: `bytes`, `load` or `drag`, comma-separated),
// e.g. `npm run bench -- browser drag`.
import { register } from 'tsx/esm/api';
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { loadavg } from 'node:os';

register();
const dir = join(dirname(fileURLToPath(import.meta.url)), '..', 'bench');
const { verdictText } = await import(join(dir, 'stats.ts'));
const only = process.argv[2];
if (process.argv[3]) process.env.BW_BENCH_PART = process.argv[3];
const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only))).sort();

function fmt(v) {
	if (v === undefined || v === null || !Number.isFinite(v)) return '–';
	return Math.abs(v) >= 1e5 || (Math.abs(v) < 1e-2 && v !== 0) ? v.toExponential(2) : String(Number(v.toPrecision(3)));
}

console.log(`load average at start: ${loadavg().map((x) => x.toFixed(2)).join(' ')} (2 cores: above ~1 the absolute figures are slowed; the ratios still hold)`);
console.log(`${'file'.padEnd(8)} ${'figure'.padEnd(62)} ${'min / median / max'.padStart(24)} ${'unit'.padEnd(7)} ${'reference (median)'.padEnd(26)} ${'ratio'.padStart(7)}  goal`);
for (const f of files) {
	const mod = await import(join(dir, f));
	const rows = await mod.run();
	for (const r of rows) {
		const spreadText = r.min !== undefined ? `${fmt(r.min)} / ${fmt(r.value)} / ${fmt(r.max)}` : fmt(r.value);
		const refText = r.ref ? `${r.ref.name} ${fmt(r.ref.value)} ${r.ref.unit ?? r.unit}` : '';
		const ratioText = r.ratio !== undefined ? `${fmt(r.ratio)}×` : '';
		const verdict = verdictText(r);
		console.log(`${f.replace('.bench.ts', '').padEnd(8)} ${r.figure.padEnd(62)} ${spreadText.padStart(24)} ${r.unit.padEnd(7)} ${refText.padEnd(26)} ${ratioText.padStart(7)}  ${r.goal}${verdict}`);
	}
}
console.log(`load average at end: ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
