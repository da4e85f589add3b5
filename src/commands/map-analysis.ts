/**
 * One wafer map, analysed: the sites of a measurement file converted through the core's batch
 * path, the statistics of the shown quantity over the sites inside the edge exclusion, outlier
 * sites (Tukey's fences), a radial profile, and the picture's data. Shared by `map` and by
 * `record <lot> <wafer> map …`, so both say the same.
 */
import { uniformityStatistics, NON_UNIFORMITY_DEFINITION, RANGE_NON_UNIFORMITY_DEFINITION, type UniformityStatistics } from '../physics/statistics/uniformity.js';
import { TUKEY_CITATION, tukeyFences } from '../physics/statistics/tukey-fences-1977.js';
import { insideEdgeExclusion, radialProfile, sitesOutsideWafer, smallestStandardDiameterMm, type RadialBand } from '../physics/wafer/geometry.js';
import { convertSites, type SiteMeasurement } from '../physics/wafer/site-conversion.js';
import { findConversionModel } from '../physics/resistivity/registry.js';
import { THICKNESS_FACTOR_CITATION } from '../physics/four-point/uhlir-1955-thickness.js';
import type { Dopant } from '../physics/types.js';
import { formatNumber } from '../reply/format.js';
import { assumptionText } from '../reply/messages.js';
import type { ReplySection, ReplyValue, ReplyWarning, WaferMapPicture } from '../reply/reply.js';
import { ArgError } from './args.js';
import { countValue } from './lots/wording.js';
import { dopantLabel, refusalMessage } from './describe.js';
import type { MeasurementFile } from './measurement-file.js';

export type ShownQuantity = 'rs' | 'rho' | 'density' | 'thickness';

/** Edge exclusion when none is given, mm (common practice, no source: 3 mm is usual for 150–300 mm maps). */
export const DEFAULT_EDGE_EXCLUSION_MM = 3;

export interface MapOptions {
  readonly thicknessCm?: number;
  readonly spacingCm?: number;
  /** True when the spacing is the fab's configured head, not typed. */
  readonly spacingFromHead?: boolean;
  readonly dopant?: Dopant;
  readonly modelId?: string;
  readonly diameterMm?: number;
  readonly edgeExclusionMm?: number;
  readonly show?: ShownQuantity;
  /** Lot and wafer for the title (record … map), else the file's wafer id. */
  readonly lotId?: string;
  readonly waferLabel?: string;
}

export interface MapAnalysis {
  readonly shown: ShownQuantity;
  readonly unit: string;
  readonly quantityLabel: string;
  readonly statistics: UniformityStatistics;
  readonly values: readonly ReplyValue[];
  readonly assumptions: readonly string[];
  readonly warnings: readonly ReplyWarning[];
  readonly sections: readonly ReplySection[];
  readonly picture: WaferMapPicture;
  readonly diameterMm: number;
  readonly edgeExclusionMm: number;
  readonly equations: readonly string[];
  readonly sources: readonly string[];
  readonly steps: readonly string[];
  readonly modelId?: string;
  /** Per-site values of the shown quantity (canonical unit; NaN where none). */
  readonly shownValues: Float64Array;
  readonly included: Uint8Array;
}

const QUANTITY: Readonly<Record<ShownQuantity, { label: string; unit: string; sigFigs: number }>> = {
  rs: { label: 'Sheet resistance', unit: 'Ω/□', sigFigs: 4 },
  rho: { label: 'Resistivity', unit: 'Ω·cm', sigFigs: 4 },
  density: { label: 'Dopant density', unit: 'cm⁻³', sigFigs: 3 },
  thickness: { label: 'Thickness', unit: 'µm', sigFigs: 4 },
};

const MAX_LISTED = 12;
const MAX_SITE_ROWS = 10;

function nullable(a: Float64Array | undefined, scale = 1): (number | null)[] | undefined {
  if (!a) return undefined;
  return Array.from(a, (v) => (Number.isNaN(v) ? null : v * scale));
}

function lineList(lines: readonly number[]): string {
  const shown = lines.slice(0, MAX_LISTED).join(', ');
  return lines.length > MAX_LISTED ? `${shown} and ${lines.length - MAX_LISTED} more` : shown;
}

function measurementOf(file: MeasurementFile): SiteMeasurement | undefined {
  switch (file.quantity) {
    case 'sheetResistance':
      return { kind: 'sheetResistance', ohmPerSq: file.values };
    case 'resistivity':
      return { kind: 'resistivity', ohmCm: file.values };
    case 'voltageCurrent':
      return { kind: 'voltageCurrent', voltageV: file.values, currentA: file.currentA! };
    case 'thickness':
      return undefined;
  }
}

/** The quantity shown when none is asked for: what was measured (Rs for V/I). */
function defaultShown(file: MeasurementFile): ShownQuantity {
  return file.quantity === 'resistivity' ? 'rho' : file.quantity === 'thickness' ? 'thickness' : 'rs';
}

export function analyseMap(file: MeasurementFile, options: MapOptions): MapAnalysis {
  const assumptions: string[] = [];
  const warnings: ReplyWarning[] = [];
  const steps: string[] = [];
  const equations: string[] = [NON_UNIFORMITY_DEFINITION, RANGE_NON_UNIFORMITY_DEFINITION, 'outlier: below Q1 − 1.5·IQR or above Q3 + 1.5·IQR (Tukey)'];
  const sources: string[] = [TUKEY_CITATION, 'Non-uniformity definitions: common practice (no published source); the reply states them'];

  // Geometry: the diameter given, or the smallest standard size that holds every site.
  let diameterMm = options.diameterMm;
  if (diameterMm === undefined) {
    diameterMm = smallestStandardDiameterMm(file.xMm, file.yMm);
    if (diameterMm === undefined) throw new ArgError('sites_outside_wafer', 'Some sites lie more than 225 mm from the centre: check that x and y are in mm from the wafer centre (docs/measurement-files.md).');
    assumptions.push(`Wafer diameter ${diameterMm} mm: the smallest standard size that holds every site; give diam <d> if the wafer is larger.`);
  }
  const outside = sitesOutsideWafer(file.xMm, file.yMm, diameterMm);
  if (outside.length > 0) {
    throw new ArgError(
      'sites_outside_wafer',
      `${outside.length === 1 ? '1 site lies' : `${outside.length} sites lie`} outside the ${diameterMm} mm wafer (radius ${diameterMm / 2} mm): line${outside.length === 1 ? '' : 's'} ${lineList(outside.map((i) => file.lines[i]!))}. Check the diameter (diam <d>) and that x and y are in mm from the centre.`,
    );
  }
  const edgeExclusionMm = options.edgeExclusionMm ?? DEFAULT_EDGE_EXCLUSION_MM;
  if (!(edgeExclusionMm >= 0 && edgeExclusionMm < diameterMm / 2)) {
    throw new ArgError('bad_edge', `An edge exclusion of ${formatNumber(edgeExclusionMm)} mm leaves nothing of a ${diameterMm} mm wafer; give edge <mm> between 0 and ${diameterMm / 2} mm.`);
  }
  if (options.edgeExclusionMm === undefined) assumptions.push(`Edge exclusion ${DEFAULT_EDGE_EXCLUSION_MM} mm (the usual value; give edge <mm> for your spec's).`);

  // Per-site conversion through the core.
  const shown = options.show ?? defaultShown(file);
  let rs: Float64Array | undefined;
  let rho: Float64Array | undefined;
  let density: Float64Array | undefined;
  let thickness: Float64Array | undefined;
  let modelId: string | undefined;
  const measurement = measurementOf(file);
  if (!measurement) {
    thickness = file.values;
    if (shown !== 'thickness') throw new ArgError('show_unavailable', 'This is a thickness map: it shows thickness only (leave out show, or use show thickness).');
  } else {
    if (shown === 'thickness') throw new ArgError('show_unavailable', 'This file has no thickness column; show rs, rho or density.');
    const conv = convertSites({
      measurement,
      ...(options.thicknessCm !== undefined ? { thicknessCm: options.thicknessCm } : {}),
      ...(options.spacingCm !== undefined ? { spacingCm: options.spacingCm } : {}),
      ...(options.dopant ? { dopant: options.dopant } : {}),
      ...(options.modelId ? { modelId: options.modelId } : {}),
    });
    if (!conv.ok) throw new ArgError(conv.refusal.code, refusalMessage(conv.refusal));
    const c = conv.value;
    rs = c.sheetResistanceOhmPerSq;
    rho = c.resistivityOhmCm;
    density = c.dopantDensityPerCm3;
    modelId = c.modelId;
    assumptions.push(...c.assumptionCodes.map(assumptionText));
    if (options.spacingFromHead && options.spacingCm !== undefined && rs && rho) {
      assumptions.push(`Probe spacing ${formatNumber(options.spacingCm * 10, { sigFigs: 3 })} mm: the fab's configured head (PROBE_SPACING_MM).`);
    }
    if (rs && rho) {
      equations.push('ρ = Rs·t·F(t/s) at every site');
      sources.push(THICKNESS_FACTOR_CITATION);
      steps.push(`ρ = Rs × ${formatNumber(options.thicknessCm!, { sigFigs: 5 })} cm × F = ${formatNumber(c.thicknessFactor, { sigFigs: 5 })} at every site`);
    }
    if (density && options.dopant) {
      const model = modelId ? findConversionModel(modelId) : undefined;
      if (model) {
        equations.push(...model.equations.slice(0, 2));
        sources.push(model.citation);
        steps.push(`N from ρ at every site by ${model.name} (${dopantLabel(options.dopant)})`);
        assumptions.push(...model.assumptionCodes.map(assumptionText));
      }
      if (c.outsideValidity > 0) warnings.push({ code: 'outside_validity', message: `${c.outsideValidity} site${c.outsideValidity === 1 ? '' : 's'} converted outside the model's validity range: treat their densities as extrapolated.` });
    }
    if (c.refused > 0) warnings.push({ code: 'sites_not_converted', message: `${c.refused} site${c.refused === 1 ? '' : 's'} could not be converted (no value, or outside the model's range) and are left out.` });
    if (shown === 'rho' && !rho) throw new ArgError('missing_thickness', 'To show resistivity give the thickness (thick <t>), e.g. map thick 525um show rho.');
    if (shown === 'density' && !density) {
      throw new ArgError(
        rho ? 'missing_dopant' : 'missing_thickness',
        rho ? 'To show dopant density say the type or dopant (p, n, boron, phos…), e.g. map thick 525um p show density.' : 'To show dopant density give the thickness and the type or dopant, e.g. map thick 525um p show density.',
      );
    }
    if (shown === 'rs' && !rs) throw new ArgError('show_unavailable', 'This file gives resistivity, not sheet resistance; show rho or density.');
  }
  if (file.emptyLines.length > 0) warnings.push({ code: 'sites_without_value', message: `${file.emptyLines.length} site${file.emptyLines.length === 1 ? '' : 's'} without a value (line${file.emptyLines.length === 1 ? '' : 's'} ${lineList(file.emptyLines)}): left out.` });

  const shownValues = shown === 'rs' ? rs! : shown === 'rho' ? rho! : shown === 'density' ? density! : thickness!;
  const scale = shown === 'thickness' ? 1e4 : 1; // thickness cm → µm for display
  const display = scale === 1 ? shownValues : Float64Array.from(shownValues, (v) => v * scale);
  const included = insideEdgeExclusion(file.xMm, file.yMm, diameterMm, edgeExclusionMm);
  const stats = uniformityStatistics(display, included);
  if (stats.count === 0) throw new ArgError('no_sites', `No site with a value lies inside the ${formatNumber(edgeExclusionMm)} mm edge exclusion; give a smaller edge <mm>.`);
  if (stats.count < 5) warnings.push({ code: 'few_sites', message: `Only ${stats.count} sites inside the edge exclusion: uniformity from so few sites is rough.` });
  const q = QUANTITY[shown];
  const fmt = (v: number) => formatNumber(v, { sigFigs: q.sigFigs });

  const values: ReplyValue[] = [
    { key: 'nonUniformityPercent', value: stats.nonUniformityPercent, unit: '%', label: 'Non-uniformity (1σ/mean)', headline: true },
    { key: 'mean', value: stats.mean, unit: q.unit, label: `Mean ${q.label.toLowerCase()}`, headline: true, sigFigs: q.sigFigs },
    { key: 'standardDeviation', value: stats.standardDeviation, unit: q.unit, label: 'Standard deviation (1σ)', sigFigs: 3 },
    { key: 'minimum', value: stats.minimum, unit: q.unit, label: 'Minimum', sigFigs: q.sigFigs },
    { key: 'maximum', value: stats.maximum, unit: q.unit, label: 'Maximum', sigFigs: q.sigFigs },
    { key: 'rangeNonUniformityPercent', value: stats.rangeNonUniformityPercent, unit: '%', label: 'Range non-uniformity ((max − min)/(2·mean))' },
    countValue('siteCount', stats.count, 'Sites in the statistics'),
  ];

  // Outliers (Tukey) over the included sites.
  const fences = tukeyFences(display, included);
  const outlier = new Array<boolean>(display.length).fill(false);
  for (const i of fences.outliers) outlier[i] = true;
  const sections: ReplySection[] = [
    {
      heading: 'How the figures are defined',
      lines: [
        `Statistics over the ${stats.count} sites with a value inside the ${formatNumber(edgeExclusionMm)} mm edge exclusion (of ${file.xMm.length} in the file).`,
        NON_UNIFORMITY_DEFINITION,
        RANGE_NON_UNIFORMITY_DEFINITION,
      ],
    },
  ];
  const siteName = (i: number) => (file.siteNames[i] ? `site ${file.siteNames[i]}` : `line ${file.lines[i]}`);
  sections.push({
    heading: `Outlier sites (Tukey's fences: outside ${fmt(fences.lower)} … ${fmt(fences.upper)} ${q.unit})`,
    lines:
      fences.outliers.length === 0
        ? [stats.count < 5 ? 'Too few sites to call outliers.' : 'None.']
        : [
            ...fences.outliers.slice(0, MAX_LISTED).map((i) => `${siteName(i)} at (${formatNumber(file.xMm[i]!, { sigFigs: 4, trim: true })}, ${formatNumber(file.yMm[i]!, { sigFigs: 4, trim: true })}) mm: ${fmt(display[i]!)} ${q.unit}, ${display[i]! > fences.upper ? 'high' : 'low'}`),
            ...(fences.outliers.length > MAX_LISTED ? [`and ${fences.outliers.length - MAX_LISTED} more (all marked in the picture and the JSON).`] : []),
          ],
  });
  const bands = Math.max(1, Math.min(5, Math.floor(stats.count / 3)));
  const profile: RadialBand[] = radialProfile(file.xMm, file.yMm, display, included, diameterMm / 2 - edgeExclusionMm, bands);
  sections.push({
    heading: 'Radial profile (mean by ring from the centre)',
    table: {
      columns: ['Ring (mm)', 'Sites', `Mean (${q.unit})`, 'From the wafer mean'],
      rows: profile.map((b) => [
        `${formatNumber(b.innerMm, { sigFigs: 3, trim: true })}–${formatNumber(b.outerMm, { sigFigs: 3, trim: true })}`,
        String(b.count),
        b.count > 0 ? fmt(b.mean) : '—',
        b.count > 0 ? `${b.mean >= stats.mean ? '+' : ''}${formatNumber((100 * (b.mean - stats.mean)) / stats.mean, { sigFigs: 2 })} %` : '—',
      ]),
    },
  });
  // A few converted sites in the reply; every site is in the JSON and the picture.
  const columns = ['Site', 'x, y (mm)'];
  if (rs) columns.push('Rs (Ω/□)');
  if (rho) columns.push('ρ (Ω·cm)');
  if (density) columns.push('N (cm⁻³)');
  if (thickness) columns.push('t (µm)');
  const rows: string[][] = [];
  for (let i = 0; i < Math.min(MAX_SITE_ROWS, display.length); i++) {
    const row = [file.siteNames[i] || String(i + 1), `${formatNumber(file.xMm[i]!, { sigFigs: 4, trim: true })}, ${formatNumber(file.yMm[i]!, { sigFigs: 4, trim: true })}`];
    for (const a of [rs, rho, density]) if (a) row.push(Number.isNaN(a[i]!) ? '—' : formatNumber(a[i]!, { sigFigs: 4 }));
    if (thickness) row.push(Number.isNaN(thickness[i]!) ? '—' : formatNumber(thickness[i]! * 1e4, { sigFigs: 4 }));
    rows.push(row);
  }
  sections.push({
    heading: display.length > MAX_SITE_ROWS ? `Sites (first ${MAX_SITE_ROWS} of ${display.length}; every site is in the picture and in --json)` : 'Sites',
    table: { columns, rows },
  });

  const title = [options.lotId, options.waferLabel ?? file.waferId].filter(Boolean).join(' ') || file.name;
  const picture: WaferMapPicture = {
    kind: 'waferMap',
    title: `${title} — ${q.label.toLowerCase()}`,
    quantityLabel: q.label,
    unit: q.unit,
    diameterMm,
    edgeExclusionMm,
    statistics: [
      `mean ${fmt(stats.mean)} ${q.unit}`,
      `1σ ${formatNumber(stats.standardDeviation, { sigFigs: 3 })} ${q.unit}`,
      `non-uniformity ${formatNumber(stats.nonUniformityPercent, { sigFigs: 3 })} %`,
      `range NU ${formatNumber(stats.rangeNonUniformityPercent, { sigFigs: 3 })} %`,
      `min ${fmt(stats.minimum)}  max ${fmt(stats.maximum)}`,
      `${stats.count} sites, edge ${formatNumber(edgeExclusionMm)} mm`,
    ],
    sites: {
      name: file.siteNames,
      line: Array.from(file.lines),
      xMm: Array.from(file.xMm),
      yMm: Array.from(file.yMm),
      value: nullable(display)!,
      ...(rs ? { sheetResistanceOhmPerSq: nullable(rs)! } : {}),
      ...(rho ? { resistivityOhmCm: nullable(rho)! } : {}),
      ...(density ? { dopantDensityPerCm3: nullable(density)! } : {}),
      ...(thickness ? { thicknessUm: nullable(thickness, 1e4)! } : {}),
      included: Array.from(included, (v) => v === 1),
      outlier,
    },
  };
  return {
    shown,
    unit: q.unit,
    quantityLabel: q.label,
    statistics: stats,
    values,
    assumptions,
    warnings,
    sections,
    picture,
    diameterMm,
    edgeExclusionMm,
    equations,
    sources,
    steps,
    ...(modelId ? { modelId } : {}),
    shownValues: display,
    included,
  };
}
