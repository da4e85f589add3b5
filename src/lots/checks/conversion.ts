/**
 * The ρ → N conversion with the product's dopant and model, and whether the reading is inside
 * the model's validity (outside → an `outside_model_validity` flag, one per reading).
 */
import type { Check, LotNote } from '../evaluation-types.js';
import type { FlagFinding } from '../flags.js';
import type { LotPhysics, ModelRef } from '../physics.js';
import type { Product } from '../spec/schema.js';

/** Where a finding is: its flag scope and the reading's wafer and site. */
export type FindingPlace = { readonly scope: string; readonly wafer?: number; readonly site?: number };

export interface CheckOutput {
  readonly checks: Check[];
  readonly findings: FlagFinding[];
  readonly notes: LotNote[];
}

export function conversionCheck(
  rho: number,
  product: Product,
  physics: LotPhysics,
  where: FindingPlace,
): CheckOutput & { density?: number; model?: ModelRef } {
  const checks: Check[] = [];
  const findings: FlagFinding[] = [];
  const notes: LotNote[] = [];
  const conv = physics.densityFromResistivity(rho, product.dopant, product.model);
  if (conv.ok) {
      const outside = conv.problems.filter((p) => p.code === 'outside_validity');
    for (const p of conv.problems) if (p.code !== 'outside_validity') notes.push({ code: 'problem', problem: p });
    checks.push({ check: 'validity', status: outside.length > 0 ? 'fail' : 'pass', model: conv.model.id });
    for (const p of outside) {
      if (p.code !== 'outside_validity') continue;
      findings.push({
        code: 'outside_model_validity',
        ...where,
        detail: { code: 'outside_model_validity', model: p.model, quantity: p.quantity, input: p.input, min: p.min, max: p.max },
      });
      break; // one flag per reading is enough; the detail names the first quantity out of range
    }
  } else {
    checks.push({ check: 'validity', status: 'fail', model: product.model ?? 'default' });
    findings.push({
      code: 'outside_model_validity',
      ...where,
      detail: {
        code: 'outside_model_validity',
        model: product.model ?? 'default',
        quantity: 'resistivityOhmCm',
        input: rho,
        refusal: conv.refusal,
      },
    });
  }
  return { checks, findings, notes, ...(conv.ok ? { density: conv.dopantDensityPerCm3, model: conv.model } : {}) };
}
