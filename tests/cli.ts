/**
 * Run the CLI in the test's own process: the same `main()` that `bin/beamwright.js` calls, with its
 * stdout and stderr collected as strings. Use it wherever the test is about what a command prints,
 * not about the process itself (the packaging test starts the real program).
 */
import { main } from '../src/cli/main';

export interface CliRun {
	code: number;
	stdout: string;
	stderr: string;
}

export async function runCli(...args: string[]): Promise<CliRun> {
	let stdout = '';
	let stderr = '';
	const code = await main(args, { out: (t) => (stdout += t), err: (t) => (stderr += t) });
	return { code, stdout, stderr };
}
