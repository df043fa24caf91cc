/**
 * Writes a Y4M video (YUV 4:2:0, grey: chroma 128) of a Gaussian beam for Chromium's fake camera
 * (`--use-file-for-fake-video-capture`). The beam is exp(−2(a²/wa² + b²/wb²)) in its principal
 * coordinates (a at `angle_rad` clockwise from +x as displayed, image y down), so its D4σ widths are
 * 2·wa and 2·wb (second moments of a Gaussian: σ = w/2; Siegman, "Lasers" 1986, §17.1).
 * Y4M layout: a "YUV4MPEG2 …" header line, then per frame "FRAME\n" + Y plane + U + V planes
 * (format described in the mjpegtools yuv4mpeg(5) manual page — from memory).
 */
import { writeFileSync } from 'node:fs';

export interface BeamFrameSpec {
	width: number;
	height: number;
	frames: number;
	/** 1/e² radii along the principal axes, pixels. */
	wa_px: number;
	wb_px: number;
	angle_rad: number;
	/** Centre at frame 0, pixels; drifts by `drift_px` per frame along x. */
	cx: number;
	cy: number;
	drift_px?: number;
	/** Luma of the background and of the beam's peak above it (Y units; video range 16–235). */
	background: number;
	peak: number;
	/** Standard deviation of the added noise, Y units. */
	noise: number;
	seed?: number;
	/** Frames per second written in the header (the fake camera plays at this rate); default 10. */
	fps?: number;
}

export function writeBeamY4m(path: string, s: BeamFrameSpec): void {
	const { width: W, height: H } = s;
	const header = Buffer.from(`YUV4MPEG2 W${W} H${H} F${s.fps ?? 10}:1 Ip A1:1 C420jpeg\n`, 'ascii');
	const ySize = W * H;
	const cSize = (W / 2) * (H / 2);
	const frameBytes = 6 + ySize + 2 * cSize;
	const out = Buffer.alloc(header.length + s.frames * frameBytes);
	header.copy(out, 0);
	let a = (s.seed ?? 1) >>> 0;
	const uni = () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
	const gauss = () => Math.sqrt(-2 * Math.log(uni() || 1e-12)) * Math.cos(2 * Math.PI * uni());
	const c = Math.cos(s.angle_rad);
	const sn = Math.sin(s.angle_rad);
	let off = header.length;
	for (let f = 0; f < s.frames; f++) {
		out.write('FRAME\n', off, 'ascii');
		off += 6;
		const cx = s.cx + (s.drift_px ?? 0) * f;
		for (let y = 0; y < H; y++) {
			for (let x = 0; x < W; x++) {
				const dx = x - cx;
				const dy = y - s.cy;
				const pa = dx * c + dy * sn;
				const pb = -dx * sn + dy * c;
				const v = s.background + s.peak * Math.exp(-2 * ((pa * pa) / (s.wa_px * s.wa_px) + (pb * pb) / (s.wb_px * s.wb_px))) + s.noise * gauss();
				out[off++] = Math.max(0, Math.min(255, Math.round(v)));
			}
		}
		out.fill(128, off, off + 2 * cSize);
		off += 2 * cSize;
	}
	writeFileSync(path, out);
}
