/**
 * Klaassen 1992 unified low-field mobility model for silicon: majority and minority electrons
 * and holes; lattice, donor, acceptor and carrier–carrier (electron–hole) scattering, screening,
 * and clustering of impurities at ultra-high doping; full temperature dependence.
 *
 * Sources: D. B. M. Klaassen, "A unified mobility model for device simulation — I. Model
 *   equations and concentration dependence", Solid-State Electron. 35, 953–959 (1992),
 *   doi:10.1016/0038-1101(92)90325-7; "— II. Temperature dependence of carrier mobility and
 *   lifetime", Solid-State Electron. 35, 961–967 (1992), doi:10.1016/0038-1101(92)90326-8
 *   (DOIs from memory). Equations and parameters confirmed against open implementations that
 *   cite the paper's equation and table numbers, and against docs/references.md [V].
 *
 * Equations (i = e for electrons, h for holes; T in K; densities in cm⁻³):
 *   1/μ_i = 1/μ_i,L + 1/μ_i,DAh                                  (Matthiessen's rule)
 *   μ_i,L = μ_i,max·(300/T)^θ_i                                  (lattice, II eq. 1)
 *   μ_i,DAh = μ_i,N·(N_i,sc/N_i,sc,eff)·(N_i,ref/N_i,sc)^α_i + μ_i,c·(n+p)/N_i,sc,eff   (I eq. 20)
 *   μ_i,N = μ_i,max²/(μ_i,max − μ_i,min)·(T/300)^(3α_i − 1.5)   (II eq. 2a)
 *   μ_i,c = μ_i,max·μ_i,min/(μ_i,max − μ_i,min)·(300/T)^0.5     (II eq. 2b)
 *   N_D* = Z_D·N_D, Z_D = 1 + 1/(c_D + (N_D,ref/N_D)²); same for acceptors  (clustering, I eq. 14–15)
 *   N_e,sc = N_D* + N_A* + p,  N_e,sc,eff = N_D* + G(P_e)·N_A* + p/F(P_e)   (I eq. 18, 21)
 *   N_h,sc = N_D* + N_A* + n,  N_h,sc,eff = N_A* + G(P_h)·N_D* + n/F(P_h)
 *   P_i = 1/(f_CW/P_CW,i + f_BH/P_BH,i),  P_CW,i = 3.97e13·(N_i,sc^−1·(T/300)³)^(2/3),
 *   P_BH,i = 1.36e20/(n+p)·(m_i/m0)·(T/300)²                    (I eq. 16, A3)
 *   G(P) = 1 − s1/(s2 + ((T/300)·(m0/m_i))^s4·P)^s3 + s5/(((300/T)·(m_i/m0))^s7·P)^s6   (I eq. 9)
 *   F(P) = (r1·P^r6 + r2 + r3·m_i/m_j)/(P^r6 + r4 + r5·m_i/m_j), j the other carrier    (I eq. 12)
 *   G is held at its minimum for P below the minimum (II: G must not rise again at small P).
 *
 * | parameter        | electrons, P set | electrons, As set | holes, B set | source             |
 * |------------------|------------------|-------------------|--------------|--------------------|
 * | μmax (cm²/V·s)   | 1414             | 1417              | 470.5        | I, Table 1 (Masetti) |
 * | μmin (cm²/V·s)   | 68.5             | 52.2              | 44.9         | I, Table 1         |
 * | N_ref (cm⁻³)     | 9.20e16          | 9.68e16           | 2.23e17      | I, Table 1         |
 * | α                | 0.711            | 0.68              | 0.719        | I, Table 1         |
 * | θ                | 2.285            | 2.285             | 2.247        | II                 |
 * | clustering c, N_ref | donors 0.21, 4e20 | donors 0.21, 4e20 | acceptors 0.5, 7.2e20 | I      |
 * | m/m0             | 1                | 1                 | 1.258        | I                  |
 * f_CW = 2.459, f_BH = 3.828 (I); G: s1…s7 = 0.89233, 0.41372, 0.19778, 0.28227, 0.005978,
 * 1.80618, 0.72169 (I, Table 2); F: r1…r6 = 0.7643, 2.2999, 6.5502, 2.3670, r5, 0.6478 (I, Table 2).
 *
 * Deliberate, stated deviation: the paper prints r5 = −0.01552 and takes P_CW from Z³·N_I for a
 * single impurity. We use r5 = −0.8552 and P_CW from N_i,sc, as widely used implementations
 * do; they report that this reproduces the paper's own minority-mobility curves (I, Figs 6–7)
 * better, and N_i,sc is defined for compensated material where "N_I" is not. Both changes
 * touch only electron–hole and minority-carrier terms: majority mobility in uncompensated
 * material moves by well under 1 % (checked in the tests).
 *
 * Antimony has no parameter set of its own; it takes the phosphorus set (as the F723 work lets
 * the P conversion serve for Sb). Minority electrons with no donor named take the As set, the
 * default of docs/references.md.
 *
 * Validity: the 300 K concentration dependence is fitted to majority and minority data up to
 * ~1e21 cm⁻³ (clustering term) [paper, I]. Temperature: an open implementation quoting the
 * authors' comparisons gives reasonable agreement from about 100 to 450 K, best at 300 K [V,
 * secondary]; we warn outside 100–450 K. Low field only; no surface or high-field terms.
 */
import { brentRoot } from '../numeric/brent.js';
import { DOPANT_TYPE, type Dopant, type Parameter, type Range } from '../types.js';
import {
  majorityMobilityCm2PerVs,
  type MobilityConditions,
  type TemperatureMobilityModel,
} from './temperature-model.js';
import { powPositive } from '../numeric/pow.js';

export interface KlaassenCarrierParameters {
  readonly maxCm2PerVs: number;
  readonly minCm2PerVs: number;
  readonly referencePerCm3: number;
  readonly alpha: number;
  readonly theta: number;
}

export const KLAASSEN_1992 = {
  electronPhosphorus: { maxCm2PerVs: 1414, minCm2PerVs: 68.5, referencePerCm3: 9.2e16, alpha: 0.711, theta: 2.285 },
  electronArsenic: { maxCm2PerVs: 1417, minCm2PerVs: 52.2, referencePerCm3: 9.68e16, alpha: 0.68, theta: 2.285 },
  holeBoron: { maxCm2PerVs: 470.5, minCm2PerVs: 44.9, referencePerCm3: 2.23e17, alpha: 0.719, theta: 2.247 },
  donorClustering: { c: 0.21, referencePerCm3: 4e20 },
  acceptorClustering: { c: 0.5, referencePerCm3: 7.2e20 },
  electronMassRatio: 1,
  holeMassRatio: 1.258,
  fCW: 2.459,
  fBH: 3.828,
  /** Coefficient of P_CW, cm⁻², and of P_BH, cm⁻³. */
  cwCoefficient: 3.97e13,
  bhCoefficientPerCm3: 1.36e20,
  s: [0.89233, 0.41372, 0.19778, 0.28227, 0.005978, 1.80618, 0.72169] as const,
  r: [0.7643, 2.2999, 6.5502, 2.367, -0.8552, 0.6478] as const,
  /** The value printed in the paper's Table 2, not used (see the header). */
  r5AsPrinted: -0.01552,
} as const;

export const KLAASSEN_1992_VALIDITY: Readonly<{ temperatureK: Range; impurityDensityPerCm3: Range }> = {
  temperatureK: { min: 100, max: 450 },
  impurityDensityPerCm3: { min: 0, max: 1e21 },
};

export const KLAASSEN_1992_CITATION =
  'D. B. M. Klaassen, Solid-State Electron. 35, 953 and 961 (1992), unified mobility model I and II';

/** Electron parameter set for a donor species (Sb takes the P set, no donor the As set). */
export function klaassenElectronSet(donor?: Dopant): KlaassenCarrierParameters {
  if (donor === undefined) return KLAASSEN_1992.electronArsenic;
  return KLAASSEN_1992_DONOR_SET[donor] ?? KLAASSEN_1992.electronArsenic;
}

const KLAASSEN_1992_DONOR_SET: Readonly<Partial<Record<Dopant, KlaassenCarrierParameters>>> = {
  phosphorus: KLAASSEN_1992.electronPhosphorus,
  antimony: KLAASSEN_1992.electronPhosphorus,
  arsenic: KLAASSEN_1992.electronArsenic,
};

function clusteringFactor(densityPerCm3: number, c: number, referencePerCm3: number): number {
  if (!(densityPerCm3 > 0)) return 1;
  const ratio = referencePerCm3 / densityPerCm3;
  return 1 + 1 / (c + ratio * ratio);
}

function gRaw(p: number, tRatio: number, massRatio: number): number {
  const s = KLAASSEN_1992.s;
  return (
    1 -
    s[0] / powPositive(s[1] + powPositive(tRatio / massRatio, s[3]) * p, s[2]) +
    s[4] / powPositive(powPositive(massRatio / tRatio, s[6]) * p, s[5])
  );
}

/**
 * P at which G is smallest: the root of dG/dP in log10 P, by Brent's method (cached per
 * temperature, one cache per mass ratio). dG/dP = s1·s3·a/(s2 + a·P)^(s3+1) − s5·s6/(b^s6·P^(s6+1)),
 * a = ((T/300)·(m0/m))^s4, b = ((300/T)·(m/m0))^s7.
 */
const minimumCache = new Map<number, Map<number, number>>();
function gMinimumP(tRatio: number, massRatio: number): number {
  let byT = minimumCache.get(massRatio);
  if (!byT) {
    byT = new Map();
    minimumCache.set(massRatio, byT);
  }
  const cached = byT.get(tRatio);
  if (cached !== undefined) return cached;
  const s = KLAASSEN_1992.s;
  const a = powPositive(tRatio / massRatio, s[3]);
  const bPow = powPositive(powPositive(massRatio / tRatio, s[6]), s[5]);
  const c1 = s[0] * s[2] * a;
  const c2 = (s[4] * s[5]) / bPow;
  // Sign of the slope, scaled to stay O(1): positive above the minimum.
  const slope = (u: number) => {
    const p = Math.pow(10, u);
    return Math.log(c1 / powPositive(s[1] + a * p, s[2] + 1)) - Math.log(c2 / powPositive(p, s[5] + 1));
  };
  const r = brentRoot(slope, -8, 4, { xTolerance: 1e-9 });
  const pMin = r.converged ? Math.pow(10, r.x) : r.status === 'no_sign_change' && slope(-8) > 0 ? 1e-8 : 1e4;
  if (byT.size > 512) byT.clear();
  byT.set(tRatio, pMin);
  return pMin;
}

/** G(P), minority-impurity (attractive versus repulsive) correction, held at its minimum for small P. */
export function klaassenG(p: number, temperatureK: number, massRatio: number): number {
  const tRatio = temperatureK / 300;
  const pMin = gMinimumP(tRatio, massRatio);
  return gRaw(Math.max(p, pMin), tRatio, massRatio);
}

/** F(P), electron–hole scattering relative to impurity scattering. */
export function klaassenF(p: number, massRatioThisToOther: number): number {
  const r = KLAASSEN_1992.r;
  const pr = powPositive(p, r[5]);
  return (r[0] * pr + r[1] + r[2] * massRatioThisToOther) / (pr + r[3] + r[4] * massRatioThisToOther);
}

interface CarrierSide {
  readonly set: KlaassenCarrierParameters;
  readonly massRatio: number;
  readonly otherMassRatio: number;
  /** Clustered density of the impurity that repels this carrier (majority impurity). */
  readonly sameImpurity: number;
  /** Clustered density of the impurity that attracts this carrier (minority impurity). */
  readonly oppositeImpurity: number;
  /** Density of the other carrier. */
  readonly otherCarrier: number;
}

function mobility(side: CarrierSide, carrierSumPerCm3: number, temperatureK: number): number {
  const { set } = side;
  const tRatio = temperatureK / 300;
  const lattice = set.maxCm2PerVs * powPositive(tRatio, -set.theta);
  const nSc = side.sameImpurity + side.oppositeImpurity + side.otherCarrier;
  if (!(nSc > 0)) return lattice;
  const k = KLAASSEN_1992;
  // 1/P = f_CW/P_CW + f_BH/P_BH, written without dividing by a zero carrier density.
  const invCw = powPositive(nSc, 2 / 3) / (k.cwCoefficient * tRatio * tRatio);
  const invBh = carrierSumPerCm3 / (k.bhCoefficientPerCm3 * side.massRatio * tRatio * tRatio);
  const p = 1 / (k.fCW * invCw + k.fBH * invBh);
  // G scales the scattering by the opposite-kind impurity only: skip it when there is none.
  const g = side.oppositeImpurity > 0 ? klaassenG(p, temperatureK, side.massRatio) : 1;
  const f = klaassenF(p, side.massRatio / side.otherMassRatio);
  const nScEff = side.sameImpurity + g * side.oppositeImpurity + side.otherCarrier / f;
  if (!(nScEff > 0)) return lattice;
  const span = set.maxCm2PerVs - set.minCm2PerVs;
  const muN = ((set.maxCm2PerVs * set.maxCm2PerVs) / span) * powPositive(tRatio, 3 * set.alpha - 1.5);
  const muC = ((set.maxCm2PerVs * set.minCm2PerVs) / span) * powPositive(tRatio, -0.5);
  const impurity =
    muN * (nSc / nScEff) * powPositive(set.referencePerCm3 / nSc, set.alpha) + muC * (carrierSumPerCm3 / nScEff);
  return 1 / (1 / lattice + 1 / impurity);
}

function clustered(c: MobilityConditions): { donors: number; acceptors: number } {
  const k = KLAASSEN_1992;
  const nd = Math.max(c.donorDensityPerCm3, 0);
  const na = Math.max(c.acceptorDensityPerCm3, 0);
  return {
    donors: nd * clusteringFactor(nd, k.donorClustering.c, k.donorClustering.referencePerCm3),
    acceptors: na * clusteringFactor(na, k.acceptorClustering.c, k.acceptorClustering.referencePerCm3),
  };
}

function anyNaN(c: MobilityConditions): boolean {
  return (
    Number.isNaN(c.donorDensityPerCm3) ||
    Number.isNaN(c.acceptorDensityPerCm3) ||
    Number.isNaN(c.electronDensityPerCm3) ||
    Number.isNaN(c.holeDensityPerCm3) ||
    !(c.temperatureK > 0)
  );
}

/** Kernel: electron mobility (majority or minority), cm²/(V·s). */
export function klaassenElectronMobilityCm2PerVs(c: MobilityConditions): number {
  if (anyNaN(c)) return Number.NaN;
  const { donors, acceptors } = clustered(c);
  const n = Math.max(c.electronDensityPerCm3, 0);
  const p = Math.max(c.holeDensityPerCm3, 0);
  return mobility(
    {
      set: klaassenElectronSet(c.donor),
      massRatio: KLAASSEN_1992.electronMassRatio,
      otherMassRatio: KLAASSEN_1992.holeMassRatio,
      sameImpurity: donors,
      oppositeImpurity: acceptors,
      otherCarrier: p,
    },
    n + p,
    c.temperatureK,
  );
}

/** Kernel: hole mobility (majority or minority), cm²/(V·s). */
export function klaassenHoleMobilityCm2PerVs(c: MobilityConditions): number {
  if (anyNaN(c)) return Number.NaN;
  const { donors, acceptors } = clustered(c);
  const n = Math.max(c.electronDensityPerCm3, 0);
  const p = Math.max(c.holeDensityPerCm3, 0);
  return mobility(
    {
      set: KLAASSEN_1992.holeBoron,
      massRatio: KLAASSEN_1992.holeMassRatio,
      otherMassRatio: KLAASSEN_1992.electronMassRatio,
      sameImpurity: acceptors,
      oppositeImpurity: donors,
      otherCarrier: n,
    },
    n + p,
    c.temperatureK,
  );
}

function parameterTable(carrier: 'electron' | 'hole', donor?: Dopant): readonly Parameter[] {
  const set = carrier === 'hole' ? KLAASSEN_1992.holeBoron : klaassenElectronSet(donor);
  const cl = carrier === 'hole' ? KLAASSEN_1992.acceptorClustering : KLAASSEN_1992.donorClustering;
  const k = KLAASSEN_1992;
  const source = 'Klaassen 1992 (I, Table 1; II)';
  return [
    { name: 'μmax', value: set.maxCm2PerVs, unit: 'cm²/V·s', source },
    { name: 'μmin', value: set.minCm2PerVs, unit: 'cm²/V·s', source },
    { name: 'N_ref', value: set.referencePerCm3, unit: 'cm⁻³', source },
    { name: 'α', value: set.alpha, source },
    { name: 'θ', value: set.theta, source },
    { name: 'clustering c', value: cl.c, source: 'Klaassen 1992 I' },
    { name: 'clustering N_ref', value: cl.referencePerCm3, unit: 'cm⁻³', source: 'Klaassen 1992 I' },
    { name: 'm/m0', value: carrier === 'hole' ? k.holeMassRatio : k.electronMassRatio, source: 'Klaassen 1992 I' },
    { name: 'f_CW', value: k.fCW, source: 'Klaassen 1992 I' },
    { name: 'f_BH', value: k.fBH, source: 'Klaassen 1992 I' },
    { name: 'r5', value: k.r[4], source: 'common implementations (paper prints −0.01552)' },
  ];
}

const DENSITY_RANGE: Range = KLAASSEN_1992_VALIDITY.impurityDensityPerCm3;

export const klaassen1992: TemperatureMobilityModel = {
  id: 'klaassen-1992',
  name: 'Klaassen (1992) unified mobility',
  citation: `${KLAASSEN_1992_CITATION}, doi:10.1016/0038-1101(92)90325-7 and 90326-8`,
  dopants: ['boron', 'phosphorus', 'arsenic', 'antimony'],
  referenceTemperatureK: 300,
  validityTemperatureK: KLAASSEN_1992_VALIDITY.temperatureK,
  validityDensityPerCm3: {
    boron: DENSITY_RANGE,
    phosphorus: DENSITY_RANGE,
    arsenic: DENSITY_RANGE,
    antimony: DENSITY_RANGE,
  },
  accuracy:
    'fits majority and minority mobility data at 300 K over the full doping range; temperature dependence reasonable about 100–450 K, best at 300 K',
  minorityCarriers: true,
  equations: [
    '1/μ = 1/μ_L + 1/μ_DAh, μ_L = μmax·(300/T)^θ',
    'μ_DAh = μ_N·(N_sc/N_sc,eff)·(N_ref/N_sc)^α + μ_c·(n+p)/N_sc,eff',
    'μ_N = μmax²/(μmax−μmin)·(T/300)^(3α−1.5), μ_c = μmax·μmin/(μmax−μmin)·(300/T)^0.5',
    'N_sc,eff = N_same* + G(P)·N_opposite* + (other carrier)/F(P), N* = N·(1 + 1/(c + (N_ref,cl/N)²))',
  ],
  notes: [
    'Equations and parameters as printed in parts I and II, confirmed against open implementations citing them.',
    'r5 = −0.8552 and P_CW from N_sc as in common implementations (the paper prints r5 = −0.01552); majority mobility is unaffected to < 1 %.',
    'Antimony takes the phosphorus parameter set; minority electrons with no donor take the arsenic set.',
    'Temperature range 100–450 K is a secondary statement of where the model fits data, not the paper’s own wording.',
  ],
  parameters: (dopant: Dopant) =>
    DOPANT_TYPE[dopant] === 'p' ? parameterTable('hole') : parameterTable('electron', dopant),
  carrier: (dopant: Dopant) => DOPANT_TYPE[dopant],
  mobilityCm2PerVs: (dopantDensityPerCm3: number, dopant: Dopant, temperatureK = 300) =>
    majorityMobilityCm2PerVs(klaassen1992, dopantDensityPerCm3, dopant, temperatureK),
  electronMobilityCm2PerVs: klaassenElectronMobilityCm2PerVs,
  holeMobilityCm2PerVs: klaassenHoleMobilityCm2PerVs,
};
