/**
 * Loading the product spec file (SPEC_FILE): YAML or JSON (JSON is read by the same YAML parser,
 * which knows line positions), validated with zod. A bad file gives every problem found, each
 * with its line, column and field path, e.g.
 *
 *   specs.yaml line 14, column 22, products.HX-200P.resistivityOhmCm.max: min must be below max
 *
 * Loading never throws for a bad file: the result is data, the caller decides (start-up stops
 * with the list).
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { LineCounter, isMap, isPair, isScalar, isSeq, parseDocument, type Node } from 'yaml';
import { catalogFrom, SpecFile, type SpecCatalog } from './schema.js';
import type { LotsConfig } from '../config.js';

export interface SpecFileProblem {
  readonly line?: number;
  readonly column?: number;
  /** Field path, e.g. 'products.HX-200P.dopant'; '' for the whole file. */
  readonly field: string;
  readonly message: string;
}

export type SpecLoad =
  | { readonly ok: true; readonly catalog: SpecCatalog }
  | { readonly ok: false; readonly source: string; readonly problems: readonly SpecFileProblem[] };

/** The largest spec file we read (a spec file is a few kB; this stops a wrong path early). */
export const MAX_SPEC_FILE_BYTES = 2_000_000;

export function loadSpecFile(path: string, options: { demo?: boolean } = {}): SpecLoad {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'file not found' : code === 'EISDIR' ? 'is a folder, not a file' : `cannot read it (${code ?? 'error'})`;
    return { ok: false, source: path, problems: [{ field: '', message: why }] };
  }
  return parseSpecText(text, path, options);
}

export function parseSpecText(text: string, source: string, options: { demo?: boolean } = {}): SpecLoad {
  if (text.length > MAX_SPEC_FILE_BYTES) {
    return { ok: false, source, problems: [{ field: '', message: `larger than ${MAX_SPEC_FILE_BYTES} bytes; is this the spec file?` }] };
  }
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: true });
  if (doc.errors.length > 0) {
    return {
      ok: false,
      source,
      problems: doc.errors.map((err) => {
        const pos = err.linePos?.[0];
        return {
          ...(pos ? { line: pos.line, column: pos.col } : {}),
          field: '',
          message: firstLine(err.message),
        };
      }),
    };
  }
  let data: unknown;
  try {
    // The parser refuses a document whose aliases expand without bound (a "billion laughs").
    data = doc.toJS({ maxAliasCount: 100 });
  } catch (e) {
    const why = e instanceof ReferenceError && /alias/i.test(e.message) ? 'uses YAML aliases (*name) so often that it would expand without bound; write the products out in full' : `cannot be read as YAML data (${e instanceof Error ? e.name : 'error'})`;
    return { ok: false, source, problems: [{ field: '', message: why }] };
  }
  const parsed = SpecFile.safeParse(data ?? {});
  if (!parsed.success) {
    return {
      ok: false,
      source,
      problems: parsed.error.issues.map((issue) => {
        const path = issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p));
        // An unknown key: point at the key itself.
        const unknownKey = issue.code === 'unrecognized_keys' && issue.keys[0] !== undefined;
        if (unknownKey) path.push(issue.keys[0]!);
        const node = nodeAt(doc.contents, path, unknownKey);
        const pos = node?.range ? lineCounter.linePos(node.range[0]) : undefined;
        return {
          ...(pos ? { line: pos.line, column: pos.col } : {}),
          field: path.join('.'),
          message: issue.message,
        };
      }),
    };
  }
  // Product ids are matched case-insensitively, so two that differ only in case clash.
  const seen = new Map<string, string>();
  const problems: SpecFileProblem[] = [];
  for (const id of Object.keys(parsed.data.products)) {
    const key = id.toUpperCase();
    const other = seen.get(key);
    if (other !== undefined) {
      const node = nodeAt(doc.contents, ['products', id]);
      const pos = node?.range ? lineCounter.linePos(node.range[0]) : undefined;
      problems.push({
        ...(pos ? { line: pos.line, column: pos.col } : {}),
        field: `products.${id}`,
        message: `product id ${id} differs from ${other} only in letter case; ids are matched ignoring case`,
      });
    }
    seen.set(key, id);
  }
  if (problems.length > 0) return { ok: false, source, problems };
  return { ok: true, catalog: catalogFrom(parsed.data, source, options.demo ?? false) };
}

/** One line per problem, for start-up messages and logs. */
export function describeSpecProblems(load: Extract<SpecLoad, { ok: false }>): string {
  const name = basename(load.source);
  const lines = load.problems.map((p) => {
    const where = p.line !== undefined ? ` line ${p.line}, column ${p.column ?? 1}` : '';
    const field = p.field ? ` ${p.field}:` : ':';
    return `  ${name}${where}${field} ${p.message}`;
  });
  return `The spec file ${load.source} has ${load.problems.length} problem${load.problems.length === 1 ? '' : 's'}:\n${lines.join('\n')}`;
}

/** The parser's message without its code excerpt and its own "at line N, column M" (we give those). */
function firstLine(message: string): string {
  const first = message.split('\n')[0] ?? message;
  return first.replace(/\s+at line \d+, column \d+:?\s*$/, '');
}

/**
 * The deepest YAML node along `path` (map keys or sequence indices). When a field is missing,
 * this is its parent, so the line points where the field should go.
 */
function nodeAt(root: unknown, path: readonly (string | number)[], atKey = false): Node | undefined {
  let node = root as Node | null | undefined;
  let found: Node | undefined = node ?? undefined;
  for (const segment of path) {
    if (isMap(node)) {
      const pair = node.items.find((it) => isPair(it) && isScalar(it.key) && String(it.key.value) === String(segment));
      if (!pair) return found;
      const value = pair.value as Node | null;
      const last = segment === path[path.length - 1];
      // Point at the key for a missing value or a whole block (the line that names it).
      node = value === null || (last && (atKey || isMap(value) || isSeq(value))) ? (pair.key as Node) : value;
    } else if (isSeq(node) && typeof segment === 'number') {
      const item = node.items[segment] as Node | undefined;
      if (!item) return found;
      node = item;
    } else {
      return found;
    }
    found = node ?? found;
  }
  return found;
}

/** The spec file, checked; a bad one is the message to stop start-up with. */
export function loadLotSpecs(config: LotsConfig): { ok: true; catalog: SpecCatalog } | { ok: false; message: string } {
  const load = loadSpecFile(config.specFile, { demo: config.demoSpecs });
  if (!load.ok) return { ok: false, message: `${describeSpecProblems(load)}\nFix the file (see docs/lots.md, "The spec file") or point SPEC_FILE at the right one.` };
  return { ok: true, catalog: load.catalog };
}
