/**
 * Web Worker for the Measure workspace (comlink): decodes a beam image (PNG or CSV matrix) and
 * computes its centroid and D4σ widths off the main thread. Images stay in this browser tab: the
 * bytes come from a local file the user picked and go nowhere else.
 * Usage (page): const api = wrap<ImageWorkerApi>(new Worker(new URL('./image.worker.ts', import.meta.url), { type: 'module' }));
 */
import { expose, transfer } from 'comlink';
import { decodeBeamImage } from '$lib/io/beamImage';
import { beamMoments, type BeamMoments } from '$lib/optics/iso11146/index';
import { previewOf, type Preview } from './preview';

export interface ImageAnalysis {
	width: number;
	height: number;
	moments: BeamMoments;
	preview: Preview;
}

const api = {
	/** Decode and analyse; a RangeError's message comes back as a rejected promise. */
	analyse(bytes: ArrayBuffer, pixelPitch_m: number): ImageAnalysis {
		const img = decodeBeamImage(new Uint8Array(bytes));
		const moments = beamMoments(img, { pixelPitch_m });
		const preview = previewOf(img);
		return transfer({ width: img.width, height: img.height, moments, preview }, [preview.rgba.buffer]);
	}
};

export type ImageWorkerApi = typeof api;
expose(api);
