/** Display helpers for the hazard workspace and its printed summary: SI first, mW/cm² or mJ/cm² beside. */
import { formatNumber, formatSI } from '$lib/units/format';

export const fmtE = (W_m2: number) => `${formatNumber(W_m2, 4)} W/m² (${formatNumber(W_m2 * 0.1, 4)} mW/cm²)`;
export const fmtH = (J_m2: number) => `${formatNumber(J_m2, 4)} J/m² (${formatNumber(J_m2 * 0.1, 4)} mJ/cm²)`;
export const fmtM = (m: number) => formatSI(m, 'm', 4);
export const fmtS = (s: number) => formatSI(s, 's', 4);
export const fmtNm = (m: number) => `${formatNumber(m * 1e9, 5)} nm`;
export const fmtN = (x: number, sig = 4) => formatNumber(x, sig);
