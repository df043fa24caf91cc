/**
 * The caution every safety output carries: engine result objects, CLI JSON, the workspace screen and
 * the printed summary all take their text from here, so it is written once and reads the same
 * everywhere.
 */

/** The three sentences, in the order they are shown. */
export const cautionLines = [
	'First-pass estimate, not a hazard evaluation.',
	"The applicable standard, local regulations and the site's laser safety officer decide.",
	'Results depend on the inputs, which the user must verify.'
] as const;

/** The caution as one line, for JSON outputs and table footers. */
export const caution: string = cautionLines.join(' ');

/** Short heading shown above the caution on screen and in print. */
export const cautionHeading = 'Caution';

/**
 * Notes that travel with results of one standard edition, e.g. where a table value was recalled
 * rather than read from the published text. They add to the caution, never replace it.
 */
export interface EditionNote {
	standardId: string;
	text: string;
}

/** Attach the caution to a result object (used by every engine entry point that returns safety numbers). */
export function withCaution<T extends object>(result: T): T & { caution: string } {
	return { ...result, caution };
}
