/**
 * A command is data plus two functions: `parse` turns tokens into a request object that the
 * command's zod schema checks, and `run` calls the core and builds a Reply. Help is made from
 * the same data, and a test runs every example.
 */
import type { z } from 'zod';
import type { Reply } from '../reply/reply.js';
import type { Args } from './args.js';
import type { HandleContext } from './context.js';
import type { LonePRule } from './conductivity-words.js';

export interface HelpEntry {
  /** One line: what the command answers. */
  readonly summary: string;
  /** The right form, e.g. 'rho <resistivity> [dopant] [model <id>] [at <temperature>]'. */
  readonly usage: string;
  /** Examples that must all work (checked by test/commands/help-examples.test.ts). */
  readonly examples: readonly string[];
  /** Options explained, one line each. */
  readonly options?: readonly string[];
  readonly seeAlso?: readonly string[];
}

export interface CommandSpec<Req = unknown> {
  readonly verb: string;
  readonly aliases?: readonly string[];
  readonly help: HelpEntry;
  readonly schema: z.ZodType<Req>;
  /** Read the tokens after the verb into a candidate request (checked by `schema`). */
  parse(args: Args, ctx: HandleContext): unknown;
  /** How a lone capital "P" reads in this command when its other words decide (default: asked). */
  readonly lonePRule?: LonePRule;
  run(request: Req, ctx: HandleContext): Promise<Reply> | Reply;
}

/** Identity helper that keeps the request type of a spec. */
export function defineCommand<Req>(spec: CommandSpec<Req>): CommandSpec<Req> {
  return spec;
}
