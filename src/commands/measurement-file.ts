/**
 * Site-by-site measurement files (docs/measurement-files.md): our own CSV layout, read with
 * csv-parse (which reports the line of each record and of each error).
 *
 *   - one header row (lines starting with # before or between rows are comments);
 *   - comma or semicolon between fields (whichever the header uses); with semicolons a decimal
 *     comma is accepted ("12,5");
 *   - columns, by header name (case and spaces do not matter; a unit in parentheses or brackets,
 *     or after an underscore: "x (mm)", "x_mm", "rs [ohm/sq]"):
 *       x, y        site position in mm on wafer-centred axes (notch at the bottom, +y up)
 *       site        optional site number or name
 *       wafer       optional wafer id (one wafer per file)
 *       rs | sheet  sheet resistance (Ω/□ unless the header says otherwise)
 *       rho | resistivity   resistivity (Ω·cm unless the header says otherwise)
 *       v and i     inner-pin voltage and outer-pin current (units needed: mV, mA…)
 *       thickness   thickness map (µm unless the header says otherwise)
 *       value       the measured value, its unit in the header or given in the command
 *   - up to 10 000 sites.
 *
 * Every problem is a MeasurementFileError naming the line and what to change. The CSV library is
 * loaded on the first file, not at start: every other answer starts without it.
 */
import { parseQuantity, type Dimension } from './units.js';

export const MAX_SITES = 10_000;
/** Largest measurement file read (CLI --file, a chat attachment): 10 000 sites fit well under 2 MB. */
export const MAX_FILE_BYTES = 8 * 1024 * 1024;

export type MeasuredQuantity = 'sheetResistance' | 'resistivity' | 'voltageCurrent' | 'thickness';

export interface MeasurementFile {
  readonly name: string;
  readonly delimiter: ',' | ';';
  readonly decimalComma: boolean;
  readonly quantity: MeasuredQuantity;
  /** The header of the measured column(s), as written. */
  readonly columnsAsWritten: readonly string[];
  readonly xMm: Float64Array;
  readonly yMm: Float64Array;
  /** Canonical units: Ω/□, Ω·cm, V (with currentA), or cm for thickness. NaN where the cell was empty. */
  readonly values: Float64Array;
  readonly currentA?: Float64Array;
  /** Line of each site in the file (1-based). */
  readonly lines: Uint32Array;
  /** Site names as written ('' when the file has no site column). */
  readonly siteNames: readonly string[];
  readonly waferId?: string;
  /** Lines whose measured cell was empty. */
  readonly emptyLines: readonly number[];
}

export class MeasurementFileError extends Error {
  constructor(
    message: string,
    readonly line?: number,
  ) {
    super(line === undefined ? message : `line ${line}: ${message}`);
    this.name = 'MeasurementFileError';
  }
}

type Role = 'x' | 'y' | 'site' | 'wafer' | 'rs' | 'rho' | 'v' | 'i' | 'thickness' | 'value';

const ROLE_NAMES: ReadonlyArray<readonly [Role, readonly string[]]> = [
  ['x', ['x', 'xpos', 'x position']],
  ['y', ['y', 'ypos', 'y position']],
  ['site', ['site', 'site no', 'site number', 'site id', 'point']],
  ['wafer', ['wafer', 'wafer id', 'waferid', 'slot']],
  ['rs', ['rs', 'sheet', 'sheet resistance', 'sheet res']],
  ['rho', ['rho', 'resistivity', 'res']],
  ['v', ['v', 'voltage']],
  ['i', ['i', 'current']],
  ['thickness', ['thickness', 'thk', 'thick']],
  ['value', ['value', 'reading', 'measurement']],
];

const ROLE_DIMENSION: Partial<Record<Role, Dimension>> = {
  x: 'length',
  y: 'length',
  rs: 'sheetResistance',
  rho: 'resistivity',
  v: 'voltage',
  i: 'current',
  thickness: 'length',
};

const UNIT_SHORTHAND: Readonly<Record<string, string>> = { ohm_sq: 'ohm/sq', ohmsq: 'ohm/sq', ohm_cm: 'ohm cm', ohmcm: 'ohm cm' };

interface Column {
  readonly role: Role;
  readonly index: number;
  readonly header: string;
  /** Factor to the canonical unit (mm for x/y). */
  readonly factor: number;
  readonly dimension?: Dimension;
}

/** Split "x (mm)", "rs [ohm/sq]", "x_mm", "rs_ohm_sq" into name and unit text. */
function splitHeader(header: string): { name: string; unit?: string } {
  const h = header.trim().replace(/^\uFEFF/, '');
  const bracket = /^(.*?)\s*[([]\s*([^)\]]*)\s*[)\]]\s*$/.exec(h);
  if (bracket) return { name: bracket[1]!.trim().toLowerCase(), unit: bracket[2]!.trim() };
  const lower = h.toLowerCase();
  const underscore = /^([a-z ]+?)_(.+)$/.exec(lower);
  if (underscore && !ROLE_NAMES.some(([, names]) => names.includes(lower.replace(/_/g, ' ')))) {
    const unit = UNIT_SHORTHAND[underscore[2]!] ?? underscore[2]!.replace(/_/g, ' ');
    return { name: underscore[1]!.trim(), unit };
  }
  return { name: lower.replace(/_/g, ' ').trim() };
}

/** Factor from a header unit to the canonical unit of `dimension` (x/y: to mm). */
function unitFactor(unit: string, dimension: Dimension | undefined, header: string, line: number): { factor: number; dimension: Dimension } {
  const q = parseQuantity(`1 ${unit}`, dimension);
  if (!q.ok) throw new MeasurementFileError(`the unit "${unit}" in the header "${header}" is not one I read (e.g. mm, ohm/sq, ohm-cm, mV, mA, um)`, line);
  if (dimension && q.quantity.dimension !== dimension) {
    throw new MeasurementFileError(`the header "${header}" needs a unit of ${dimension === 'length' ? 'length (mm, um)' : dimension}, not "${unit}"`, line);
  }
  return { factor: q.quantity.value, dimension: q.quantity.dimension };
}

function columnsOf(header: readonly string[], line: number, valueUnit: string | undefined): Column[] {
  const out: Column[] = [];
  header.forEach((raw, index) => {
    const { name, unit } = splitHeader(raw);
    const role = ROLE_NAMES.find(([, names]) => names.includes(name))?.[0];
    if (!role) return; // other columns (notes, timestamps) are kept out of the map
    if (out.some((c) => c.role === role)) throw new MeasurementFileError(`two columns read as "${role}" ("${raw}" and "${out.find((c) => c.role === role)!.header}")`, line);
    let dimension = ROLE_DIMENSION[role];
    let factor = 1;
    const unitText = unit ?? (role === 'value' ? valueUnit : undefined);
    if (role === 'site' || role === 'wafer') {
      out.push({ role, index, header: raw, factor });
      return;
    }
    const position = role === 'x' || role === 'y';
    if (unitText) {
      const u = unitFactor(unitText, dimension, raw, line);
      // Lengths come back in cm; positions are kept in mm.
      factor = position ? u.factor * 10 : u.factor;
      dimension = u.dimension;
    } else if (role === 'v' || role === 'i') {
      throw new MeasurementFileError(`give the unit of "${raw}" in the header, e.g. "${role === 'v' ? 'v (mV)' : 'i (mA)'}"`, line);
    } else if (role === 'value') {
      throw new MeasurementFileError(`the column "${raw}" has no unit: write it in the header ("value (ohm/sq)") or in the command (map unit ohm/sq …)`, line);
    } else if (role === 'thickness') {
      factor = 1e-4; // µm → cm
    }
    out.push({ role, index, header: raw, factor, ...(dimension ? { dimension } : {}) });
  });
  return out;
}

function measuredOf(columns: readonly Column[], line: number): { quantity: MeasuredQuantity; main: Column; current?: Column } {
  const by = (r: Role) => columns.find((c) => c.role === r);
  const candidates = (['rs', 'rho', 'thickness', 'value', 'v'] as const).filter((r) => by(r));
  if (candidates.length === 0) {
    throw new MeasurementFileError('no measured column: name one rs (ohm/sq), rho (ohm-cm), thickness (um), value (with its unit), or v and i', line);
  }
  if (candidates.length > 1) {
    throw new MeasurementFileError(`one measured quantity per file, and this header has ${candidates.map((r) => `"${by(r)!.header}"`).join(', ')}`, line);
  }
  const main = by(candidates[0]!)!;
  if (main.role === 'v') {
    const current = by('i');
    if (!current) throw new MeasurementFileError(`"${main.header}" needs a current column beside it, e.g. "i (mA)"`, line);
    return { quantity: 'voltageCurrent', main, current };
  }
  const dimension = main.dimension;
  const quantity: MeasuredQuantity | undefined =
    dimension === 'sheetResistance' ? 'sheetResistance' : dimension === 'resistivity' ? 'resistivity' : dimension === 'length' ? 'thickness' : undefined;
  if (!quantity) throw new MeasurementFileError(`"${main.header}" is not a sheet resistance, resistivity or thickness`, line);
  return { quantity, main };
}

function numberOf(cell: string, decimalComma: boolean, what: string, line: number): number {
  const text = decimalComma ? cell.replace(',', '.') : cell;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) {
    const hint = !decimalComma && /^\d+,\d+$/.test(cell) ? ' (decimal commas need semicolons between fields)' : '';
    throw new MeasurementFileError(`${what} "${cell}" is not a number${hint}`, line);
  }
  return Number(text);
}

function friendlyCsvError(e: unknown): MeasurementFileError {
  const err = e as { code?: string; lines?: number; message?: string };
  const line = typeof err.lines === 'number' ? err.lines : undefined;
  switch (err.code) {
    case 'CSV_RECORD_INCONSISTENT_FIELDS_LENGTH':
      return new MeasurementFileError('this row has a different number of fields from the header', line);
    case 'CSV_QUOTE_NOT_CLOSED':
      return new MeasurementFileError('a quoted field is never closed', line);
    case 'CSV_INVALID_CLOSING_QUOTE':
    case 'CSV_NON_TRIMABLE_CHAR_AFTER_CLOSING_QUOTE':
      return new MeasurementFileError('text follows a closing quote', line);
    default:
      return new MeasurementFileError('the file could not be read as CSV', line);
  }
}

let csv: typeof import('csv-parse/sync') | undefined;

const CSV_OPTIONS = { skip_empty_lines: true, trim: true, comment: '#', bom: true } as const;

/**
 * Records with the line each ends on. csv-parse's per-record `info` costs about half the parse
 * (34 of 61 ms at 10 000 sites), so when the file is plain — no quote characters and no '#'
 * after the start of a line, where a record is exactly a non-empty line that is not a comment —
 * the lines are counted here and checked against the record count; otherwise (or if the count
 * disagrees) csv-parse reports them itself.
 */
function parseWithLines(parse: (typeof import('csv-parse/sync'))['parse'], text: string, delimiter: ',' | ';'): { record: string[]; info: { lines: number } }[] {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const plain = !body.includes('"') && !/[^\n\r]#/.test(body.replace(/^[ \t]*#.*$/gm, ''));
  if (plain) {
    const rows = parse(text, { ...CSV_OPTIONS, delimiter }) as string[][];
    const lines: number[] = [];
    const all = body.split('\n');
    for (let i = 0; i < all.length; i++) {
      const l = all[i]!.endsWith('\r') ? all[i]!.slice(0, -1) : all[i]!;
      if (l !== '' && !l.trimStart().startsWith('#')) lines.push(i + 1);
    }
    if (lines.length === rows.length) return rows.map((record, k) => ({ record, info: { lines: lines[k]! } }));
  }
  return parse(text, { ...CSV_OPTIONS, delimiter, info: true }) as unknown as { record: string[]; info: { lines: number } }[];
}

/** Read a measurement file; throws MeasurementFileError (with the line) on any problem. */
export async function readMeasurementFile(name: string, text: string, options: { valueUnit?: string } = {}): Promise<MeasurementFile> {
  csv ??= await import('csv-parse/sync');
  const { parse } = csv;
  const firstLine = text.split(/\r?\n/).find((l) => l.trim() !== '' && !l.trimStart().startsWith('#'));
  if (firstLine === undefined) throw new MeasurementFileError('the file is empty: it needs a header row and one row per site');
  const delimiter: ',' | ';' = (firstLine.match(/;/g)?.length ?? 0) > (firstLine.match(/,/g)?.length ?? 0) ? ';' : ',';
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parseWithLines(parse, text, delimiter);
  } catch (e) {
    throw friendlyCsvError(e);
  }
  const [head, ...rows] = records;
  if (!head) throw new MeasurementFileError('the file is empty: it needs a header row and one row per site');
  if (rows.length === 0) throw new MeasurementFileError('the file has a header but no sites', head.info.lines);
  if (rows.length > MAX_SITES) throw new MeasurementFileError(`${rows.length} sites: a map takes at most ${MAX_SITES.toLocaleString('en-US')}`, rows[MAX_SITES]!.info.lines);
  const columns = columnsOf(head.record, head.info.lines, options.valueUnit);
  const xCol = columns.find((c) => c.role === 'x');
  const yCol = columns.find((c) => c.role === 'y');
  if (!xCol || !yCol) throw new MeasurementFileError('the header needs x and y columns (site position in mm)', head.info.lines);
  const { quantity, main, current } = measuredOf(columns, head.info.lines);
  const siteCol = columns.find((c) => c.role === 'site');
  const waferCol = columns.find((c) => c.role === 'wafer');
  const decimalComma = delimiter === ';';

  const n = rows.length;
  const xMm = new Float64Array(n);
  const yMm = new Float64Array(n);
  const values = new Float64Array(n);
  const currentA = current ? new Float64Array(n) : undefined;
  const lines = new Uint32Array(n);
  const siteNames: string[] = [];
  const emptyLines: number[] = [];
  const wafers = new Set<string>();
  for (let k = 0; k < n; k++) {
    const { record, info } = rows[k]!;
    const line = info.lines;
    lines[k] = line;
    xMm[k] = numberOf(record[xCol.index]!, decimalComma, `x`, line) * xCol.factor;
    yMm[k] = numberOf(record[yCol.index]!, decimalComma, `y`, line) * yCol.factor;
    const cell = record[main.index]!;
    if (cell === '') {
      values[k] = Number.NaN;
      emptyLines.push(line);
    } else {
      const v = numberOf(cell, decimalComma, `the "${main.header}" value`, line) * main.factor;
      if (!(v > 0)) throw new MeasurementFileError(`"${main.header}" is ${cell}: a measured value must be above zero (leave the cell empty for a site not measured)`, line);
      values[k] = v;
    }
    if (current && currentA) {
      const c = record[current.index]!;
      currentA[k] = c === '' ? Number.NaN : numberOf(c, decimalComma, `the "${current.header}" value`, line) * current.factor;
      if (c !== '' && !(currentA[k]! > 0)) throw new MeasurementFileError(`"${current.header}" is ${c}: the current must be above zero`, line);
    }
    siteNames.push(siteCol ? record[siteCol.index]! : '');
    if (waferCol && record[waferCol.index]) wafers.add(record[waferCol.index]!);
  }
  if (wafers.size > 1) {
    throw new MeasurementFileError(`one wafer per file, and this one has ${[...wafers].slice(0, 4).join(', ')}${wafers.size > 4 ? '…' : ''}: split it by wafer`);
  }
  const [waferId] = [...wafers];
  return {
    name,
    delimiter,
    decimalComma,
    quantity,
    columnsAsWritten: current ? [main.header, current.header] : [main.header],
    xMm,
    yMm,
    values,
    ...(currentA ? { currentA } : {}),
    lines,
    siteNames,
    ...(waferId ? { waferId } : {}),
    emptyLines,
  };
}
