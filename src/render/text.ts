/**
 * Reply → plain text for the console and the one-shot CLI. Layout only; numbers are formatted
 * by src/reply/format.ts, the same as on every other surface.
 */
import { formatNumber } from '../reply/format.js';
import type { Reply, ReplyError, ReplyOk, ReplySection, ReplyValue } from '../reply/reply.js';

export interface TextOptions {
  /** Wrap width for long lines (console width); 0 for no wrapping. */
  readonly width?: number;
}

export function valueText(v: ReplyValue): string {
  const n = typeof v.value === 'number' ? formatNumber(v.value, { sigFigs: v.sigFigs ?? 3 }) : v.value;
  return v.unit ? `${n} ${v.unit}` : n;
}

/** Wrap at word boundaries; continuation lines hang under the text after a leading marker ("• ", "! "). */
function wrap(text: string, width: number, indent: string): string {
  if (width <= 0 || text.length + indent.length <= width) return indent + text;
  const marker = /^(?:[•!⚠✗] )/.exec(text)?.[0] ?? '';
  const hang = indent + ' '.repeat(marker.length);
  const words = text.split(' ');
  const lines: string[] = [];
  let line = '';
  for (const w of words) {
    if (line && indent.length + line.length + 1 + w.length > width) {
      lines.push(line);
      line = w;
    } else line = line ? `${line} ${w}` : w;
  }
  if (line) lines.push(line);
  return lines.map((l, i) => (i === 0 ? indent : hang) + l).join('\n');
}

function table(columns: readonly string[], rows: readonly (readonly string[])[], indent: string): string[] {
  const widths = columns.map((c, i) => Math.max(c.length, ...rows.map((r) => (r[i] ?? '').length)));
  const fmt = (cells: readonly string[]) =>
    indent + cells.map((c, i) => (i === cells.length - 1 ? c : c.padEnd(widths[i]!))).join('  ').trimEnd();
  return [fmt(columns), indent + widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(fmt)];
}

export function sectionText(s: ReplySection, width: number): string[] {
  const out: string[] = [];
  if (s.heading) out.push(`  ${s.heading}`);
  const indent = s.heading ? '    ' : '  ';
  for (const l of s.lines ?? []) out.push(wrap(l, width, indent));
  if (s.table) out.push(...table(s.table.columns, s.table.rows, indent));
  return out;
}

function okText(r: ReplyOk, width: number): string {
  const out: string[] = [r.title, '─'.repeat(Math.min(Math.max(r.title.length, 20), width || 72))];
  if (r.values.length) {
    const labelWidth = Math.max(...r.values.map((v) => v.label.length));
    for (const v of r.values) out.push(`  ${v.headline ? '▸' : ' '} ${v.label.padEnd(labelWidth)}  ${valueText(v)}`);
  }
  const inputs = Object.values(r.inputs);
  if (inputs.length) {
    const shown = inputs.map((i) => {
      const v = typeof i.value === 'number' ? formatNumber(i.value, { sigFigs: 4 }) : i.value;
      const val = i.unit ? `${v} ${i.unit}` : v;
      return i.asTyped && i.asTyped !== val && i.asTyped !== i.value ? `${i.label} ${val} (“${i.asTyped}”)` : `${i.label} ${val}`;
    });
    out.push('', wrap(`Read as: ${shown.join(' · ')}`, width, '  '));
  }
  for (const s of r.sections ?? []) out.push('', ...sectionText(s, width));
  if (r.assumptions.length) {
    out.push('', '  Assumes');
    for (const a of r.assumptions) out.push(wrap(`• ${a}`, width, '    '));
  }
  if (r.model) {
    out.push('', wrap(`Model: ${r.model.name} [${r.model.id}]`, width, '  '), wrap(r.model.citation, width, '    '));
    if (r.model.validity) out.push(wrap(`valid: ${r.model.validity}`, width, '    '));
  }
  if (r.warnings.length) {
    out.push('', '  Check');
    for (const w of r.warnings) out.push(wrap(`! ${w.message}`, width, '    '));
  }
  if (r.cautions.length) {
    out.push('');
    for (const c of r.cautions) out.push(wrap(`⚠ ${c}`, width, '  '));
  }
  if (r.command !== 'help' && r.command !== 'models' && r.command !== 'why') {
    out.push('', `  ${r.id} · type “why ${r.id}” for the full derivation`);
  }
  return out.join('\n');
}

function errorText(r: ReplyError, width: number): string {
  const e = r.error;
  const out = [wrap(`✗ ${e.message}`, width, '')];
  if (e.suggestion) out.push(`  Did you mean: ${e.suggestion}?`);
  if (e.usage) out.push(`  Form:    ${e.usage}`);
  if (e.example) out.push(`  Example: ${e.example}`);
  if (e.usage && e.usage !== 'help') out.push('  (help lists every command)');
  return out.join('\n');
}

export function renderText(reply: Reply, options: TextOptions = {}): string {
  const width = options.width ?? 88;
  return reply.ok ? okText(reply, width) : errorText(reply, width);
}
