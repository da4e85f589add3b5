/**
 * Reply → the machine-readable JSON contract (shared/DESIGN.md):
 *   { ok: true, id, command, values: { <key>: { value, unit, label } }, inputs, assumptions,
 *     model: { id, citation, … }, warnings: [{ code, message }], cautions }
 *   { ok: false, error: { code, message, usage } }
 * Extra fields (title, createdAt, sections, derivation, picture) are additions; the contract's fields
 * keep their names and shapes.
 */
import type { Reply } from '../reply/reply.js';

export type JsonReply = Readonly<Record<string, unknown>>;

export function toJson(reply: Reply): JsonReply {
  if (!reply.ok) return { ok: false, error: { ...reply.error } };
  const values: Record<string, { value: number | string; unit: string; label: string }> = {};
  for (const v of reply.values) values[v.key] = { value: v.value, unit: v.unit, label: v.label };
  return {
    ok: true,
    id: reply.id,
    command: reply.command,
    title: reply.title,
    createdAt: reply.createdAt,
    values,
    inputs: reply.inputs,
    assumptions: reply.assumptions,
    ...(reply.model ? { model: reply.model } : {}),
    warnings: reply.warnings,
    cautions: reply.cautions,
    ...(reply.sections ? { sections: reply.sections } : {}),
    ...(reply.derivation ? { derivation: reply.derivation } : {}),
    ...(reply.picture ? { picture: reply.picture } : {}),
  };
}

export function renderJson(reply: Reply): string {
  return JSON.stringify(toJson(reply), null, 2);
}
