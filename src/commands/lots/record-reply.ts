/** The reply to `record`: pass or which flag, the checks, the flags raised or closed. */
import { basename } from 'node:path';
import type { Check, ReadingEvaluation } from '../../lots/evaluation-types.js';
import { flagHandle } from '../../lots/flags.js';
import { placeLabel } from '../../lots/ids.js';
import type { StoredReading } from '../../lots/readings.js';
import type { RecordResult } from '../../lots/service.js';
import { okReply, type ReplyIdentity } from '../../reply/build.js';
import { formatNumber } from '../../reply/format.js';
import type { ReplyInput, ReplyOk, ReplyValue, ReplyWarning } from '../../reply/reply.js';
import { checkText, countValue, DEMO_SPECS_NOTE, FLAG_TITLES, flagDetailText, flagLine, LOT_FLAG_CAUTION, noteText } from './wording.js';

export interface RecordReplyExtras {
  /** The resistivity was typed without a unit and read as Ω·cm. */
  readonly bareNumber?: boolean;
  readonly asTyped: Readonly<Record<string, string>>;
}

function windowOf(e: ReadingEvaluation): Extract<Check, { check: 'window' }> | undefined {
  return e.checks.find((c): c is Extract<Check, { check: 'window' }> => c.check === 'window');
}

export function recordReply(identity: ReplyIdentity, result: RecordResult, extras: RecordReplyExtras): ReplyOk {
  const { outcome, duplicate, catalog } = result;
  const readings = outcome.readings;
  const first = readings[0];
  const place = first ? placeLabel(first.wafer, first.site) : 'lot';
  const head = place === 'lot' ? outcome.lotId : `${outcome.lotId} ${place}`;
  const flagged = readings.some((r) => r.verdict === 'flagged') || outcome.raised.length > 0 || outcome.alreadyOpen.length > 0;

  // Title: pass, or which flags.
  let title: string;
  if (readings.length === 0) {
    title = outcome.productChange ? `${outcome.lotId} · product set to ${outcome.productChange.to}` : `${outcome.lotId} · product ${outcome.productId ?? '?'}`;
    if (outcome.raised.length > 0) title += ` · FLAGGED: ${[...new Set(outcome.raised.map((f) => FLAG_TITLES[f.code]))].join(', ')}`;
  } else if (flagged) {
    const codes = new Set<string>();
    for (const r of readings) for (const f of r.evaluation.findings) codes.add(f.code);
    for (const f of [...outcome.raised, ...outcome.alreadyOpen]) codes.add(f.code);
    const w = first ? windowOf(first.evaluation) : undefined;
    const titles = [...codes].map((c) =>
      c === 'out_of_window' && w && w.status === 'fail' ? `${FLAG_TITLES[c]} (${w.limit === 'max' ? '+' : '−'}${formatNumber(w.marginPercent, { sigFigs: 2 })} %)` : (FLAG_TITLES[c] ?? c),
    );
    title = `${head} · FLAGGED: ${titles.join(', ')}`;
  } else if (readings.every((r) => r.verdict === 'no_verdict')) {
    title = `${head} · recorded, no verdict`;
  } else {
    const w = first ? windowOf(first.evaluation) : undefined;
    title = `${head} · pass${w ? ` · ${formatNumber(w.value)} ${w.quantity === 'resistivityOhmCm' ? 'Ω·cm' : 'cm⁻³'} in the ${outcome.productId ?? ''} window` : ''}`;
  }

  const values: ReplyValue[] = [];
  const verdict = flagged ? 'flagged' : readings.length === 0 ? 'recorded' : readings.every((r) => r.verdict === 'no_verdict') ? 'no verdict' : 'pass';
  values.push({ key: 'verdict', value: verdict, unit: '', label: 'Verdict', headline: true });
  for (const r of readings) values.push(...readingValues(r));
  readings.forEach((r, i) => {
    const typeToo = i > 0 && r.quantity === 'type';
    values.push(countValue(typeToo ? 'typeReadingId' : 'readingId', r.id, typeToo ? 'Type reading number' : 'Reading number'));
  });

  const inputs: Record<string, ReplyInput> = { lot: { value: outcome.lotId, label: 'Lot' } };
  if (first?.wafer !== undefined) inputs['wafer'] = { value: `w${first.wafer}`, label: 'Wafer' };
  if (first?.site !== undefined) inputs['site'] = { value: String(first.site), label: 'Site' };
  for (const r of readings) {
    inputs[r.quantity] = { value: r.asEntered, label: r.quantity === 'type' ? 'Type reading' : r.evaluation.map ? 'Reading' : r.quantity === 'sheet' ? 'Sheet reading' : 'Resistivity' };
  }
  if (first?.temperatureK !== undefined) {
    inputs['temperature'] = { value: formatNumber(first.temperatureK - 273.15, { sigFigs: 3 }), unit: '°C', label: 'Temperature', ...(extras.asTyped['temperature'] ? { asTyped: extras.asTyped['temperature'] } : {}) };
  }
  if (outcome.productId !== undefined) inputs['product'] = { value: outcome.productId, label: 'Product' };

  const assumptions: string[] = [];
  const warnings: ReplyWarning[] = [];
  if (duplicate) assumptions.push(`This message was already recorded${readings.length ? ` (reading ${readings.map((r) => `#${r.id}`).join(', ')})` : ''}; it was delivered again and nothing new was written.`);
  const spec = outcome.productId !== undefined ? catalog.find(outcome.productId) : undefined;
  if (spec) {
    assumptions.push(
      `Checked against ${spec.id} (${spec.type}-type, ${spec.dopant}) from ${basename(catalog.source)}${catalog.revision ? `, ${catalog.revision}` : ''}; windows are at 23 °C.`,
    );
  }
  if (catalog.demo) assumptions.push(DEMO_SPECS_NOTE);
  if (extras.bareNumber) assumptions.push('No unit given: the resistivity was read as Ω·cm.');
  if (outcome.supersedes !== undefined) assumptions.push(`This corrects reading #${outcome.supersedes}; the earlier reading is kept, marked as corrected, and no longer counts.`);
  const seenNotes = new Set<string>();
  for (const r of readings) {
    for (const n of r.evaluation.notes) {
      const t = noteText(n);
      if (seenNotes.has(t.message)) continue;
      seenNotes.add(t.message);
      if (t.kind === 'assumption') assumptions.push(t.message);
      else warnings.push({ code: t.code, message: t.message });
    }
  }
  for (const f of outcome.raised) warnings.push({ code: `flag_${f.code}`, message: `${flagHandle(f.id)} raised — ${FLAG_TITLES[f.code]}: ${flagDetailText(f.detail)}.` });

  const sections = [];
  const checks = readings.flatMap((r) => r.evaluation.checks.map((c) => checkText(c, r.evaluation.model?.name)));
  if (checks.length > 0) sections.push({ heading: 'Checks', table: { columns: ['Check', 'Result', 'Detail'], rows: checks.map((c) => [c.name, c.result, c.detail]) } });
  // New flags are in the warnings; here what was already open and what was closed.
  const flagLines = [
    ...outcome.alreadyOpen.map((f) => `Still open: ${flagLine(f)}`),
    ...outcome.closed.map((f) => `Closed: ${flagLine(f)} — ${f.clearance?.reason ?? ''}`),
  ];
  if (flagLines.length > 0) sections.push({ heading: 'Flags', lines: flagLines });

  const model = readings.map((r) => r.evaluation.model).find((m) => m !== undefined);
  const cautions = flagged ? [LOT_FLAG_CAUTION] : [];

  const steps: string[] = [];
  for (const r of readings) {
    for (const c of r.evaluation.checks) {
      const t = checkText(c, r.evaluation.model?.name);
      steps.push(`${t.name}: ${t.detail} → ${t.result}`);
    }
  }
  return okReply(identity, {
    command: 'record',
    title,
    values,
    inputs,
    assumptions,
    ...(model ? { model: { id: model.id, name: model.name, citation: model.citation, ...(model.validity ? { validity: model.validity } : {}) } } : {}),
    warnings,
    cautions,
    sections,
    derivation: {
      equations: [
        'inside the window: margin = (ρ − min)/min or (max − ρ)/max, whichever is smaller, × 100 %',
        'outside the window: margin = (ρ − max)/max or (min − ρ)/min × 100 %',
        'spread = (max − min)/mean × 100 % (or /min when the spec says range-over-min), latest value per site',
        ...(readings.some((r) => r.evaluation.map) ? ['map: non-uniformity = 1σ/mean × 100 % over the sites inside the edge exclusion; the map mean is the wafer’s reading'] : []),
      ],
      parameters: spec
        ? [
            ...(spec.resistivityOhmCm ? [{ name: 'window min', value: spec.resistivityOhmCm.min, unit: 'Ω·cm' }, { name: 'window max', value: spec.resistivityOhmCm.max, unit: 'Ω·cm' }] : []),
            ...(spec.dopantDensityPerCm3 ? [{ name: 'window min', value: spec.dopantDensityPerCm3.min, unit: 'cm⁻³' }, { name: 'window max', value: spec.dopantDensityPerCm3.max, unit: 'cm⁻³' }] : []),
            ...(spec.spread?.siteToSitePercent !== undefined ? [{ name: 'site-to-site limit', value: spec.spread.siteToSitePercent, unit: '%' }] : []),
            ...(spec.spread?.waferToWaferPercent !== undefined ? [{ name: 'wafer-to-wafer limit', value: spec.spread.waferToWaferPercent, unit: '%' }] : []),
            ...(spec.uniformity?.nonUniformityPercentMax !== undefined ? [{ name: 'non-uniformity limit (1σ/mean)', value: spec.uniformity.nonUniformityPercentMax, unit: '%' }] : []),
            ...(spec.uniformity?.meanOhmCm ? [{ name: 'map mean min', value: spec.uniformity.meanOhmCm.min, unit: 'Ω·cm' }, { name: 'map mean max', value: spec.uniformity.meanOhmCm.max, unit: 'Ω·cm' }] : []),
          ].map((p) => ({ ...p, source: basename(catalog.source) }))
        : [],
      steps,
      sources: [catalog.source, ...(model ? [model.citation] : [])],
    },
  });
}

function readingValues(r: StoredReading): ReplyValue[] {
  const out: ReplyValue[] = [];
  const map = r.evaluation.map;
  const mean = map ? 'Map mean ' : '';
  if (r.quantity === 'sheet') out.push({ key: 'sheetResistanceOhmPerSq', value: r.value, unit: 'Ω/□', label: map ? 'Map mean sheet resistance' : 'Sheet resistance' });
  if (r.resistivityOhmCm !== undefined) {
    out.push({ key: 'resistivityOhmCm', value: r.resistivityOhmCm, unit: 'Ω·cm', label: `${mean}${mean ? 'resistivity' : 'Resistivity'}${r.temperatureK !== undefined ? ' at 23 °C' : ''}`, headline: true });
  }
  if (map) {
    out.push(
      { key: 'nonUniformityPercent', value: map.nonUniformityPercent, unit: '%', label: 'Non-uniformity (1σ/mean)', headline: true },
      { key: 'rangeNonUniformityPercent', value: map.rangeNonUniformityPercent, unit: '%', label: 'Range non-uniformity ((max − min)/(2·mean))' },
      { key: 'minimum', value: map.minimumOhmCm, unit: 'Ω·cm', label: 'Lowest site resistivity (as measured)' },
      { key: 'maximum', value: map.maximumOhmCm, unit: 'Ω·cm', label: 'Highest site resistivity (as measured)' },
      countValue('siteCount', map.count, `Sites in the statistics (of ${map.siteCount} stored)`),
    );
  }
  if (r.dopantDensityPerCm3 !== undefined) {
    out.push({ key: 'dopantDensityPerCm3', value: r.dopantDensityPerCm3, unit: 'cm⁻³', label: `${capital(r.evaluation.dopant ?? 'dopant')} density` });
  }
  if (r.carrierType !== undefined) out.push({ key: 'carrierType', value: r.carrierType, unit: '', label: 'Conductivity type', headline: true });
  const w = windowOf(r.evaluation);
  if (w) {
    out.push({
      key: 'specMarginPercent',
      value: w.status === 'pass' ? w.marginPercent : -w.marginPercent,
      unit: '%',
      label: `Margin to the ${w.limit === 'max' ? 'maximum' : 'minimum'}${w.status === 'pass' ? '' : ' (− = outside)'}`,
      sigFigs: 2,
    });
  }
  for (const c of r.evaluation.checks) {
    if (c.check === 'uniformity') out.push({ key: 'nonUniformityLimitPercent', value: c.limitPercent, unit: '%', label: 'Non-uniformity limit', sigFigs: 2 });
    if (c.check === 'site_spread') out.push({ key: 'siteSpreadPercent', value: c.spreadPercent, unit: '%', label: `Site-to-site spread w${c.wafer}`, sigFigs: 2 });
    if (c.check === 'wafer_spread') out.push({ key: 'waferSpreadPercent', value: c.spreadPercent, unit: '%', label: 'Wafer-to-wafer spread', sigFigs: 2 });
  }
  return out;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
