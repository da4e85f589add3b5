/**
 * Lot readings: the typed request a `record` becomes, and the stored, append-only row.
 * Values arrive in canonical units (parsed once, in src/commands) with the text as entered.
 */
import { z } from 'zod';
import { SITE_MAX, SITE_MIN, WAFER_MAX, WAFER_MIN } from './ids.js';
import type { ReadingDraft } from './evaluation-types.js';

/** Sanity bounds: a value outside them is a typing or unit slip, not a silicon reading. */
export const LIMITS = {
  /** Ω·cm. Intrinsic Si at room temperature is about 2.3e5 Ω·cm (common practice, no source). */
  resistivityOhmCm: { min: 1e-5, max: 1e6 },
  /** Ω/□. */
  sheetResistanceOhmPerSq: { min: 1e-4, max: 1e9 },
  /** cm: 0.1 µm layers to 5 mm slugs. */
  thicknessCm: { min: 1e-5, max: 0.5 },
  /** cm: probe pin spacing 0.1–5 mm. */
  spacingCm: { min: 0.01, max: 0.5 },
  /** K: a probe reading is taken between about −20 °C and 120 °C. */
  temperatureK: { min: 253.15, max: 393.15 },
} as const;

const within = (name: keyof typeof LIMITS) =>
  z
    .number()
    .finite()
    .refine((v) => v > 0, { message: `${name} must be positive` })
    .refine((v) => v >= LIMITS[name].min && v <= LIMITS[name].max, {
      message: `${name} outside ${LIMITS[name].min}–${LIMITS[name].max}`,
    });

export const ResistivityMeasurement = z.object({
  kind: z.literal('resistivity'),
  resistivityOhmCm: within('resistivityOhmCm'),
  asEntered: z.string().max(80),
});

export const SheetMeasurement = z.object({
  kind: z.literal('sheet'),
  sheetResistanceOhmPerSq: within('sheetResistanceOhmPerSq'),
  thicknessCm: within('thicknessCm'),
  spacingCm: within('spacingCm').optional(),
  asEntered: z.string().max(120),
});

/** Most sites one map may hold (the measurement-file limit). */
export const MAP_MAX_SITES = 10_000;

/** One site of a recorded map: where, what was measured, its resistivity, and whether it counts. */
export const MapSite = z.object({
  /** The site's name as written in the file ('' when the file has none). */
  label: z.string().max(40),
  xMm: z.number().finite(),
  yMm: z.number().finite(),
  /** As measured, canonical unit (Ω/□ or Ω·cm); null for an empty cell. */
  value: z.number().finite().positive().nullable(),
  /** Resistivity at the measured temperature, Ω·cm; null when there is none. */
  resistivityOhmCm: z.number().finite().positive().nullable(),
  /** Inside the edge exclusion (counted in the statistics). */
  included: z.boolean(),
});
export type MapSite = z.infer<typeof MapSite>;

/**
 * A wafer map from a measurement file (`record <lot> w<n> map …`): every site, already converted
 * to resistivity through the core (the command layer does it, with the same code as `map`).
 */
export const MapMeasurement = z.object({
  kind: z.literal('map'),
  /** What the file measured: sheet resistance (V/I pairs arrive as it) or resistivity. */
  measured: z.enum(['sheet', 'resistivity']),
  fileName: z.string().min(1).max(200),
  thicknessCm: within('thicknessCm').optional(),
  spacingCm: within('spacingCm').optional(),
  diameterMm: z.number().finite().positive().max(450),
  edgeExclusionMm: z.number().finite().min(0).max(225),
  sites: z.array(MapSite).min(1).max(MAP_MAX_SITES),
  asEntered: z.string().max(200),
});
export type MapMeasurement = z.infer<typeof MapMeasurement>;

export const TYPE_METHODS = ['hot', 'cold', 'hall', 'point', 'spv'] as const;

export const ProbeTypeMeasurement = z.object({
  kind: z.literal('type'),
  method: z.enum(TYPE_METHODS),
  /** V (hot, cold, spv), cm³/C (hall), ±1 (point: polarity of the point at easy conduction). */
  reading: z.number().finite(),
  asEntered: z.string().max(80),
});

/** The operator states the type found by a separate test ("type p"). */
export const StatedTypeMeasurement = z.object({
  kind: z.literal('stated-type'),
  carrierType: z.enum(['n', 'p']),
  asEntered: z.string().max(80),
});

export const PrimaryMeasurement = z.discriminatedUnion('kind', [ResistivityMeasurement, SheetMeasurement, MapMeasurement]);
export type PrimaryMeasurement = z.infer<typeof PrimaryMeasurement>;
export const TypeMeasurement = z.discriminatedUnion('kind', [ProbeTypeMeasurement, StatedTypeMeasurement]);
export type TypeMeasurement = z.infer<typeof TypeMeasurement>;

/** The fields of a `record`, before the rules that tie them together (RecordRequest). */
export const RecordRequestFields = z
  .object({
    lotId: z.string().min(1).max(64),
    wafer: z.number().int().min(WAFER_MIN).max(WAFER_MAX).optional(),
    site: z.number().int().min(SITE_MIN).max(SITE_MAX).optional(),
    /** A resistivity or a sheet resistance with thickness. */
    primary: PrimaryMeasurement.optional(),
    /** A conductivity-type reading. */
    typeReading: TypeMeasurement.optional(),
    temperatureK: within('temperatureK').optional(),
    temperatureAsEntered: z.string().max(40).optional(),
    /** Names (or re-names) the lot's product. */
    productId: z.string().min(1).max(32).optional(),
    /** Id of an earlier reading this one corrects. */
    corrects: z.number().int().positive().optional(),
    note: z.string().max(500).optional(),
  })
  .strict();

export const RecordRequest = RecordRequestFields.refine((r) => r.site === undefined || r.wafer !== undefined, {
    message: 'a site needs its wafer (e.g. w3 site 2)',
    path: ['site'],
  })
  .refine((r) => r.primary !== undefined || r.typeReading !== undefined || r.productId !== undefined, {
    message: 'nothing to record: give a reading (rho, sheet or type) or a product',
  })
  .refine((r) => r.primary?.kind !== 'map' || (r.wafer !== undefined && r.site === undefined), {
    message: 'a map is of one wafer: give the wafer (e.g. w3) and no site',
    path: ['wafer'],
  })
  .refine((r) => r.corrects === undefined || r.primary !== undefined || r.typeReading !== undefined, {
    message: 'a correction needs the corrected reading',
    path: ['corrects'],
  });
export type RecordRequest = z.infer<typeof RecordRequest>;

export type { Quantity, Verdict } from './evaluation-types.js';

/** Who caused a write, and from where. */
export interface Actor {
  readonly userId: string;
  readonly userName?: string;
  readonly surface: string;
  readonly channelId: string;
}

/**
 * A reading as kept: the draft that was checked, plus who, when, where from and what it corrects.
 * Never updated: a correction is a new reading that `supersedes` this one.
 */
export interface StoredReading extends ReadingDraft {
  readonly id: number;
  readonly lotId: string;
  readonly supersedes?: number;
  /** Filled when read back: the reading that corrected this one. */
  readonly supersededBy?: number;
  readonly actor: Actor;
  readonly eventId: string;
  readonly recordedAt: string;
}

/** The readings that count: not corrected by a later one. */
export function currentReadings(readings: readonly StoredReading[]): StoredReading[] {
  return readings.filter((r) => r.supersededBy === undefined);
}
