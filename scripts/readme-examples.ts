/**
 * Regenerates the example outputs — every example in docs/examples.md, a few in README.md (each
 * between its `<!-- examples:begin -->` and `<!-- examples:end -->` markers) — by running each
 * command through the same `handle` and text renderer the console uses, with a fixed clock and
 * sequential result ids so the text is stable. The command shown is the direct one
 * (`shiftprobe`, as installed by npm ci; `npx shiftprobe` adds npx's own start-up).
 *   npm run readme:examples
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { MemoryResultStore } from '../src/adapters/storage/memory.js';
import { handle } from '../src/commands/handle.js';
import { renderJson } from '../src/render/json.js';
import { renderText } from '../src/render/text.js';
// The same in-memory demo lot store (invented Harrowgate Fab 3 specs and history) the command tests use.
import { demoLots } from '../test/helpers/lots.js';

/** A command, or a command with a measurement file from examples/maps/ (`--file` on the command line). */
type Example = string | { readonly text: string; readonly file: string };

const EXAMPLES: readonly { heading: string; commands: readonly Example[]; json?: boolean }[] = [
  { heading: 'Resistivity → dopant density (`rho`)', commands: ['rho 8.2 ohm-cm p', 'rho 0.012 Ω·cm arsenic'] },
  { heading: 'Dopant density → resistivity (`doping`)', commands: ['doping 3.1x10^16 cm^-3 phos'] },
  { heading: 'Four-point probe (`sheet`)', commands: ['sheet 4.1mV 1mA thick 725um spacing 1mm diam 200mm p', 'sheet 45 ohm/sq thick 525um n'] },
  { heading: 'Conductivity type (`type`)', commands: ['type hot -1.4mV rho 12 ohm-cm expect n', 'type hall -1.3e3 cm3/C', 'type point forward +'] },
  { heading: 'Intrinsic carrier density (`ni`)', commands: ['ni 85C', 'ni 400K Ge'] },
  { heading: 'A reading taken off 23 °C (`at`, `tc`)', commands: ['rho 8.2 ohm-cm p at 27C', 'rho 8.2 ohm-cm p at 27C tc 0.75%/K'] },
  { heading: 'Carriers at a temperature (`carriers`)', commands: ['carriers 1e15 boron at 150C', 'carriers 1e16 B and 3e15 P at 300K'] },
  { heading: 'Where the material turns intrinsic (`crossover`)', commands: ['crossover 1e15 boron'] },
  { heading: 'Diffused layers, Irvin\'s method (`layer`)', commands: ['layer 45 ohm/sq xj 0.8um erfc on 1e15 p', 'layer Cs 1e19 xj 0.8um gaussian on 1e15 p'] },
  { heading: 'Hall measurements (`hall`)', commands: ['hall -1.3e3 cm3/C rho 1.1 ohm-cm', 'hall -2.6mV current 1mA field 0.5T thick 500um'] },
  { heading: 'van der Pauw (`vdp`)', commands: ['vdp 12.4 ohm 11.9 ohm thick 500um p', 'vdp 250 ohm 240 ohm hall -3.1mV current 100uA field 0.5T'] },
  {
    heading: 'Lot readings, flags and the daily summary (`record`, `lot`, `flags`, `clear`, `digest`) — invented demo lots',
    commands: [
      'record LOT-A17 w3 site 4 rho 12.9 ohm-cm',
      'record LOT-B204 w6 type hot +1.4mV',
      'lot LOT-A17',
      'flags',
      'clear LOT-B204 type w5 because repeat hot probe and SPV both read n-type; tip was contaminated',
      'digest',
    ],
  },
  {
    heading: 'Wafer maps (`map`, `record … map`) — invented demo files in examples/maps/',
    commands: [
      { text: 'map thick 525um p', file: 'LOT-A17-w03-rs.csv' },
      { text: 'record LOT-A17 w6 map thick 725um', file: 'LOT-A17-w06-rs.csv' },
      'map LOT-A17 w6 show rs',
    ],
  },
  { heading: 'The derivation of a result (`why`)', commands: ['why r-000001'] },
  { heading: 'Models and sources (`models`)', commands: ['models', 'models masetti'] },
  { heading: 'Help (`help`)', commands: ['help', 'help sheet'] },
  { heading: 'Bad input', commands: ['rho -8.2 ohm-cm p', 'rhp 8.2 ohm-cm p', 'rho 8.2 mV p', 'sheet 45 ohm/sq thick 5 mV'] },
];

const JSON_EXAMPLES = ['rho 8.2 ohm-cm p', 'rho -8.2 ohm-cm p'];

/** The few the README shows. */
const README_EXAMPLES: readonly string[] = ['rho 8.2 ohm-cm p', 'type hot -1.4mV rho 12 ohm-cm expect n', 'record LOT-A17 w3 site 4 rho 12.9 ohm-cm'];

function replaceBetweenMarkers(file: string, body: string): void {
  const text = readFileSync(file, 'utf8');
  const begin = '<!-- examples:begin -->';
  const end = '<!-- examples:end -->';
  const a = text.indexOf(begin);
  const b = text.indexOf(end);
  if (a < 0 || b < a) throw new Error(`${file} has no examples markers`);
  writeFileSync(file, text.slice(0, a + begin.length) + '\n' + body + text.slice(b));
}

async function main(): Promise<void> {
  let n = 0;
  const now = () => new Date('2026-11-30T14:05:00Z');
  const ctx = {
    lots: demoLots(now).service,
    surface: 'cli' as const,
    caller: { userId: 'readme', channelId: 'readme' },
    now,
    newId: () => `r-${(++n).toString(16).padStart(6, '0')}`,
    results: new MemoryResultStore(),
    session: {},
  };
  const out: string[] = [];
  for (const group of EXAMPLES) {
    out.push(`## ${group.heading}`, '');
    for (const c of group.commands) {
      const text = typeof c === 'string' ? c : c.text;
      const file = typeof c === 'string' ? undefined : c.file;
      const reply = await handle(text, file ? { ...ctx, attachment: { name: file, text: readFileSync(`examples/maps/${file}`, 'utf8') } } : ctx);
      out.push('```', `$ shiftprobe ${file ? `--file examples/maps/${file} ` : ''}"${text}"`, renderText(reply, { width: 92 }), '```', '');
    }
  }
  out.push('## JSON (`--json`)', '');
  for (const c of JSON_EXAMPLES) {
    const reply = await handle(c, ctx);
    out.push('```json', `// shiftprobe --json "${c}"`, renderJson(reply), '```', '');
  }
  replaceBetweenMarkers('docs/examples.md', out.join('\n'));
  // The README's few, from a fresh store and ids (the same text a new user sees).
  let m = 0;
  const fresh = { ...ctx, lots: demoLots(now).service, newId: () => `r-${(++m).toString(16).padStart(6, '0')}`, results: new MemoryResultStore(), session: {} };
  const short: string[] = [];
  for (const c of README_EXAMPLES) {
    const reply = await handle(c, fresh);
    short.push('```', `$ shiftprobe "${c}"`, renderText(reply, { width: 92 }), '```', '');
  }
  replaceBetweenMarkers('README.md', short.join('\n'));
}

await main();
