/** Read and validate a setup document named on the command line (the same checks as the app's import). */
import { readText } from './readText';
import { CliInputError } from './args';
import { parseSetupJson, type SetupDoc } from '../lib/document/schema';

export async function readSetupFile(file: string | undefined, command: string): Promise<SetupDoc> {
	if (!file) throw new CliInputError(`setup: a setup JSON file is required — e.g. npx beamwright ${command} setup.json`);
	let text: string;
	try {
		text = await readText(file);
	} catch {
		throw new CliInputError(`setup: cannot read "${file}"`);
	}
	const parsed = parseSetupJson(text);
	if (!parsed.ok) throw new CliInputError(`setup: ${file} is refused — ${parsed.reason}`);
	return parsed.doc;
}
