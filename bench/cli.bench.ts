/**
 * CLI start-up: wall time of `npx beamwright beam …` next to `node -e 0` measured in the same run on the
 * same machine (each once to warm the file cache, then 10 times, min / median / max); goal ≤ 2.5 ×
 * `node -e 0`. Also the program alone (`node bin/beamwright.js beam …`, no npx in front), which shows
 * what the compiled CLI itself costs, and `npx` running `node -e 0` (npm's own start, which no package can
 * shorten: the floor under any `npx <program>`). Runs `npm run build:cli` first when dist/ is missing.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { ratioRow, refRow, spread, type Row, type Spread } from './stats';

const beamArgs = ['beam', '--wavelength', '1064nm', '--waist', '0.5mm', '--at', '2m'];

function wall_ms(cmd: string, args: string[], runs = 10): Spread {
	spawnSync(cmd, args, { stdio: 'ignore' }); // warm-up: file cache
	const t: number[] = [];
	for (let i = 0; i < runs; i++) {
		const t0 = performance.now();
		const r = spawnSync(cmd, args, { stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
		t.push(performance.now() - t0);
		if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed: ${r.stderr}`);
	}
	return spread(t);
}

export async function run(): Promise<Row[]> {
	if (!existsSync('dist/cli.js')) spawnSync('npm', ['run', 'build:cli'], { stdio: 'inherit' });
	const node = wall_ms(process.execPath, ['-e', '0']);
	const npx = wall_ms('npx', ['--no', 'beamwright', ...beamArgs]);
	const bin = wall_ms(process.execPath, ['bin/beamwright.js', ...beamArgs]);
	const npxFloor = wall_ms('npx', ['--no', '--', 'node', '-e', '0']);
	return [
		refRow('`node -e 0` wall time (10 runs)', 'ms', node),
		ratioRow('`npx beamwright beam …` wall time (10 runs)', 'ms', npx, 'node -e 0', node, 2.5),
		ratioRow('`node bin/beamwright.js beam …` (no npx)', 'ms', bin, 'node -e 0', node, 2.5),
		ratioRow('`npx node -e 0` (npm start alone, the floor under any npx command)', 'ms', npxFloor, 'node -e 0', node, null),
		ratioRow('`npx beamwright beam …` against `npx node -e 0`', 'ms', npx, 'npx node -e 0', npxFloor, null, false, 'what Beamwright adds over npm’s own start')
	];
}
