/**
 * `carriers`: equilibrium electrons, holes, ionized fraction and Fermi level at a temperature,
 * with incomplete ionization and compensation; the resistivity there (Si).
 */
import { z } from 'zod';
import { carriersAtTemperature, CARRIERS_DOMAIN_TEMPERATURE_K } from '../physics/carriers/carriers.js';
import { ACCEPTOR_DEGENERACY, DONOR_DEGENERACY, IONIZATION_MODEL_LIMIT_PER_CM3 } from '../physics/carriers/ionization-energies.js';
import { errorReply, okReply } from '../reply/build.js';
import { MODEL_ESTIMATE } from '../reply/cautions.js';
import { formatNumber, formatTemperature } from '../reply/format.js';
import { assumptionText } from '../reply/messages.js';
import type { ReplyInput, ReplyValue } from '../reply/reply.js';
import { ArgError } from './args.js';
import { DopantSchema, identity, readModelId } from './common.js';
import { parameterRows, refusalMessage } from './describe.js';
import { defineCommand } from './spec.js';
import { readDopantList, resolveMobilityModelId } from './temperature-common.js';
import { MATERIAL_LABEL, MATERIAL_WORDS } from './words.js';

const Entry = z.object({
  dopant: DopantSchema,
  densityPerCm3: z.number().finite(),
  densityAsTyped: z.string(),
  dopantAsTyped: z.string(),
  bareNumber: z.boolean(),
});

export const CarriersRequest = z.object({
  dopants: z.array(Entry).min(1),
  temperatureK: z.number().finite(),
  temperatureAsTyped: z.string(),
  defaulted: z.boolean(),
  material: z.enum(['Si', 'Ge', 'GaAs']),
  modelId: z.string().optional(),
  intrinsicModelId: z.string().optional(),
});
export type CarriersRequest = z.infer<typeof CarriersRequest>;

const USAGE = 'carriers <N> <dopant> [and <N2> <dopant2>] at <T> [Si|Ge] [model <mobility>] [ni-model <id>]';
const EXAMPLE = 'carriers 1e15 boron at 150C';

export const carriersCommand = defineCommand<CarriersRequest>({
  verb: 'carriers',
  aliases: ['carrier', 'fermi'],
  help: {
    summary: 'Electrons, holes, ionized fraction and Fermi level at a temperature (incomplete ionization, compensation), and the resistivity there.',
    usage: USAGE,
    examples: [
      'carriers 1e15 boron at 150C',
      'carriers 1e16 B and 3e15 P at 300K',
      'carriers 2e17 arsenic at 77K',
      'carriers 1e14 n at 600K',
      'carriers 5e15 phos at 250K Ge',
      'carriers 1e16 boron at 400K model arora',
    ],
    options: [
      'N: dopant density (cm⁻³; a bare number is read as cm⁻³); two dopants with `and` for compensated material',
      'at <T>: K or °C; 300 K when not given',
      'Si (default) or Ge (levels from memory, no resistivity); GaAs is not covered',
      'model <id>: mobility for the resistivity — klaassen (default), arora, masetti, caughey-thomas',
      'ni-model <id>: n_i model (default: the fit covering the temperature)',
    ],
    seeAlso: ['crossover', 'ni', 'why'],
  },
  schema: CarriersRequest,
  parse(args) {
    const at = args.keyed(['at'], 'temperature');
    const intrinsicModelId = args.keyedWord(['ni-model', 'nimodel', 'intrinsic']);
    const modelId = readModelId(args);
    const material = args.word(MATERIAL_WORDS)?.value ?? 'Si';
    const dopants = readDopantList(args, EXAMPLE);
    const loose = at ? undefined : args.quantity(['temperature']);
    const t = at ?? loose;
    if (t && t.unitAsTyped === '' && !at) throw new ArgError('bad_unit', `Give the temperature with its unit, e.g. ${EXAMPLE}`);
    return {
      dopants,
      temperatureK: t?.value ?? 300,
      temperatureAsTyped: t?.raw ?? '300 K (default)',
      defaulted: !t,
      material,
      ...(modelId ? { modelId } : {}),
      ...(intrinsicModelId ? { intrinsicModelId } : {}),
    };
  },
  run(req, ctx) {
    const outcome = carriersAtTemperature({
      dopants: req.dopants.map((d) => ({ dopant: d.dopant, densityPerCm3: d.densityPerCm3 })),
      temperatureK: req.temperatureK,
      material: req.material,
      ...(req.modelId ? { mobilityModelId: resolveMobilityModelId(req.modelId) } : {}),
      ...(req.intrinsicModelId ? { intrinsicModelId: req.intrinsicModelId } : {}),
    });
    if (!outcome.ok) return errorReply(outcome.refusal.code, refusalMessage(outcome.refusal), { usage: USAGE, example: EXAMPLE });
    const r = outcome.value;
    // n and p within 1 % of each other (exactly compensated, or intrinsic): no majority carrier.
    const balanced = Math.abs(r.electronDensityPerCm3 - r.holeDensityPerCm3) <= 0.01 * (r.electronDensityPerCm3 + r.holeDensityPerCm3);
    const majority = balanced ? 'none' : r.carrierType === 'n' ? 'electron' : 'hole';
    const values: ReplyValue[] = [
      { key: 'electronDensityPerCm3', value: r.electronDensityPerCm3, unit: 'cm⁻³', label: `Electron density n${majority === 'electron' ? ' (majority)' : ''}`, headline: majority === 'electron' },
      { key: 'holeDensityPerCm3', value: r.holeDensityPerCm3, unit: 'cm⁻³', label: `Hole density p${majority === 'hole' ? ' (majority)' : ''}`, headline: majority === 'hole' },
      { key: 'carrierType', value: balanced ? 'indeterminate' : r.carrierType, unit: '', label: balanced ? 'Conductivity type (n ≈ p, no majority carrier)' : 'Conductivity type' },
      { key: 'ionizedFraction', value: r.ionizedFraction, unit: '', label: `Ionized fraction of the ${r.netDonorDensityPerCm3 >= 0 ? 'donors' : 'acceptors'}`, sigFigs: 4 },
      { key: 'fermiLevelEv', value: r.fermiLevelEv, unit: 'eV', label: 'E_F − E_i (positive above the intrinsic level)', sigFigs: 3 },
      { key: 'fermiBelowConductionBandEv', value: r.fermiBelowConductionBandEv, unit: 'eV', label: 'E_c − E_F', sigFigs: 3 },
      { key: 'fermiAboveValenceBandEv', value: r.fermiAboveValenceBandEv, unit: 'eV', label: 'E_F − E_v', sigFigs: 3 },
    ];
    if (r.resistivityOhmCm !== undefined) {
      values.push({ key: 'resistivityOhmCm', value: r.resistivityOhmCm, unit: 'Ω·cm', label: `Resistivity at ${formatTemperature(r.temperatureK)}` });
      values.push({ key: 'electronMobilityCm2PerVs', value: r.electronMobilityCm2PerVs ?? Number.NaN, unit: 'cm²/V·s', label: 'Electron mobility' });
      values.push({ key: 'holeMobilityCm2PerVs', value: r.holeMobilityCm2PerVs ?? Number.NaN, unit: 'cm²/V·s', label: 'Hole mobility' });
    }
    values.push(
      { key: 'intrinsicDensityPerCm3', value: r.intrinsicDensityPerCm3, unit: 'cm⁻³', label: 'Intrinsic density n_i' },
      { key: 'bandgapEv', value: r.bandgapEv, unit: 'eV', label: 'Band gap Eg(T)', sigFigs: 4 },
      { key: 'temperatureK', value: r.temperatureK, unit: 'K', label: 'Temperature', sigFigs: Number.isInteger(r.temperatureK) ? 3 : 5 },
    );
    const inputs: Record<string, ReplyInput> = {};
    req.dopants.forEach((d, i) => {
      const suffix = req.dopants.length > 1 ? ` ${i + 1}` : '';
      inputs[`density${i + 1}`] = { value: d.densityPerCm3, unit: 'cm⁻³', label: `Dopant density${suffix}`, asTyped: d.densityAsTyped };
      inputs[`dopant${i + 1}`] = { value: d.dopant, label: `Dopant${suffix}`, asTyped: d.dopantAsTyped };
    });
    inputs['temperature'] = { value: r.temperatureK, unit: 'K', label: 'Temperature', asTyped: req.temperatureAsTyped };
    inputs['material'] = { value: MATERIAL_LABEL[r.material], label: 'Material' };
    const assumptions = [
      ...(req.defaulted ? ['No temperature given: 300 K.'] : []),
      ...req.dopants.filter((d) => d.bareNumber).map((d) => `No unit given: ${d.densityAsTyped} read as cm⁻³.`),
      ...r.assumptionCodes.filter((c) => c !== 'resistivity_anchored_23C').map(assumptionText),
      `n_i from ${r.intrinsicModel.name}${r.mobilityModel ? `; mobility from ${r.mobilityModel.name}` : ''}.`,
      ...(r.resistivityAnchor && r.mobilityModel
        ? [
            `Resistivity: ${r.resistivityAnchor.modelName} at 23 °C (${formatNumber(r.resistivityAnchor.resistivityAt23COhmCm)} Ω·cm, as \`doping\` gives), times the change from 23 °C to this temperature by ${r.mobilityModel.name} (which alone would give ${formatNumber(r.resistivityAnchor.mobilityModelAt23COhmCm)} Ω·cm at 23 °C).`,
          ]
        : []),
    ];
    const mobilitySource = r.mobilityModel ? [r.mobilityModel.citation] : [];
    return okReply(identity(ctx), {
      command: 'carriers',
      title: `Carriers in ${MATERIAL_LABEL[r.material]} at ${formatTemperature(r.temperatureK)}: ${req.dopants.map((d) => `${formatNumber(d.densityPerCm3)} cm⁻³ ${d.dopant}`).join(' + ')}`,
      values,
      inputs,
      assumptions,
      model: {
        id: 'charge-neutrality',
        name: 'Charge neutrality with incomplete ionization',
        citation: `Textbook statistics (e.g. Sze & Ng, Physics of Semiconductor Devices, 3rd ed., 2007, §1.5); n_i: ${r.intrinsicModel.citation}${r.mobilityModel ? `; μ: ${r.mobilityModel.citation}` : ''}`,
        validity: `non-degenerate; simple ionization model up to ~${formatNumber(IONIZATION_MODEL_LIMIT_PER_CM3)} cm⁻³; solver ${CARRIERS_DOMAIN_TEMPERATURE_K.min}–${CARRIERS_DOMAIN_TEMPERATURE_K.max} K`,
      },
      problems: r.problems,
      cautions: [MODEL_ESTIMATE],
      sections:
        r.dopants.length > 1
          ? [
              {
                heading: 'Each dopant',
                table: {
                  columns: ['dopant', 'density (cm⁻³)', 'ionized (cm⁻³)', 'fraction', 'ΔE (meV)'],
                  rows: r.dopants.map((d) => [d.dopant, formatNumber(d.densityPerCm3), formatNumber(d.ionizedDensityPerCm3), formatNumber(d.ionizedFraction, { sigFigs: 4 }), formatNumber(d.ionizationEnergyEv * 1000, { trim: true })]),
                },
              },
            ]
          : undefined,
      derivation: {
        equations: [
          'p + Σ N_D⁺ = n + Σ N_A⁻ (charge neutrality)',
          'n = n_i·e^u, p = n_i·e^−u, u = (E_F − E_i)/kT',
          'N_D⁺ = N_D/(1 + g_D·e^((E_F − E_D)/kT)), N_A⁻ = N_A/(1 + g_A·e^((E_A − E_F)/kT))',
          'E_c − E_i = kT·ln(Nc/n_i), E_i − E_v = kT·ln(Nv/n_i) (so n = Nc·e^−(E_c − E_F)/kT exactly; their sum is the gap the n_i model implies with Nc, Nv, within a few meV of Eg)',
          ...(r.resistivityOhmCm !== undefined ? ['ρ = 1/(q·(n·μn + p·μp))'] : []),
        ],
        parameters: [
          ...r.dopants.map((d) => ({ name: `ΔE (${d.dopant})`, value: d.ionizationEnergyEv, unit: 'eV', source: 'textbook level' })),
          { name: 'g_D', value: DONOR_DEGENERACY, source: 'textbook' },
          { name: 'g_A', value: ACCEPTOR_DEGENERACY, source: 'textbook' },
          { name: 'Nc(T)', value: r.conductionBandDensityPerCm3, unit: 'cm⁻³', source: 'materials (Green 1990 / Sze)' },
          { name: 'Nv(T)', value: r.valenceBandDensityPerCm3, unit: 'cm⁻³', source: 'materials (Green 1990 / Sze)' },
          ...parameterRows(r.intrinsicModel.parameters(r.material)),
        ],
        steps: [
          `kT = ${formatNumber(r.thermalEnergyEv, { sigFigs: 5 })} eV, n_i = ${formatNumber(r.intrinsicDensityPerCm3, { sigFigs: 5 })} cm⁻³, Eg = ${formatNumber(r.bandgapEv, { sigFigs: 5 })} eV`,
          `Brent on E_F: ${r.solver.evaluations} evaluations, relative residual ${formatNumber(Math.abs(r.solver.relativeResidual), { sigFigs: 2 })}`,
          `n = ${formatNumber(r.electronDensityPerCm3, { sigFigs: 6 })} cm⁻³, p = ${formatNumber(r.holeDensityPerCm3, { sigFigs: 6 })} cm⁻³, E_F − E_i = ${formatNumber(r.fermiLevelEv, { sigFigs: 5 })} eV`,
        ],
        sources: ['Sze & Ng 2007, §1.5 (statistics)', r.intrinsicModel.citation, ...mobilitySource],
      },
    });
  },
});
