/**
 * Reply → plain text for the console and the one-shot CLI. Layout only; numbers are formatted
 * by src/reply/format.ts, the same as on every other surface.
 */
import { formatNumber } from '../reply/format.js';
import { isExplainable } from '../reply/kinds.js';
import type { Reply, ReplyError, ReplyOk, ReplySection, ReplyValue } from '../reply/reply.js';

export interface TextOptions {
  /** Wrap width for long lines (console width); 0 for no wrapping. */
  readonly width?: number;
}

/** Carrier densities below one per cm³ carry no physical meaning as numbers: said in words. */
const CARRIER_DENSITY_KEYS = new Set(['electronDensityPerCm3', 'holeDensityPerCm3', 'intrinsicDensityPerCm3']);

export function valueText(v: ReplyValue): string {
  if (CARRIER_DENSITY_KEYS.has(v.key) && typeof v.value === 'number' && v.value < 1) return `negligible (< 1 ${v.unit})`;
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

function table(columns: readonly string[], rows: readonly (readonly string[])[], indent: string, width = 0): string[] {
  const widths = columns.map((c, i) => Math.max(c.length, ...rows.map((r) => (r[i] ?? '').length)));
  const total = indent.length + widths.reduce((a, b) => a + b, 0) + 2 * (widths.length - 1);
  if (width > 0 && total > width) return narrowTable(columns, rows, indent, width, widths);
  const fmt = (cells: readonly string[]) =>
    indent + cells.map((c, i) => (i === cells.length - 1 ? c : c.padEnd(widths[i]!))).join('  ').trimEnd();
  return [fmt(columns), indent + widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(fmt)];
}

/**
 * A table wider than the screen: the leading columns keep their width and the last column
 * wraps under itself; if even that does not fit, each row becomes a small block of
 * "column: value" lines.
 */
function narrowTable(
  columns: readonly string[],
  rows: readonly (readonly string[])[],
  indent: string,
  width: number,
  widths: readonly number[],
): string[] {
  const lead = widths.slice(0, -1).reduce((a, b) => a + b + 2, 0);
  const room = width - indent.length - lead;
  if (room >= 24) {
    const pad = indent + ' '.repeat(lead);
    const fmt = (cells: readonly string[]): string => {
      const head = indent + cells.slice(0, -1).map((c, i) => c.padEnd(widths[i]!)).join('  ') + (cells.length > 1 ? '  ' : '');
      const wrapped = wrap(cells[cells.length - 1] ?? '', room + pad.length, pad).slice(pad.length);
      return (head + wrapped).trimEnd();
    };
    return [fmt(columns), indent + widths.map((w, i) => '─'.repeat(i === widths.length - 1 ? Math.min(w, room) : w)).join('  '), ...rows.map(fmt)];
  }
  const out: string[] = [];
  for (const r of rows) {
    out.push(wrap(`• ${columns[0]}: ${r[0] ?? ''}`, width, indent));
    for (let i = 1; i < columns.length; i++) out.push(wrap(`${columns[i]}: ${r[i] ?? ''}`, width, indent + '  '));
  }
  return out;
}

export function sectionText(s: ReplySection, width: number): string[] {
  const out: string[] = [];
  if (s.heading) out.push(`  ${s.heading}`);
  const indent = s.heading ? '    ' : '  ';
  for (const l of s.lines ?? []) out.push(wrap(l, width, indent));
  if (s.table) out.push(...table(s.table.columns, s.table.rows, indent, width));
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
  if (isExplainable(r)) {
    out.push('', `  ${r.id} · type “why ${r.id}” for the full derivation`);
  }
  return out.join('\n');
}

function errorText(r: ReplyError, width: number): string {
  const e = r.error;
  if (e.choices && e.choices.length > 0) {
    const out = [wrap(`? ${e.message}`, width, '')];
    for (const c of e.choices) out.push(wrap(`• ${c.label}:  ${c.command}`, width, '  '));
    out.push(wrap(`Type ${e.choices.map((c) => `“${c.answer}”`).join(' or ')} to answer, or the whole command.`, width, '  '));
    return out.join('\n');
  }
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
