/**
 * Per-site conversion of a wafer map through the core's batch path: what a mapping four-point
 * probe measured at each site (sheet resistance, resistivity, or inner-pin voltage and outer-pin
 * current) → sheet resistance → resistivity (with the thickness and the probe's thickness
 * factor F(t/s), src/physics/four-point/uhlir-1955-thickness.ts) → dopant density (with a
 * dopant, src/physics/resistivity/batch.ts).
 *
 *   V/I:  Rs = (π/ln2)·V/I (infinite-sheet factor; the site-by-site edge correction is not applied)
 *   Rs:   as given (a mapping probe reports it with its own geometry corrections)
 *   ρ   = Rs·t·F(t/s) (F = 1 when no probe spacing is known: the thin-sheet limit, stated)
 *   N   = the resistivity conversion of the dopant (ASTM F723 for B and P by default)
 *
 * Arrays in, arrays out; a site whose value is not a positive finite number, or that the model
 * refuses, is NaN in every later array and counted in `refused`.
 */
import { THIN_SHEET_FACTOR } from '../four-point/smits-1958-diameter.js';
import { thicknessCorrectionFactor } from '../four-point/uhlir-1955-thickness.js';
import { checkPositive, refuse, type Outcome } from '../outcome.js';
import { BATCH_OUTSIDE_VALIDITY, BATCH_REFUSED, convertResistivityBatch } from '../resistivity/batch.js';
import type { Dopant } from '../types.js';

export type SiteMeasurement =
  | { readonly kind: 'sheetResistance'; readonly ohmPerSq: Float64Array }
  | { readonly kind: 'resistivity'; readonly ohmCm: Float64Array }
  | { readonly kind: 'voltageCurrent'; readonly voltageV: Float64Array; readonly currentA: Float64Array };

export interface SiteConversionRequest {
  readonly measurement: SiteMeasurement;
  readonly thicknessCm?: number;
  readonly spacingCm?: number;
  readonly dopant?: Dopant;
  readonly modelId?: string;
}

export interface SiteConversion {
  /** Ω/□ per site; undefined when the sites gave resistivity. */
  readonly sheetResistanceOhmPerSq?: Float64Array;
  /** Ω·cm per site; undefined without a thickness (unless the sites gave it). */
  readonly resistivityOhmCm?: Float64Array;
  /** cm⁻³ per site; undefined without a dopant. */
  readonly dopantDensityPerCm3?: Float64Array;
  /** F(t/s) used (1 without a spacing). */
  readonly thicknessFactor: number;
  /** Conversion model id (density), when converted. */
  readonly modelId?: string;
  /** Sites with no usable value or refused by the model. */
  readonly refused: number;
  /** Sites converted outside the model's validity range. */
  readonly outsideValidity: number;
  readonly assumptionCodes: readonly string[];
}

function positiveOrNaN(values: Float64Array): Float64Array {
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    out[i] = v > 0 && v < Number.POSITIVE_INFINITY ? v : Number.NaN;
  }
  return out;
}

export function convertSites(req: SiteConversionRequest): Outcome<SiteConversion> {
  const m = req.measurement;
  const assumptionCodes: string[] = [];
  let rs: Float64Array | undefined;
  let rho: Float64Array | undefined;
  let thicknessFactor = 1;
  if (m.kind === 'voltageCurrent') {
    rs = new Float64Array(m.voltageV.length);
    for (let i = 0; i < rs.length; i++) {
      const r = (THIN_SHEET_FACTOR * m.voltageV[i]!) / m.currentA[i]!;
      rs[i] = r > 0 && r < Number.POSITIVE_INFINITY ? r : Number.NaN;
    }
    assumptionCodes.push('map_infinite_sheet_factor');
  } else if (m.kind === 'sheetResistance') {
    rs = positiveOrNaN(m.ohmPerSq);
  } else {
    rho = positiveOrNaN(m.ohmCm);
  }
  if (rs && req.thicknessCm !== undefined) {
    const bad = checkPositive('thickness', req.thicknessCm);
    if (bad) return refuse(bad);
    if (req.spacingCm !== undefined) {
      const badSpacing = checkPositive('probe spacing', req.spacingCm);
      if (badSpacing) return refuse(badSpacing);
      thicknessFactor = thicknessCorrectionFactor(req.thicknessCm / req.spacingCm);
    } else {
      assumptionCodes.push('map_thin_sheet');
    }
    rho = new Float64Array(rs.length);
    const k = req.thicknessCm * thicknessFactor;
    for (let i = 0; i < rs.length; i++) rho[i] = rs[i]! * k;
  }
  let density: Float64Array | undefined;
  let modelId: string | undefined;
  let outsideValidity = 0;
  let refused = 0;
  if (rho && req.dopant) {
    const conv = convertResistivityBatch(rho, req.dopant, req.modelId);
    if (!conv.ok) return conv;
    density = conv.value.out;
    modelId = conv.value.modelIds.find((id) => id !== '') ?? undefined;
    for (let i = 0; i < density.length; i++) {
      const s = conv.value.status[i]!;
      if (s === BATCH_REFUSED) refused++;
      else if (s === BATCH_OUTSIDE_VALIDITY) outsideValidity++;
    }
  } else {
    const last = rho ?? rs!;
    for (let i = 0; i < last.length; i++) if (Number.isNaN(last[i]!)) refused++;
  }
  return {
    ok: true,
    value: {
      ...(rs ? { sheetResistanceOhmPerSq: rs } : {}),
      ...(rho ? { resistivityOhmCm: rho } : {}),
      ...(density ? { dopantDensityPerCm3: density } : {}),
      thicknessFactor,
      ...(modelId ? { modelId } : {}),
      refused,
      outsideValidity,
      assumptionCodes,
    },
  };
}
