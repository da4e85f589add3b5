/**
 * Builders for Reply objects, so every command fills the same fields the same way: an id, the
 * time from the injected clock, warnings from problems, and the procedure caution whenever the
 * reply can drive a decision.
 */
import type { Problem } from '../physics/problems.js';
import { CONFIRM_PROCEDURE } from './cautions.js';
import { problemsToWarnings } from './messages.js';
import type { Derivation, ReplyError, ReplyPicture, ReplyInput, ReplyModel, ReplyOk, ReplySection, ReplyValue, ReplyWarning } from './reply.js';

export interface OkParts {
  readonly command: string;
  readonly title: string;
  readonly values?: readonly ReplyValue[];
  readonly inputs?: Readonly<Record<string, ReplyInput>>;
  readonly assumptions?: readonly string[];
  readonly model?: ReplyModel;
  readonly problems?: readonly Problem[];
  readonly warnings?: readonly ReplyWarning[];
  readonly cautions?: readonly string[];
  readonly sections?: readonly ReplySection[];
  readonly derivation?: Derivation;
  /** Defaults to true: a value someone may act on. Help and model lists pass false. */
  readonly decision?: boolean;
  readonly picture?: ReplyPicture;
}

export interface ReplyIdentity {
  readonly id: string;
  readonly createdAt: string;
}

export function okReply(identity: ReplyIdentity, parts: OkParts): ReplyOk {
  const decision = parts.decision ?? true;
  const cautions = [...(parts.cautions ?? [])];
  if (decision && !cautions.includes(CONFIRM_PROCEDURE)) cautions.push(CONFIRM_PROCEDURE);
  return {
    ok: true,
    id: identity.id,
    command: parts.command,
    title: parts.title,
    createdAt: identity.createdAt,
    values: parts.values ?? [],
    inputs: parts.inputs ?? {},
    assumptions: parts.assumptions ?? [],
    ...(parts.model ? { model: parts.model } : {}),
    warnings: [...problemsToWarnings(parts.problems ?? []), ...(parts.warnings ?? [])],
    cautions,
    ...(parts.sections ? { sections: parts.sections } : {}),
    ...(parts.derivation ? { derivation: parts.derivation } : {}),
    decision,
    ...(parts.picture ? { picture: parts.picture } : {}),
  };
}

export function errorReply(
  code: string,
  message: string,
  more: { usage?: string; example?: string; suggestion?: string } = {},
): ReplyError {
  return { ok: false, error: { code, message, ...more } };
}
