/**
 * Public API: conductivity type from one probe reading. Reads the method's descriptor for
 * the sign convention, noise band and cautions; adds the epitaxial caution and the
 * expectation check.
 */
import { checkFinite, checkPositive, ok, refuse, type Outcome } from '../outcome.js';
import type { Problem } from '../problems.js';
import type { CarrierType, Material } from '../types.js';
import { hall } from './hall.js';
import { coldProbe, hotProbe } from './hot-probe.js';
import type { ProbeMethod, TypeMethod } from './method.js';
import { surfacePhotovoltage } from './photovoltage.js';
import { pointContact } from './rectification.js';

export const TYPE_METHODS: Readonly<Record<ProbeMethod, TypeMethod>> = {
  hot: hotProbe,
  cold: coldProbe,
  hall,
  point: pointContact,
  spv: surfacePhotovoltage,
};

export interface CarrierTypeRequest {
  method: ProbeMethod;
  /** V for hot/cold/spv; cm³/C for hall; +1/−1 polarity of the point at easy conduction. */
  reading: number;
  /** Noise band in volts (hot/cold/spv). */
  noiseBandV?: number;
  /** Noise band in the reading's canonical unit (any method); wins over noiseBandV. */
  noiseBand?: number;
  resistivityOhmCm?: number;
  material?: Material;
  epitaxial?: boolean;
  expect?: CarrierType;
}

export interface CarrierTypeResult {
  carrierType: CarrierType | 'indeterminate';
  method: ProbeMethod;
  /** The reading as understood, canonical unit. */
  reading: number;
  noiseBand: number;
  noiseBandUnit: string;
  /** True when the band is the method's default (then `noiseBandBasis` says why). */
  noiseBandIsDefault: boolean;
  noiseBandBasis: string;
  conventionText: string;
  source: string;
  material: Material;
  problems: Problem[];
}

export function carrierTypeFromReading(req: CarrierTypeRequest): Outcome<CarrierTypeResult> {
  const m = TYPE_METHODS[req.method];
  if (!m) return refuse({ code: 'unknown_model', model: String(req.method), known: Object.keys(TYPE_METHODS) });
  const badReading = checkFinite('reading', req.reading);
  if (badReading) return refuse(badReading);
  const explicitBand = req.noiseBand ?? (m.unit === 'V' ? req.noiseBandV : undefined);
  if (explicitBand !== undefined) {
    const badBand = checkFinite('noiseBand', explicitBand);
    if (badBand) return refuse(badBand);
    if (explicitBand < 0) return refuse({ code: 'nonpositive_input', quantity: 'noiseBand', input: explicitBand });
  }
  if (req.resistivityOhmCm !== undefined) {
    const badRho = checkPositive('resistivityOhmCm', req.resistivityOhmCm);
    if (badRho) return refuse(badRho);
  }
  const material: Material = req.material ?? 'Si';
  const band = explicitBand ?? m.defaultNoiseBand;
  const problems: Problem[] = [];

  let carrierType: CarrierType | 'indeterminate';
  if (Math.abs(req.reading) <= band) {
    carrierType = 'indeterminate';
    problems.push({ code: 'indeterminate_reading', method: m.method, input: req.reading, noiseBand: band, unit: m.unit });
  } else {
    carrierType = Math.sign(req.reading) === m.nTypeSign ? 'n' : 'p';
  }

  const ctx = req.resistivityOhmCm === undefined ? { material } : { material, resistivityOhmCm: req.resistivityOhmCm };
  problems.push(...m.cautions(ctx));
  if (req.epitaxial) problems.push({ code: 'epitaxial_caution', method: m.method });
  if (req.expect && carrierType !== 'indeterminate' && carrierType !== req.expect) {
    problems.push({ code: 'type_mismatch', expected: req.expect, found: carrierType });
  }

  return ok({
    carrierType,
    method: m.method,
    reading: req.reading,
    noiseBand: band,
    noiseBandUnit: m.unit,
    noiseBandIsDefault: explicitBand === undefined,
    noiseBandBasis: explicitBand === undefined ? m.noiseBandBasis : 'given with the request',
    conventionText: m.conventionText,
    source: m.source,
    material,
    problems,
  });
}
