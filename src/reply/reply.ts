/**
 * The one typed reply every path ends in. Renderers (src/render) turn it into console text,
 * JSON, Slack blocks or a Teams card; they format numbers but never compute physics.
 */

export interface ReplyValue {
  /** Stable key, quantity then unit: 'dopantDensityPerCm3', 'carrierType'… (README lists them). */
  readonly key: string;
  readonly value: number | string;
  /** Unit in the trade's notation ('cm⁻³', 'Ω·cm', 'Ω/□', 'K', 'eV', 'cm²/V·s', '' for none). */
  readonly unit: string;
  readonly label: string;
  /** Significant figures to show; 3 when absent. */
  readonly sigFigs?: number;
  /** Headline values are shown first and largest. */
  readonly headline?: boolean;
}

export interface ReplyInput {
  readonly value: number | string;
  readonly unit?: string;
  readonly label: string;
  /** The text the person typed for it, when different from the value shown. */
  readonly asTyped?: string;
}

export interface ReplyWarning {
  readonly code: string;
  readonly message: string;
}

export interface ReplyModel {
  readonly id: string;
  readonly name: string;
  readonly citation: string;
  /** Validity as a sentence, e.g. 'B: 1e-4 to 1e4 Ω·cm at 23 °C'. */
  readonly validity?: string;
}

/** A block of free content: help text, model lists, lot tables, digests. */
export interface ReplySection {
  readonly heading?: string;
  readonly lines?: readonly string[];
  readonly table?: { readonly columns: readonly string[]; readonly rows: readonly (readonly string[])[] };
}

/** Everything `why` shows: inputs as understood, equations, parameters, sources, steps. */
export interface Derivation {
  readonly equations: readonly string[];
  readonly parameters: readonly {
    readonly name: string;
    readonly value: number | string;
    readonly unit?: string;
    readonly source?: string;
  }[];
  readonly steps: readonly string[];
  readonly sources: readonly string[];
}

/**
 * A wafer map drawn from a measurement file: what the picture renderer needs, and (in the JSON)
 * every site's conversion. Arrays are per site, in file order; null where a site has no value.
 */
export interface WaferMapPicture {
  readonly kind: 'waferMap';
  readonly title: string;
  /** The quantity coloured on the map ('Sheet resistance') and its unit ('Ω/□'). */
  readonly quantityLabel: string;
  readonly unit: string;
  readonly diameterMm: number;
  readonly edgeExclusionMm: number;
  /** Statistics lines shown beside the map. */
  readonly statistics: readonly string[];
  readonly sites: {
    readonly name: readonly string[];
    readonly line: readonly number[];
    readonly xMm: readonly number[];
    readonly yMm: readonly number[];
    /** The shown quantity. */
    readonly value: readonly (number | null)[];
    readonly sheetResistanceOhmPerSq?: readonly (number | null)[];
    readonly resistivityOhmCm?: readonly (number | null)[];
    readonly dopantDensityPerCm3?: readonly (number | null)[];
    readonly thicknessUm?: readonly (number | null)[];
    /** Inside the edge exclusion (counted in the statistics). */
    readonly included: readonly boolean[];
    readonly outlier: readonly boolean[];
  };
}

/** A trend chart: readings in time order against the spec window and control limits. */
export interface TrendPicture {
  readonly kind: 'trend';
  readonly title: string;
  readonly quantityLabel: string;
  readonly unit: string;
  readonly points: readonly {
    readonly at: string;
    readonly value: number;
    /** Lot and wafer, e.g. 'LOT-A17 w3'. */
    readonly label: string;
    readonly lot: string;
    readonly flagged: boolean;
    /** Western Electric rules this point completes (1–4). */
    readonly rules: readonly number[];
  }[];
  readonly lotMeans: readonly { readonly at: string; readonly value: number; readonly lot: string }[];
  readonly spec?: { readonly min?: number; readonly max?: number; readonly target?: number };
  readonly control?: { readonly centre: number; readonly lower: number; readonly upper: number };
}

export type ReplyPicture = WaferMapPicture | TrendPicture;

export interface ReplyOk {
  readonly ok: true;
  readonly id: string;
  readonly command: string;
  readonly title: string;
  /** ISO time the reply was made (from the injected clock). */
  readonly createdAt: string;
  readonly values: readonly ReplyValue[];
  readonly inputs: Readonly<Record<string, ReplyInput>>;
  readonly assumptions: readonly string[];
  readonly model?: ReplyModel;
  readonly warnings: readonly ReplyWarning[];
  readonly cautions: readonly string[];
  readonly sections?: readonly ReplySection[];
  readonly derivation?: Derivation;
  /** Whether the result can drive a decision (then the procedure caution is always present). */
  readonly decision: boolean;
  /** Data for a picture (wafer map, trend chart); the renderers draw it. */
  readonly picture?: ReplyPicture;
}

/** One answer to a question the bot asks: the short answer to type, and the whole command it runs. */
export interface ReplyChoice {
  readonly label: string;
  readonly answer: string;
  readonly command: string;
}

export interface ReplyError {
  readonly ok: false;
  readonly error: {
    readonly code: string;
    readonly message: string;
    /** The right form, e.g. 'rho <value> <unit> <dopant>'. */
    readonly usage?: string;
    readonly example?: string;
    /** "did you mean" candidate: the whole corrected command. */
    readonly suggestion?: string;
    /** When the bot asks (a word with two readings): each reading, ready to run. */
    readonly choices?: readonly ReplyChoice[];
  };
}

export type Reply = ReplyOk | ReplyError;
