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
  | { code: 'other'; message: string };

export type ProblemCode = Problem['code'];
