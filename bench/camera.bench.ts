/**
 * Measure-instrument figures: the live camera's measured frame rate at 1280 × 720 in Chromium (fake
 * camera fed by a synthetic Y4M file of a Gaussian beam, frames measured in the page's worker as the
 * user sees them, "frames measured per second" read off the page), and the knife-edge fit time.
 * References (same run): for the live rate, a hand-written tight loop over one 1280 × 720 frame (raw
 * moments, one pass) — the worker's time per frame is judged against it; for the knife-edge fit, a
 * tight loop evaluating the erf model at every point once (one pass of the fit's inner work).
 */
import { spawn, execSync } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from '@playwright/test';
import { erf, fitKnifeEdge } from '../src/lib/optics/iso11146/knifeEdge';
import { writeBeamY4m } from '../tests/e2e/support/y4m';
import { momentLoop, ratioRow, refRow, repeat, spread, timed, type Row } from './stats';

const PORT = 4319;

function knifeScan(n: number, seed: number) {
	let a = seed;
	const rnd = () => ((a = (a * 1103515245 + 12345) % 2147483648) / 2147483648 - 0.5) * 0.01;
	return Array.from({ length: n }, (_, i) => {
		const x = -2.5e-3 + (5e-3 * i) / (n - 1);
		return { x_m: x, P_W: 0.01 + 0.5 * (1 + erf((Math.SQRT2 * (x - 0.2e-3)) / 1e-3)) + rnd() };
	});
}

export async function run(): Promise<Row[]> {
	const rows: Row[] = [];
	// Knife-edge fit.
	const scan41 = knifeScan(41, 7);
	const scan401 = knifeScan(401, 9);
	const evalLoop = (pts: typeof scan41) => () => timed(() => {
		let s = 0;
		for (const p of pts) s += erf((Math.SQRT2 * (p.x_m - 0.2e-3)) / 1e-3);
		return s;
	});
	const ref41 = repeat(evalLoop(scan41));
	const fit41 = repeat(() => timed(() => fitKnifeEdge(scan41)));
	const fit401 = repeat(() => timed(() => fitKnifeEdge(scan401)));
	const ref401 = repeat(evalLoop(scan401));
	rows.push(refRow('tight loop: erf model at 41 scan points, once', 'ms', ref41));
	rows.push(ratioRow('knife-edge fit, 41 points (erf least squares + clip levels)', 'ms', fit41, 'erf loop 41', ref41, null));
	rows.push(ratioRow('knife-edge fit, 401 points', 'ms', fit401, 'erf loop 401', ref401, null));

	// Live camera at 1280 × 720.
	if (!existsSync('build/index.html')) execSync('npm run build', { stdio: 'ignore' });
	const dir = mkdtempSync(join(tmpdir(), 'bw-bench-cam-'));
	const video = join(dir, 'cam.y4m');
	writeBeamY4m(video, { width: 1280, height: 720, frames: 8, fps: 30, wa_px: 90, wb_px: 60, angle_rad: 0.3, cx: 640, cy: 360, drift_px: 0.5, background: 40, peak: 170, noise: 1.5 });
	const frame = new Uint8Array(1280 * 720).map((_, i) => (i * 7919) % 251);
	const refFrame = repeat(() => timed(() => momentLoop(frame, 1280, 720)));
	const server = spawn(process.execPath, ['scripts/serve.js', '--port', String(PORT), '--quiet'], { stdio: 'ignore' });
	await new Promise((r) => setTimeout(r, 500));
	const browser = await chromium.launch({
		executablePath: existsSync('/usr/bin/chromium') ? '/usr/bin/chromium' : undefined,
		args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run',
			'--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-video-capture=${video}`]
	});
	try {
		const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
		await page.goto(`http://localhost:${PORT}/measure/`);
		await page.getByTestId('pixel-pitch').fill('5 um');
		await page.getByTestId('live-open').click();
		await page.getByTestId('live-start').click();
		await page.getByTestId('live-readout').waitFor({ timeout: 60_000 });
		const fps: number[] = [];
		const work: number[] = [];
		await page.waitForTimeout(2500);
		for (let i = 0; i < 6; i++) {
			await page.waitForTimeout(1000);
			const t = await page.getByTestId('live-rate').innerText();
			const m = /([\d.]+) frames measured per second/.exec(t);
			const w = /([\d.]+) ms per frame in the worker/.exec(t);
			if (m) fps.push(Number(m[1]));
			if (w) work.push(Number(w[1]));
		}
		const f = spread(fps.slice(1));
		rows.push({ figure: 'live camera 1280×720: frames measured per second (fake camera at 30 fps)', unit: 'fps', value: f.med, min: f.min, max: f.max, goal: '≥ 10', ok: f.med >= 10 });
		rows.push(refRow('tight loop: raw moments of one 1280×720 frame', 'ms', refFrame));
		rows.push(ratioRow('live camera: worker time per 1280×720 frame', 'ms', spread(work.slice(1)), 'frame loop', refFrame, null, false, 'grey, average, dark, moments'));
	} finally {
		await browser.close();
		server.kill();
	}
	return rows;
}
