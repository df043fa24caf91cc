/**
 * Web Worker for the live camera (comlink): each frame (RGBA pixels grabbed from the <video>) becomes a
 * grey image, joins the running average of N frames, has the dark frame taken off, and is measured
 * (centroid, D4σ widths, principal axes) with the same moment code as imported images. Frames never
 * leave this browser tab.
 */
import { expose, transfer } from 'comlink';
import { encode } from 'fast-png';
import { FrameAverager, checkSignal, greyOfRgba } from '$lib/io/liveFrame';
import { beamMoments, type BeamMoments } from '$lib/optics/iso11146/index';

export interface LiveResult {
	width: number;
	height: number;
	/** Frames in the average. */
	averaged: number;
	/** Pixels with a channel at the top of the 8-bit range, in the newest frame. */
	saturated: number;
	/** Peak above the median after dark subtraction, counts (0–255 scale). */
	peakAboveMedian: number;
	weak: boolean;
	darkSubtracted: boolean;
	moments: BeamMoments | null;
	/** Why no widths could be computed (no beam, degenerate). */
	error: string | null;
	/** Time spent in the worker on this frame, ms. */
	work_ms: number;
}

let averager: FrameAverager | null = null;
let averageN = 1;
let dark: Float32Array | null = null;
let lastSaturated = 0;

const api = {
	/** Frames to average (1–100); restarts the average. */
	setAverage(n: number): void {
		averageN = n;
		averager = null;
	},
	/** Analyse one RGBA frame. */
	frame(rgba: Uint8ClampedArray, width: number, height: number, pixelPitch_m: number): LiveResult {
		const t0 = performance.now();
		const { grey, saturated } = greyOfRgba(rgba, width, height);
		lastSaturated = saturated;
		if (!averager || averager.width !== width || averager.height !== height) {
			averager = new FrameAverager(width, height, averageN);
			if (dark && dark.length !== width * height) dark = null;
		}
		averager.push(grey);
		// One frame and no dark frame: the grey frame itself (no copy into floats).
		const img = { width, height, data: averageN === 1 && !dark ? grey : averager.mean(dark) };
		const sig = checkSignal(img);
		let moments: BeamMoments | null = null;
		let error: string | null = null;
		try {
			moments = beamMoments(img, { pixelPitch_m });
		} catch (e) {
			error = (e as Error).message;
		}
		return {
			width,
			height,
			averaged: averager.count,
			saturated,
			peakAboveMedian: sig.peakAboveMedian,
			weak: sig.weak,
			darkSubtracted: dark !== null,
			moments,
			error,
			work_ms: performance.now() - t0
		};
	},
	/** Take the current average as the dark frame (beam blocked). */
	captureDark(): { ok: true; frames: number } | { ok: false; message: string } {
		if (!averager || averager.count === 0) return { ok: false, message: 'No camera frame yet: start the camera first.' };
		dark = averager.mean(null);
		averager = new FrameAverager(averager.width, averager.height, averageN);
		return { ok: true, frames: averageN };
	},
	clearDark(): void {
		dark = null;
	},
	/** The averaged frame (before dark subtraction) as an 8-bit greyscale PNG. */
	png(): { bytes: Uint8Array; width: number; height: number; frames: number; saturated: number } | null {
		if (!averager || averager.count === 0) return null;
		const m = averager.mean(null);
		const data = new Uint8Array(m.length);
		for (let i = 0; i < m.length; i++) data[i] = Math.max(0, Math.min(255, Math.round(m[i])));
		const bytes = encode({ width: averager.width, height: averager.height, data, channels: 1, depth: 8 });
		return transfer({ bytes, width: averager.width, height: averager.height, frames: averager.count, saturated: lastSaturated }, [bytes.buffer]);
	}
};

export type LiveWorkerApi = typeof api;
expose(api);
