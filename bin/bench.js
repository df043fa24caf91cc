#!/usr/bin/env node
// `npm run bench`: prints every figure the issues name. Each bench/*.bench.ts exports
// `run(): Promise<Array<{ figure: string, value: number, unit: string, goal: string, ok?: boolean }>>`.
import { register } from 'tsx/esm/api';
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

register();
const dir = join(dirname(fileURLToPath(import.meta.url)), '..', 'bench');
const only = process.argv[2];
const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only))).sort();
for (const f of files) {
	const mod = await import(join(dir, f));
	const rows = await mod.run();
	for (const r of rows) {
		const v = Math.abs(r.value) >= 1e5 || (Math.abs(r.value) < 1e-2 && r.value !== 0) ? r.value.toExponential(3) : Number(r.value.toPrecision(4));
		const verdict = r.ok === undefined ? '' : r.ok ? '  [meets goal]' : '  [MISSES goal]';
		console.log(`${f.replace('.bench.ts', '').padEnd(10)} ${r.figure.padEnd(58)} ${String(v).padStart(12)} ${r.unit.padEnd(8)} goal ${r.goal}${verdict}`);
	}
}
