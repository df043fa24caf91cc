// The page's readiness as islands are armed and taken over (src/lib/ui/island/pending.ts). In Node there
// is no document: the take-over on input is covered by the browser test in tests/e2e/bench.spec.ts
// ("input aimed at the page the moment it says it answers is not lost").
import { describe, expect, it } from 'vitest';
import { holdReady, islandsAnswerInput, islandsTakenOver } from '../../src/lib/ui/island/pending';

/** Whether the promise has settled once pending microtasks have run. */
async function settled(p: Promise<void>) {
	let done = false;
	void p.then(() => (done = true));
	await new Promise((r) => setTimeout(r, 0));
	return done;
}

const el = {} as Element;

describe('island readiness', () => {
	it('answers input once every input island is armed or taken over; shows everything once all are taken over', async () => {
		const workspace = holdReady('input');
		const plot = holdReady('drawing');
		const answering = islandsAnswerInput();
		const allTaken = islandsTakenOver(['input', 'drawing']);
		expect(await settled(answering)).toBe(false);
		workspace.arm(el, () => {});
		expect(await settled(answering)).toBe(true);
		expect(await settled(allTaken)).toBe(false);
		workspace.done();
		expect(await settled(allTaken)).toBe(false); // the drawing island still shows the demo
		plot.done();
		expect(await settled(allTaken)).toBe(true);
	});

	it('a drawing island never holds input back, and an island taken over without being armed counts once', async () => {
		const plot = holdReady('drawing');
		expect(await settled(islandsAnswerInput())).toBe(true);
		const form = holdReady('input');
		const answering = islandsAnswerInput();
		form.done();
		form.done();
		form.arm(el, () => {}); // too late: already taken over
		expect(await settled(answering)).toBe(true);
		expect(await settled(islandsTakenOver(['input']))).toBe(true);
		const next = holdReady('input');
		expect(await settled(islandsAnswerInput())).toBe(false);
		next.done();
		plot.done();
		expect(await settled(islandsTakenOver(['input', 'drawing']))).toBe(true);
	});
});
