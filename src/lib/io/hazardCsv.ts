/**
 * The Hazard workspace's result tables as CSV files (see csvOut.ts for the layout). Every file carries
 * the caution (src/lib/safety/cautions.ts) in its header, and every value row the source and the
 * provenance of the limit it rests on, so a number never travels without them.
 *
 * The single-beam results are written long: one row per quantity (section, quantity, value, unit,
 * basis, limit_source, provenance), values in SI units as the engine gives them, the unit in its own
 * column. The further-lines table is written wide: one row per line.
 */
import type { BeamAssessment, LinesAssessment } from '../safety';
import { cautionLines } from '../safety/cautions';
import { toCsv, type CsvColumn } from './csvOut';

type Cell = number | string | null;

const provenanceText = (p: string | undefined, line: string | undefined) =>
	p === undefined ? '' : `${p === 'published-text' ? 'read from the published text' : 'recalled, not verified against the published text'}${line ? ` — ${line}` : ''}`;

const cautionNotes = () => ['Caution: ' + cautionLines.join(' ')];

const resultColumns: CsvColumn[] = [
	{ name: 'section', about: 'exposure limit, pulse rule, correction factor, hazard distance, eyewear, eyewear rule, or skin' },
	{ name: 'quantity', about: 'what the value is' },
	{ name: 'value', about: 'the number, in the unit of the next column (SI); empty when it does not apply (see basis)' },
	{ name: 'unit', about: 'unit of the value: m, s, W/m², J/m², or empty for a pure number' },
	{ name: 'basis', about: 'how the value was reached (rule, viewing condition, worst point)' },
	{ name: 'limit_source', about: 'table, row and text of the standard that the limit behind this value comes from' },
	{ name: 'provenance', about: 'whether that limit was read from the published text or recalled' }
];

/** Every number of the single-beam results (Exposure limit, Hazard distances and eyewear, Skin). */
export function hazardResultsCsv(a: BeamAssessment, setup: string, date?: Date): string {
	const eyeSrc = a.limitSource;
	const eyeProv = provenanceText(a.provenance, a.provenanceLine);
	const rows: Cell[][] = [];
	const eye = (section: string, quantity: string, value: number | null, unit: string, basis = '') => rows.push([section, quantity, value, unit, basis, eyeSrc, eyeProv]);
	const perPulse = a.emission === 'continuous' ? 'over the exposure' : 'per pulse';
	eye('exposure limit', 'exposure duration', a.exposure.duration_s, 's', `${a.exposure.basis}${a.exposure.isDefault ? ` (default; ${a.exposure.source})` : ''}`);
	eye('exposure limit', `limit as irradiance${a.emission === 'pulse train' ? ' (average)' : ''}`, a.mpe_W_m2, 'W/m²', a.rule);
	eye('exposure limit', `limit as radiant exposure (${perPulse})`, a.mpe_J_m2, 'J/m²', a.rule);
	eye('exposure limit', 'limiting aperture diameter', a.limitingAperture_m, 'm');
	for (const f of a.factors) eye('correction factor', `${f.name} (${f.iecName})`, f.value, f.unit, f.meaning);
	for (const r of a.pulseRules ?? []) eye('pulse rule', `limit per pulse: ${r.rule}`, r.applies ? r.perPulse_J_m2 : null, 'J/m²', `${r.applies ? '' : 'not applicable; '}${r.rule === a.rule ? 'this rule limits; ' : ''}${r.detail}`);
	eye('hazard distance', 'NOHD, far-field formula', a.nohdFormula_m, 'm');
	eye('hazard distance', 'NOHD along the beam (aperture-averaged)', a.nohd_m, 'm', a.nohdBeyondRange ? 'beyond the examined path: the value is where the path ends' : 'along the propagated beam');
	eye('hazard distance', 'hazard distance used (the larger)', a.hazardDistance_m, 'm', a.hazardDistanceFrom === 'beam' ? 'along the beam' : 'formula');
	if (a.aided) {
		eye('hazard distance', 'with the optic: gain', a.aided.gain, '');
		eye('hazard distance', 'with the optic: NOHD, formula', a.aided.nohdFormula_m, 'm');
		eye('hazard distance', 'with the optic: NOHD along the beam', a.aided.nohd_m, 'm');
	}
	if (a.diffuse) eye('hazard distance', 'diffuse reflection hazard distance', a.diffuse.distance_m, 'm', `reflectance ${a.diffuse.reflectance}, viewing angle ${+((a.diffuse.viewingAngle_rad * 180) / Math.PI).toPrecision(6)}°`);
	eye('eyewear', 'worst point z', a.odAt_m, 'm');
	eye('eyewear', 'irradiance at the worst point (aperture-averaged)', a.odExposure_W_m2, 'W/m²');
	eye('eyewear', 'optical density required', a.odRequired, '');
	eye('eyewear', 'optical density, rounded up', a.odWhole, '', 'at least this OD');
	if (a.eyewear.perPulse_J_m2 !== null) eye('eyewear', 'radiant exposure per pulse (worst point, averaged)', a.eyewear.perPulse_J_m2, 'J/m²');
	eye('eyewear', 'average irradiance (worst point, averaged)', a.eyewear.averageIrradiance_W_m2, 'W/m²');
	for (const r of a.eyewear.byRule) {
		const sets = r.rule === a.eyewear.setBy ? '; this rule sets the OD' : '';
		eye('eyewear rule', `exposure: ${r.rule}`, r.exposure, r.unit, `worst point, averaged over the rule's aperture${sets}`);
		eye('eyewear rule', `limit: ${r.rule}`, r.limit, r.unit);
		eye('eyewear rule', `aperture: ${r.rule}`, r.limitingAperture_m, 'm');
		eye('eyewear rule', `OD: ${r.rule}`, r.od, '', `rounded up: ${r.odWhole}${sets}`);
	}
	const s = a.skin;
	const skinProv = provenanceText(s.provenance, s.provenanceLine);
	const skin = (quantity: string, value: number | null, unit: string, basis = '') => rows.push(['skin', quantity, value, unit, basis, s.limitSource ?? '', skinProv]);
	if (s.ok) {
		skin('exposure duration (skin)', s.duration_s ?? null, 's', s.durationBasis ?? '');
		skin('skin limit as irradiance', s.mpe_W_m2 ?? null, 'W/m²', s.rule ?? '');
		skin('skin limit as radiant exposure', s.mpe_J_m2 ?? null, 'J/m²', s.rule ?? '');
		skin('skin limiting aperture diameter', s.limitingAperture_m ?? null, 'm');
		skin('worst point: exposure ÷ skin limit', s.ratioAtWorst ?? null, '');
		skin('nominal skin hazard distance', s.nshd_m ?? null, 'm');
	} else skin('skin', null, '', `not evaluated: ${s.message ?? ''}`);
	return toCsv({
		title: 'Hazard: first-pass exposure limit, hazard distances, eyewear and skin',
		setup,
		date,
		notes: [
			...cautionNotes(),
			`Standard: ${a.standard}`,
			`Wavelength: ${+(a.wavelength_m * 1e9).toPrecision(6)} nm; emission: ${a.emission}; power compared: ${+a.power_W.toPrecision(6)} W`,
			...a.notes.map((n) => `Note on this edition: ${n}`)
		],
		columns: resultColumns,
		rows
	});
}

/** The further-lines table (one row per line) and the lines combined per tissue, in one file. */
export function linesCsv(r: LinesAssessment, setup: string, date?: Date): string {
	const rows: Cell[][] = r.lines.map((l, i) => {
		const a = l.result;
		return [
			'line',
			i === 0 ? 'main' : String(i + 1),
			+(l.line.wavelength_m * 1e9).toPrecision(9),
			l.line.power_W,
			l.eyeTissue,
			a.mpe_W_m2,
			a.hazardDistance_m,
			a.odRequired,
			a.odWhole,
			a.skin.ok ? (a.skin.nshd_m ?? null) : null,
			null,
			null,
			a.limitSource,
			provenanceText(a.provenance, a.provenanceLine)
		];
	});
	for (const c of r.combined)
		rows.push(['combined', c.tissue, null, null, c.lines.map((i) => `${+(r.lines[i].line.wavelength_m * 1e9).toPrecision(9)} nm`).join(' + '), null, c.hazardDistance_m, null, null, null, c.worstSingle_m, c.sumAtExit, r.additivityClause, '']);
	return toCsv({
		title: 'Hazard: further lines, each alone and combined per tissue',
		setup,
		date,
		notes: [...cautionNotes(), `Tissue per band: ${r.tissueSource}`, `Combination rule: ${r.additivityClause}`, 'Eyewear must give each line its own OD at its wavelength.'],
		columns: [
			{ name: 'kind', about: '"line" (one line alone) or "combined" (the lines acting on one tissue, summed)' },
			{ name: 'line', about: 'line number ("main" for the beam of the form), or the tissue for a combined row' },
			{ name: 'wavelength_nm', about: 'vacuum wavelength, nm' },
			{ name: 'power_W', about: 'line power, W' },
			{ name: 'tissue', about: 'eye tissue the line acts on; for a combined row, the lines combined' },
			{ name: 'limit_W_m2', about: 'exposure limit as irradiance, W/m²' },
			{ name: 'hazard_distance_m', about: 'hazard distance, m (combined row: where Σ exposure ÷ limit falls to 1)' },
			{ name: 'od_required', about: 'eyewear optical density required at this wavelength' },
			{ name: 'od_whole', about: 'that OD rounded up' },
			{ name: 'skin_hazard_distance_m', about: 'nominal skin hazard distance of the line, m (empty: not evaluated)' },
			{ name: 'worst_single_m', about: 'combined row: hazard distance of the worst line of the group alone, m' },
			{ name: 'sum_at_exit', about: 'combined row: Σ exposure ÷ limit at the exit aperture' },
			{ name: 'limit_source', about: 'table, row and text the limit comes from (combined row: the combination rule)' },
			{ name: 'provenance', about: 'whether that limit was read from the published text or recalled' }
		],
		rows
	});
}
