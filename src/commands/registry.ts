/**
 * Every command the bot answers, in the order `help` lists them. To add one: write its spec
 * (src/commands/<verb>.ts, see DEVELOPERS.md) and add it here.
 */
import { dopingCommand } from './doping.js';
import { helpCommandFor } from './help.js';
import { modelsCommand } from './models.js';
import { niCommand } from './ni.js';
import { rhoCommand } from './rho.js';
import { sheetCommand } from './sheet.js';
import type { CommandSpec } from './spec.js';
import { typeCommand } from './type.js';
import { carriersCommand } from './carriers.js';
import { crossoverCommand } from './crossover.js';
import { layerCommand } from './layer.js';
import { hallCommand } from './hall.js';
import { vdpCommand } from './vdp.js';
import { mapCommand } from './map.js';
import { whyCommand } from './why.js';
import { clearCommand } from './lots/clear.js';
import { digestCommand } from './lots/digest.js';
import { flagsCommand } from './lots/flags.js';
import { lotCommand } from './lots/lot.js';
import { recordCommand } from './lots/record.js';
import { trendCommand } from './lots/trend.js';

export const COMMANDS: readonly CommandSpec<any>[] = [
  rhoCommand,
  dopingCommand,
  sheetCommand,
  typeCommand,
  niCommand,
  carriersCommand,
  crossoverCommand,
  layerCommand,
  hallCommand,
  vdpCommand,
  mapCommand,
  recordCommand,
  lotCommand,
  flagsCommand,
  clearCommand,
  digestCommand,
  trendCommand,
  // (more commands are registered here)
  modelsCommand,
  whyCommand,
  helpCommandFor(() => COMMANDS),
];

/** The commands that read or write lot records. */
const LOT_COMMANDS: ReadonlySet<CommandSpec<any>> = new Set([recordCommand, lotCommand, flagsCommand, clearCommand, digestCommand, trendCommand]);

/**
 * Whether a question starts with a lot command (by verb or alias). The one-shot CLI opens the
 * lot records (spec file, demo history) only then: a conversion never waits for them.
 */
export function usesLotRecords(text: string): boolean {
  const first = text.trim().split(/\s+/, 1)[0] ?? '';
  const spec = findCommand(first);
  return spec !== undefined && LOT_COMMANDS.has(spec);
}

export function findCommand(verb: string): CommandSpec<any> | undefined {
  const v = verb.toLowerCase();
  return COMMANDS.find((c) => c.verb === v || c.aliases?.some((a) => a.toLowerCase() === v));
}

export function knownVerbs(): string[] {
  return COMMANDS.flatMap((c) => [c.verb, ...(c.aliases ?? [])]);
}
