/** Shared by `spectrum` and `diagnose`: the cavity lab of a setup file, or one line naming what is wrong. */
import { CliInputError } from '../args';
import { compileSource, type FieldError } from '../../lib/document/compile';
import { compileMatchSection } from '../../lib/document/match';
import { compileLab } from '../../lib/document/cavityLab';
import type { SetupDoc } from '../../lib/document/schema';

export function compileLabForCli(doc: SetupDoc, file: string | undefined) {
	if (!doc.match) throw new CliInputError(`setup: ${file} has no "match" section with a cavity target`);
	const errs: FieldError[] = [];
	const source = compileSource(doc, errs);
	if (errs.length) throw new CliInputError(`setup: ${errs[0].path}: ${errs[0].message}`);
	const match = compileMatchSection(doc.match, source, doc);
	const kind = (doc.match as { target?: { kind?: string } }).target?.kind;
	if (kind !== 'cavity' && kind !== 'ring') throw new CliInputError(`setup: match.target.kind must be "cavity" or "ring" for a cavity spectrum — got "${String(kind)}"`);
	const targetError = Object.entries(match.fieldErrors).find(([k]) => k.startsWith('target'));
	if (targetError) throw new CliInputError(`setup: match.${targetError[0]}: ${targetError[1]}`);
	const report = compileLab(doc, match);
	const labError = Object.entries(report.fieldErrors)[0];
	if (labError) throw new CliInputError(`setup: match.lab.${labError[0]}: ${labError[1]}`);
	if (report.blocked) throw new CliInputError(`setup: ${report.blocked}`);
	if (!report.spectrum || !report.content) throw new CliInputError('setup: the cavity spectrum cannot be computed');
	return { report, match };
}
