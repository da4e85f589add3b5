/**
 * The product spec file, as a zod schema (the type shares its name). One file per fab, YAML or
 * JSON; products keyed by id. Units are fixed by the field names, so nothing is parsed twice:
 *
 *   fab: Harrowgate Fab 3
 *   products:
 *     HX-200P:
 *       type: p
 *       dopant: boron
 *       resistivityOhmCm: { min: 8, max: 12 }        # window at 23 °C
 *       spread: { siteToSitePercent: 6, waferToWaferPercent: 10 }
 *       uniformity: { nonUniformityPercentMax: 4, meanOhmCm: { min: 8.5, max: 11.5 } }   # maps
 *       notes: 200 mm prime, boron, 8–12 Ω·cm
 *
 * Either `resistivityOhmCm` or `dopantDensityPerCm3` is the window (not both).
 */
import { z } from 'zod';
import { CONVERSION_MODELS, findConversionModel } from '../../physics/resistivity/registry.js';
import { DOPANT_TYPE, type Dopant } from '../../physics/types.js';

const positive = z.number().finite().positive();

export const SpecWindow = z
  .object({ min: positive, max: positive })
  .strict()
  .refine((w) => w.min < w.max, { message: 'min must be below max', path: ['max'] });
export type SpecWindow = z.infer<typeof SpecWindow>;

export const SpreadDefinition = z.enum(['range-over-mean', 'range-over-min']);
export type SpreadDefinition = z.infer<typeof SpreadDefinition>;

export const SpreadLimits = z
  .object({
    /** Largest allowed (max − min) of site values on one wafer, in % (of mean or min, see definition). */
    siteToSitePercent: positive.max(1000).optional(),
    /** Largest allowed (max − min) of wafer means in one lot, in %. */
    waferToWaferPercent: positive.max(1000).optional(),
    definition: SpreadDefinition.default('range-over-mean'),
  })
  .strict();
export type SpreadLimits = z.infer<typeof SpreadLimits>;

/**
 * Limits for a wafer map recorded with `record <lot> w<n> map` (a measurement file): the
 * non-uniformity 1σ/mean of the sites' resistivity inside the edge exclusion, and a window for
 * the map's mean resistivity at 23 °C (checked instead of the product window for a map's mean).
 */
export const UniformityLimits = z
  .object({
    /** Largest allowed 1σ/mean × 100 of the site resistivities, %. */
    nonUniformityPercentMax: positive.max(100).optional(),
    /** Window for the mean resistivity of a map at 23 °C, Ω·cm. */
    meanOhmCm: SpecWindow.optional(),
    /** Edge exclusion the statistics use, mm (default 3 mm when neither this nor the command gives one). */
    edgeExclusionMm: z.number().finite().min(0).max(50).optional(),
  })
  .strict()
  .refine((u) => u.nonUniformityPercentMax !== undefined || u.meanOhmCm !== undefined, {
    message: 'give nonUniformityPercentMax or meanOhmCm {min, max} (or both)',
  });
export type UniformityLimits = z.infer<typeof UniformityLimits>;

const DOPANTS = ['boron', 'phosphorus', 'arsenic', 'antimony'] as const satisfies readonly Dopant[];

/** Product ids as people type them: letters, digits, '-', '_', '.', up to 32 characters. */
export const PRODUCT_ID = /^[A-Za-z0-9][A-Za-z0-9._-]{0,31}$/;

export const ProductSpec = z
  .object({
    type: z.enum(['n', 'p']),
    dopant: z.enum(DOPANTS),
    resistivityOhmCm: SpecWindow.optional(),
    dopantDensityPerCm3: SpecWindow.optional(),
    spread: SpreadLimits.optional(),
    uniformity: UniformityLimits.optional(),
    /** A reading this close to a limit (in % of the limit) passes with a warning. */
    nearLimitPercent: z.number().finite().min(0).max(50).optional(),
    /** The pin spacing of the probe head this product is measured with, mm (sheet readings without a spacing). */
    probeSpacingMm: z.number().finite().min(0.1).max(10).optional(),
    /** Conversion model id for ρ ↔ N (default: the core's default for the dopant). */
    model: z.string().min(1).max(40).optional(),
    notes: z.string().max(2000).optional(),
  })
  .strict()
  .superRefine((p, ctx) => {
    if (!p.resistivityOhmCm && !p.dopantDensityPerCm3) {
      ctx.addIssue({
        code: 'custom',
        message: 'give a window: resistivityOhmCm {min, max} or dopantDensityPerCm3 {min, max}',
        path: [],
      });
    }
    if (p.resistivityOhmCm && p.dopantDensityPerCm3) {
      ctx.addIssue({
        code: 'custom',
        message: 'give one window, resistivityOhmCm or dopantDensityPerCm3, not both',
        path: ['dopantDensityPerCm3'],
      });
    }
    if (p.model !== undefined) {
      // A misspelt model id would make every conversion of the product fail and flag every
      // reading: refuse it at start with the ids that work for the dopant.
      const model = findConversionModel(p.model);
      const covers = (m: (typeof CONVERSION_MODELS)[number]) => m.domain[p.dopant] !== undefined || m.delegates?.[p.dopant] !== undefined;
      const covering = CONVERSION_MODELS.filter(covers).map((m) => m.id);
      if (!model) {
        ctx.addIssue({ code: 'custom', message: `unknown model "${p.model}"; for ${p.dopant} use one of: ${covering.join(', ')}`, path: ['model'] });
      } else if (!covers(model)) {
        ctx.addIssue({ code: 'custom', message: `model ${model.id} does not cover ${p.dopant}; use one of: ${covering.join(', ')}`, path: ['model'] });
      }
    }
    if (DOPANT_TYPE[p.dopant] !== p.type) {
      ctx.addIssue({
        code: 'custom',
        message: `${p.dopant} makes ${DOPANT_TYPE[p.dopant]}-type silicon, but type is ${p.type}`,
        path: ['type'],
      });
    }
  });
export type ProductSpec = z.infer<typeof ProductSpec>;

export const SpecFile = z
  .object({
    /** Name of the fab or line the specs belong to, shown in replies. */
    fab: z.string().min(1).max(120).optional(),
    /** Free text: owner, revision, controlled-document number. */
    revision: z.string().max(200).optional(),
    products: z.record(
      z.string().regex(PRODUCT_ID, 'product ids are letters, digits, ".", "_" and "-" (up to 32)'),
      ProductSpec,
    ),
  })
  .strict();
export type SpecFile = z.infer<typeof SpecFile>;

/** A product spec with its id, as the domain uses it. */
export interface Product extends ProductSpec {
  readonly id: string;
}

/** The loaded specs: look-up by id, case-insensitively (people type 'hx-200p'). */
export interface SpecCatalog {
  readonly source: string;
  readonly fab?: string;
  readonly revision?: string;
  /** True when the specs are the invented demo file shipped in fixtures/. */
  readonly demo: boolean;
  readonly products: readonly Product[];
  find(productId: string): Product | undefined;
}

export function catalogFrom(file: SpecFile, source: string, demo: boolean): SpecCatalog {
  const products = Object.entries(file.products).map(([id, spec]) => ({ id, ...spec }));
  const byKey = new Map(products.map((p) => [p.id.toUpperCase(), p]));
  return {
    source,
    ...(file.fab !== undefined ? { fab: file.fab } : {}),
    ...(file.revision !== undefined ? { revision: file.revision } : {}),
    demo,
    products,
    find: (id) => byKey.get(id.toUpperCase()),
  };
}
