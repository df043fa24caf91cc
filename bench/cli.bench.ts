/**
 * CLI start-up: wall time of `npx beamwright beam …` (median of 10, after one warm-up run) next to
 * `node -e 0` measured in the same run on the same machine; goal ≤ 2.5 × `node -e 0`. Also the
 * program alone (`node bin/beamwright.js beam …`, no npx in front), which shows what the compiled
 * CLI itself costs. Runs `npm run build:cli` first when dist/ is missing.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const beamArgs = ['beam', '--wavelength', '1064nm', '--waist', '0.5mm', '--at', '2m'];

function median(xs: number[]): number {
	const s = [...xs].sort((a, b) => a - b);
	return s[Math.floor(s.length / 2)];
}

function wall_ms(cmd: string, args: string[], runs = 10): number {
	spawnSync(cmd, args, { stdio: 'ignore' }); // warm-up: file cache
	const t: number[] = [];
	for (let i = 0; i < runs; i++) {
		const t0 = performance.now();
		const r = spawnSync(cmd, args, { stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
		t.push(performance.now() - t0);
		if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed: ${r.stderr}`);
	}
	return median(t);
}

export async function run() {
	if (!existsSync('dist/cli.js')) spawnSync('npm', ['run', 'build:cli'], { stdio: 'inherit' });
	const node = wall_ms(process.execPath, ['-e', '0']);
	const npx = wall_ms('npx', ['--no', 'beamwright', ...beamArgs]);
	const bin = wall_ms(process.execPath, ['bin/beamwright.js', ...beamArgs]);
	return [
		{ figure: '`node -e 0` wall time (median of 10)', value: node, unit: 'ms', goal: 'reference' },
		{ figure: '`npx beamwright beam …` wall time (median of 10)', value: npx, unit: 'ms', goal: '≤ 2.5 × node -e 0' },
		{ figure: '`npx beamwright beam …` / `node -e 0`', value: npx / node, unit: '×', goal: '≤ 2.5', ok: npx / node <= 2.5 },
		{ figure: '`node bin/beamwright.js beam …` / `node -e 0` (no npx)', value: bin / node, unit: '×', goal: '≤ 2.5', ok: bin / node <= 2.5 }
	];
}
