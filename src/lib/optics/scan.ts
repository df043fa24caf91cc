/**
 * Predicted cavity scan: transmitted and reflected power against detuning (laser frequency or cavity
 * length, expressed as frequency), each HG_mn mode an Airy line of the cavity's linewidth at its own
 * resonance, weighted by the injected power fraction in that mode (spectrum.ts, modeContent.ts).
 * The modes add in power: they are orthogonal and resonate at different detunings (Siegman, "Lasers",
 * 1986, §11.3 for the line shape). Power in modes beyond those listed is taken as reflected, off resonance.
 */
import { requireThat } from './constants';
import { airyLine, airyLineAt, type CavitySpectrum } from './spectrum';
import type { ModeFraction } from './modeContent';

export interface ScanPeak {
	m: number;
	n: number;
	/** Where the peak sits in the scan, Hz from the TEM00 resonance at 0. */
	detuning_Hz: number;
	/** Injected power fraction in this mode. */
	power: number;
	/** Transmitted power at the peak, and the reflected power at its dip, W. */
	transmitted_W: number;
	reflectedDip_W: number;
}

export interface PredictedScan {
	detuning_Hz: Float64Array;
	transmitted_W: Float64Array;
	reflected_W: Float64Array;
	/** Peaks inside the window with a transmitted height ≥ minPeak × the largest; largest first. */
	peaks: ScanPeak[];
}

export interface ScanOptions {
	from_Hz: number;
	to_Hz: number;
	points?: number;
	/** Smallest peak listed, relative to the largest (default 1e-4). */
	minPeak?: number;
}

export function predictedScan(
	spectrum: CavitySpectrum,
	modes: ModeFraction[],
	cavity: { reflectivity1: number; reflectivity2: number; roundTripLoss?: number },
	inputPower_W: number,
	opts: ScanOptions
): PredictedScan {
	requireThat(Number.isFinite(inputPower_W) && inputPower_W > 0, 'input power', '> 0 W', inputPower_W, 'W');
	requireThat(Number.isFinite(opts.from_Hz) && Number.isFinite(opts.to_Hz) && opts.to_Hz > opts.from_Hz, 'scan window', 'from < to (finite, Hz)', `${opts.from_Hz} … ${opts.to_Hz}`, 'Hz');
	const n = opts.points ?? 2001;
	requireThat(Number.isInteger(n) && n >= 2 && n <= 1e6, 'scan points', 'a whole number from 2 to 1 000 000', n);
	const fsr = spectrum.fsr_Hz;
	const loss = cavity.roundTripLoss ?? 0;
	const lines: { m: number; n: number; f: number; power: number }[] = [];
	for (const md of modes) {
		const sm = spectrum.modes.find((s) => s.m === md.m && s.n === md.n);
		if (!sm || !(md.power > 0)) continue;
		lines.push({ m: md.m, n: md.n, f: sm.folded_Hz, power: md.power });
	}
	const listed = lines.reduce((s, l) => s + l.power, 0);
	const rest = Math.max(0, 1 - listed);
	const det = new Float64Array(n);
	const tr = new Float64Array(n);
	const rf = new Float64Array(n);
	const step = (opts.to_Hz - opts.from_Hz) / (n - 1);
	const line = airyLineAt(cavity.reflectivity1, cavity.reflectivity2, loss);
	const a = { transmitted: 0, reflected: 0 };
	for (let i = 0; i < n; i++) {
		const nu = opts.from_Hz + i * step;
		det[i] = nu;
		let t = 0;
		let r = rest;
		for (const l of lines) {
			line((2 * Math.PI * (nu - l.f)) / fsr, a);
			t += l.power * a.transmitted;
			r += l.power * a.reflected;
		}
		tr[i] = t * inputPower_W;
		rf[i] = r * inputPower_W;
	}
	const peak = airyLine(0, cavity.reflectivity1, cavity.reflectivity2, loss);
	const peaks: ScanPeak[] = [];
	for (const l of lines) {
		const k0 = Math.ceil((opts.from_Hz - l.f) / fsr);
		for (let k = k0; l.f + k * fsr <= opts.to_Hz; k++) {
			peaks.push({ m: l.m, n: l.n, detuning_Hz: l.f + k * fsr, power: l.power, transmitted_W: l.power * peak.transmitted * inputPower_W, reflectedDip_W: (1 - l.power * (1 - peak.reflected)) * inputPower_W });
		}
	}
	const top = peaks.reduce((s, p) => Math.max(s, p.transmitted_W), 0);
	const min = opts.minPeak ?? 1e-4;
	return { detuning_Hz: det, transmitted_W: tr, reflected_W: rf, peaks: peaks.filter((p) => p.transmitted_W >= min * top).sort((a, b) => b.transmitted_W - a.transmitted_W || a.detuning_Hz - b.detuning_Hz) };
}

/**
 * Find the peaks of a measured trace (detuning, power): local maxima above `minHeight` × the largest
 * value, at least `minSeparation_Hz` apart (the higher one wins). Returns them by detuning.
 */
export function findPeaks(detuning_Hz: ArrayLike<number>, power: ArrayLike<number>, minSeparation_Hz: number, minHeight = 0.002): { detuning_Hz: number; height: number }[] {
	const n = detuning_Hz.length;
	requireThat(n === power.length && n >= 3, 'scan trace', 'at least 3 rows of detuning and power', n);
	let top = 0;
	for (let i = 0; i < n; i++) top = Math.max(top, power[i]);
	const cands: { detuning_Hz: number; height: number }[] = [];
	for (let i = 0; i < n; i++) {
		const p = power[i];
		if (!(p >= minHeight * top) || p <= 0) continue;
		const left = i > 0 ? power[i - 1] : -Infinity;
		const right = i < n - 1 ? power[i + 1] : -Infinity;
		if (p >= left && p > right) cands.push({ detuning_Hz: detuning_Hz[i], height: p });
	}
	cands.sort((a, b) => b.height - a.height);
	const kept: { detuning_Hz: number; height: number }[] = [];
	for (const c of cands) if (kept.every((k) => Math.abs(k.detuning_Hz - c.detuning_Hz) >= minSeparation_Hz)) kept.push(c);
	return kept.sort((a, b) => a.detuning_Hz - b.detuning_Hz);
}
