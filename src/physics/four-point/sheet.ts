/**
 * Public API: four-point-probe reading → sheet resistance → resistivity → dopant density.
 *
 *   Rs = C(d/s)·V/I          (C = π/ln2 for a sheet much wider than s; Smits 1958 for a disc)
 *   ρ  = Rs·t·F(t/s)          (F: Uhlir 1955 image solution, insulating bottom)
 *
 * A sheet resistance given directly is taken as read by an instrument that applies the
 * infinite-thin-sheet factor π/ln2, and is rescaled by C(d/s)/(π/ln2) when a diameter is given.
 * Each factor used, and each assumed, is reported.
 */
import { checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import { convertResistivityToDensity } from '../resistivity/convert.js';
import type { ConversionResult, Dopant } from '../types.js';
import { DIAMETER_RATIO_MIN, diameterCorrectionFactor, THIN_SHEET_FACTOR } from './smits-1958-diameter.js';
import { thicknessCorrectionFactor } from './uhlir-1955-thickness.js';

/**
 * Below this d/s the edge correction exceeds about 8 % and depends strongly on centring the
 * head: flag it (common practice, no source).
 */
export const DIAMETER_RATIO_CAUTION = 10;

export interface FourPointRequest {
  voltageV?: number;
  currentA?: number;
  /** Rs as read, i.e. the thin-infinite-sheet value (π/ln2)·V/I. */
  sheetResistanceOhmPerSq?: number;
  thicknessCm?: number;
  spacingCm?: number;
  diameterCm?: number;
  dopant?: Dopant;
  modelId?: string;
}

export interface FourPointResult {
  sheetResistanceOhmPerSq: number;
  /** F(t/s); 1 when not applied (then an assumption code says why). */
  thicknessFactor: number;
  /** C(d/s), the geometric factor in Rs = C·V/I; π/ln2 when no diameter correction. */
  diameterFactor: number;
  /** C(d/s)/(π/ln2): the diameter correction as a ratio (1 when not applied). */
  diameterRatioFactor: number;
  thicknessOverSpacing?: number;
  diameterOverSpacing?: number;
  resistivityOhmCm?: number;
  conversion?: ConversionResult;
  problems: Problem[];
  assumptionCodes: string[];
}

export function fourPointProbe(req: FourPointRequest): Outcome<FourPointResult> {
  for (const [q, v] of [
    ['voltageV', req.voltageV],
    ['currentA', req.currentA],
    ['sheetResistanceOhmPerSq', req.sheetResistanceOhmPerSq],
    ['thicknessCm', req.thicknessCm],
    ['spacingCm', req.spacingCm],
    ['diameterCm', req.diameterCm],
  ] as const) {
    if (v !== undefined) {
      const bad = checkPositive(q, v);
      if (bad) return refuse(bad);
    }
  }
  const haveVI = req.voltageV !== undefined && req.currentA !== undefined;
  if (!haveVI && req.sheetResistanceOhmPerSq === undefined) {
    const quantity = req.voltageV !== undefined ? 'currentA' : req.currentA !== undefined ? 'voltageV' : 'sheetResistanceOhmPerSq';
    return refuse({ code: 'missing_input', quantity, needs: ['the voltage and current', 'or the sheet resistance'] });
  }

  const problems: Problem[] = [];
  const assumptionCodes: string[] = ['collinear_equal_spacing'];

  // Diameter factor.
  let c = THIN_SHEET_FACTOR;
  let diameterOverSpacing: number | undefined;
  if (req.diameterCm !== undefined && req.spacingCm !== undefined) {
    diameterOverSpacing = req.diameterCm / req.spacingCm;
    if (!(diameterOverSpacing > DIAMETER_RATIO_MIN)) {
      return refuse({ code: 'geometry_invalid', factor: 'diameter', ratio: diameterOverSpacing, min: DIAMETER_RATIO_MIN });
    }
    c = diameterCorrectionFactor(diameterOverSpacing);
    assumptionCodes.push('probe_centred');
    if (diameterOverSpacing < DIAMETER_RATIO_CAUTION) {
      problems.push({ code: 'geometry_limit', factor: 'diameter', ratio: diameterOverSpacing, min: DIAMETER_RATIO_CAUTION });
    }
  } else if (req.diameterCm !== undefined) {
    assumptionCodes.push('diameter_factor_not_applied_no_spacing');
  } else {
    assumptionCodes.push('infinite_sheet');
  }

  const rs = haveVI
    ? (c * (req.voltageV as number)) / (req.currentA as number)
    : (req.sheetResistanceOhmPerSq as number) * (c / THIN_SHEET_FACTOR);
  if (!haveVI) assumptionCodes.push('sheet_resistance_as_read_thin_sheet');

  // Thickness factor.
  let f = 1;
  let thicknessOverSpacing: number | undefined;
  let rho: number | undefined;
  if (req.thicknessCm !== undefined) {
    if (req.spacingCm !== undefined) {
      thicknessOverSpacing = req.thicknessCm / req.spacingCm;
      f = thicknessCorrectionFactor(thicknessOverSpacing);
      assumptionCodes.push('insulating_bottom');
      if (diameterOverSpacing !== undefined) assumptionCodes.push('separable_corrections');
    } else {
      assumptionCodes.push('thickness_factor_assumed_1');
      // Not silent: say what F would be under a common 1 mm head.
      problems.push({ code: 'thickness_factor_unknown', thicknessCm: req.thicknessCm, factorAtOneMm: thicknessCorrectionFactor(req.thicknessCm / 0.1) });
    }
    rho = rs * req.thicknessCm * f;
  }

  // Each factor alone is exact for its geometry; applied together they are an approximation,
  // good while at least one stays close to 1 (within 5 %, common practice, no source).
  if (thicknessOverSpacing !== undefined && diameterOverSpacing !== undefined && f < 0.95 && c / THIN_SHEET_FACTOR < 0.95) {
    problems.push({ code: 'combined_geometry', thicknessFactor: f, diameterFactor: c / THIN_SHEET_FACTOR });
  }

  let conversion: ConversionResult | undefined;
  if (rho !== undefined && req.dopant !== undefined) {
    const conv = convertResistivityToDensity(
      req.modelId === undefined
        ? { resistivityOhmCm: rho, dopant: req.dopant }
        : { resistivityOhmCm: rho, dopant: req.dopant, modelId: req.modelId },
    );
    if (!conv.ok) return conv;
    conversion = conv.value;
  }

  const value: FourPointResult = {
    sheetResistanceOhmPerSq: rs,
    thicknessFactor: f,
    diameterFactor: c,
    diameterRatioFactor: c / THIN_SHEET_FACTOR,
    problems,
    assumptionCodes,
  };
  if (thicknessOverSpacing !== undefined) value.thicknessOverSpacing = thicknessOverSpacing;
  if (diameterOverSpacing !== undefined) value.diameterOverSpacing = diameterOverSpacing;
  if (rho !== undefined) value.resistivityOhmCm = rho;
  if (conversion !== undefined) value.conversion = conversion;
  return ok(value);
}
