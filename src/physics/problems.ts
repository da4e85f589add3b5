/**
 * Problems the core reports as data. Wording lives in src/reply/messages.ts, one place for
 * every surface; the core never builds sentences for people.
 */
export type Problem =
  | {
      code: 'outside_validity';
      quantity: string; // e.g. 'resistivityOhmCm', 'dopantDensityPerCm3', 'temperatureK'
      input: number;
      min: number;
      max: number;
      model: string; // model id
    }
  | { code: 'near_boundary'; quantity: string; input: number; boundary: number; model: string }
  | { code: 'estimate_only'; model: string; reason: string }
  | { code: 'substitute_model'; model: string; forDopant: string; reason: string }
  | { code: 'indeterminate_reading'; method: string; input: number; noiseBand: number; unit: string }
  | { code: 'method_range'; method: string; resistivityOhmCm: number; min: number; max: number; standard: string }
  | { code: 'type_mismatch'; expected: 'n' | 'p'; found: 'n' | 'p' }
  | { code: 'epitaxial_caution'; method: string }
  | { code: 'mixed_conduction'; method: string }
  | { code: 'outdated_value'; quantity: string; outdated: number; current: number; source: string }
  | { code: 'geometry_limit'; factor: string; ratio: number; min: number }
  /** The method is not covered by the standard for this material (e.g. rectification on Ge). */
  | { code: 'method_not_covered'; method: string; material: string; standard: string }
  /** Issue 5: the simple ionization model overstates freeze-out above about this density. */
  | { code: 'ionization_model_limit'; dopantDensityPerCm3: number; limitPerCm3: number }
  /** Issue 5: E_F within `limitKT` kT of a band edge: Boltzmann statistics no longer hold. */
  | { code: 'degenerate'; band: 'conduction' | 'valence'; separationKT: number; limitKT: number }
  /** Issue 5: a parameter recalled from memory, not confirmed against its source. */
  | { code: 'unverified_parameter'; parameter: string; value: number; unit: string; source: string }
  /** Issue 5: n_i is comparable with the net doping: carriers are set by temperature, not doping. */
  | { code: 'intrinsic_regime'; intrinsicDensityPerCm3: number; netDopingPerCm3: number }
  /** Issue 5: a quantity the core computes for some materials only (e.g. resistivity: Si only). */
  | { code: 'quantity_not_covered'; quantity: string; material: string; covered: readonly string[] }
  /**
   * A reading corrected to the reference from far away, or by much: the size of the correction
   * and the model, and the range within which a model-based correction is trusted.
   */
  | { code: 'large_temperature_correction'; temperatureK: number; referenceK: number; changePercent: number; model: string; trustedWithinK: number }
  /** Four-point probe: a thickness without any probe spacing, so F(t/s) could not be applied (taken as 1). */
  | { code: 'thickness_factor_unknown'; thicknessCm: number; factorAtOneMm: number }
  /** Four-point probe: thickness and diameter corrections both large; their product is an approximation. */
  | { code: 'combined_geometry'; thicknessFactor: number; diameterFactor: number }
  /** van der Pauw: the two resistances differ by this ratio or more; contact placement errors weigh more. */
  | { code: 'contact_asymmetry'; ratio: number; limit: number }
  | { code: 'other'; message: string };

export type ProblemCode = Problem['code'];
