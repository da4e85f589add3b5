/**
 * The Hall effect in a single-carrier semiconductor: from the Hall coefficient R_H (or the Hall
 * voltage V_H across a sample of thickness t carrying a current I in a field B perpendicular to
 * it: R_H = V_H·t/(I·B)) the carrier type (R_H < 0: electrons, n-type; R_H > 0: holes, p-type),
 * the carrier density n = r_H/(q·|R_H|), and with the resistivity the Hall mobility
 * μ_H = |R_H|/ρ (the drift mobility is μ_H/r_H).
 *
 * The Hall scattering factor r_H depends on the scattering (about 1.18 for lattice scattering,
 * 1.93 for ionized-impurity scattering in the simple theory; close to 1 in strong fields and in
 * degenerate material): 1 unless the person gives another, and the reply says which. Sources:
 * S. M. Sze, K. K. Ng, Physics of Semiconductor Devices, 3rd ed. (2007), §1.5.3; E. H. Hall,
 * Am. J. Math. 2, 287 (1879) (docs/references.md). Single-carrier material only: in
 * near-intrinsic or compensated samples both carriers conduct and the sign can flip.
 *
 * Units: R_H in cm³/C, V in volts, I in amperes, B in tesla, t in cm.
 */
import { ELEMENTARY_CHARGE_C } from '../constants.js';
import { checkFinite, checkPositive, refuse, type Outcome } from '../outcome.js';

export interface HallResult {
  readonly hallCoefficientCm3PerC: number;
  readonly carrierType: 'n' | 'p';
  /** Carrier density r_H/(q·|R_H|), cm⁻³. */
  readonly carrierDensityPerCm3: number;
  /** |R_H|/ρ, cm²/(V·s), when the resistivity is known. */
  readonly hallMobilityCm2PerVs?: number;
  readonly scatteringFactor: number;
}

/** R_H from a Hall voltage: V_H·t/(I·B), in cm³/C (t in cm, B in T: 1 T = 1e-4 V·s/cm²). */
export function hallCoefficientFromVoltage(hallVoltageV: number, currentA: number, fieldT: number, thicknessCm: number): Outcome<number> {
  for (const [q, v] of [
    ['currentA', currentA],
    ['magneticFieldT', fieldT],
    ['thicknessCm', thicknessCm],
  ] as const) {
    const bad = checkFinite(q, v) ?? checkPositive(q, Math.abs(v));
    if (bad) return refuse(bad);
  }
  const bad = checkFinite('hallVoltageV', hallVoltageV);
  if (bad) return refuse(bad);
  if (hallVoltageV === 0) return refuse({ code: 'nonpositive_input', quantity: 'hallVoltageV', input: 0 });
  return { ok: true, value: (hallVoltageV * thicknessCm) / (currentA * fieldT * 1e-4) };
}

export function hallAnalysis(input: { hallCoefficientCm3PerC: number; resistivityOhmCm?: number; scatteringFactor?: number }): Outcome<HallResult> {
  const rh = input.hallCoefficientCm3PerC;
  const finite = checkFinite('hallCoefficientCm3PerC', rh);
  if (finite) return refuse(finite);
  if (rh === 0) return refuse({ code: 'nonpositive_input', quantity: 'hallCoefficientCm3PerC', input: 0 });
  const r = input.scatteringFactor ?? 1;
  const badR = checkFinite('scatteringFactor', r) ?? checkPositive('scatteringFactor', r);
  if (badR) return refuse(badR);
  if (input.resistivityOhmCm !== undefined) {
    const badRho = checkFinite('resistivityOhmCm', input.resistivityOhmCm) ?? checkPositive('resistivityOhmCm', input.resistivityOhmCm);
    if (badRho) return refuse(badRho);
  }
  return {
    ok: true,
    value: {
      hallCoefficientCm3PerC: rh,
      carrierType: rh < 0 ? 'n' : 'p',
      carrierDensityPerCm3: r / (ELEMENTARY_CHARGE_C * Math.abs(rh)),
      ...(input.resistivityOhmCm !== undefined ? { hallMobilityCm2PerVs: Math.abs(rh) / input.resistivityOhmCm } : {}),
      scatteringFactor: r,
    },
  };
}
