import { LineCounter, isMap, isScalar, isSeq, parseDocument, type Document, type Node as YamlNode, type YAMLError } from 'yaml';
import type { z } from 'zod';
import type { ErrorCode } from './errors.js';
import { sha256Hex } from './result-fingerprint.js';
import { specIssueMessage } from './run-spec.messages.js';
import { fillRunSpecDefaults, runSpecSchema, type ResolvedRunSpec } from './run-spec.schema.js';

/** One problem in a spec file, with its position (1-based line and column). */
export interface SpecProblem {
  readonly file: string;
  readonly line: number;
  readonly column: number;
  /** Key path such as `sampling.frequency` or `capitalStructure.peerGroups[0].members[2]`; '' for the whole spec. */
  readonly path: string;
  readonly message: string;
}

export function formatSpecProblem(problem: SpecProblem): string {
  const where = `${problem.file}:${problem.line}:${problem.column}`;
  return problem.path === '' ? `${where} ${problem.message}` : `${where} ${problem.path}: ${problem.message}`;
}

/** A spec that cannot be used: every problem found, each with file, line, column and key path. */
export class SpecError extends Error {
  readonly code = 'SPEC_INVALID' satisfies ErrorCode;

  constructor(
    readonly file: string,
    readonly problems: readonly SpecProblem[],
  ) {
    super(problems.map(formatSpecProblem).join('\n'));
    this.name = 'SpecError';
  }
}

export interface LoadedRunSpec {
  readonly spec: ResolvedRunSpec;
  /** sha256 (lowercase hex) of the spec text's exact UTF-8 bytes, BOM included if present. */
  readonly sha256: string;
}

type Segment = PropertyKey;

export function formatKeyPath(path: readonly Segment[]): string {
  let text = '';
  for (const segment of path) {
    if (typeof segment === 'number') text += `[${segment}]`;
    else if (typeof segment === 'string' && /^[A-Za-z_][\w-]*$/.test(segment)) text += text === '' ? segment : `.${segment}`;
    else text += `[${JSON.stringify(String(segment))}]`;
  }
  return text;
}

function keyText(key: unknown): string | undefined {
  return isScalar(key) ? String(key.value) : undefined;
}

/** Offset of the YAML text a key path points at: the value for a scalar, else its key; the nearest ancestor when missing. */
function offsetOf(doc: Document, path: readonly Segment[], atKey: boolean): number {
  let node: unknown = doc.contents;
  let keyNode: YamlNode | undefined;
  let fallback = doc.contents?.range?.[0] ?? 0;
  for (const segment of path) {
    if (isMap(node)) {
      const pair = node.items.find((item) => keyText(item.key) === String(segment));
      if (pair === undefined || !isScalar(pair.key)) return fallback;
      keyNode = pair.key;
      node = pair.value;
    } else if (isSeq(node) && typeof segment === 'number' && node.items[segment] !== undefined) {
      keyNode = undefined;
      node = node.items[segment];
    } else {
      return fallback;
    }
    fallback = keyNode?.range?.[0] ?? (node as YamlNode | null)?.range?.[0] ?? fallback;
  }
  if (!atKey && isScalar(node) && node.value !== null && node.range) return node.range[0];
  return fallback;
}

/** The deepest key path whose text contains the offset: where a YAML syntax error sits. */
function pathAtOffset(doc: Document, offset: number): Segment[] {
  const path: Segment[] = [];
  let node: unknown = doc.contents;
  for (;;) {
    if (isMap(node)) {
      const pair = node.items.find((item) => {
        const start = (item.key as YamlNode | null)?.range?.[0] ?? Infinity;
        const end = (item.value as YamlNode | null)?.range?.[2] ?? (item.key as YamlNode | null)?.range?.[2] ?? -1;
        return start <= offset && offset <= end;
      });
      const key = pair === undefined ? undefined : keyText(pair.key);
      if (pair === undefined || key === undefined) return path;
      path.push(key);
      node = pair.value;
    } else if (isSeq(node)) {
      const index = node.items.findIndex((item) => {
        const range = (item as YamlNode | null)?.range;
        return range != null && range[0] <= offset && offset <= range[2];
      });
      if (index < 0) return path;
      path.push(index);
      node = node.items[index];
    } else {
      return path;
    }
  }
}

function syntaxProblem(file: string, doc: Document, error: YAMLError, lines: LineCounter): SpecProblem {
  const position = error.linePos?.[0] ?? lines.linePos(error.pos[0]);
  const reason = (error.message.split('\n')[0] ?? error.code).replace(/ at line \d+, column \d+:?$/, '');
  return { file, line: position.line, column: position.col, path: formatKeyPath(pathAtOffset(doc, error.pos[0])), message: `YAML syntax: ${reason}` };
}

function schemaProblems(file: string, doc: Document, issues: readonly z.core.$ZodIssue[], lines: LineCounter): SpecProblem[] {
  const problems: SpecProblem[] = [];
  const at = (path: readonly Segment[], message: string, atKey: boolean): void => {
    const { line, col } = lines.linePos(offsetOf(doc, path, atKey));
    problems.push({ file, line, column: col, path: formatKeyPath(path), message });
  };
  for (const issue of issues) {
    if (issue.code === 'unrecognized_keys') for (const key of issue.keys) at([...issue.path, key], issue.message, true);
    else at(issue.path, issue.message, false);
  }
  return problems.sort((a, b) => a.line - b.line || a.column - b.column);
}

/**
 * Parses and validates a run spec's text. `file` names it in every message
 * (e.g. `specs/core.yaml:12:5 sampling.frequency: "montly" is not allowed; allowed: daily, weekly, monthly`).
 * Throws SpecError (code SPEC_INVALID) listing every problem found.
 */
export function loadRunSpec(text: string, file: string): LoadedRunSpec {
  const sha256 = sha256Hex(text);
  const lines = new LineCounter();
  // Positions count from after a byte-order mark, as an editor shows them.
  const body = text.startsWith('\uFEFF') ? text.slice(1) : text;
  const doc = parseDocument(body, { lineCounter: lines, prettyErrors: true, uniqueKeys: true });
  if (doc.errors.length > 0) throw new SpecError(file, doc.errors.map((error) => syntaxProblem(file, doc, error, lines)));
  let data: unknown;
  try {
    data = doc.toJS({ maxAliasCount: 100 });
  } catch (error) {
    throw new SpecError(file, [{ file, line: 1, column: 1, path: '', message: `YAML: ${(error as Error).message.split('\n')[0]}` }]);
  }
  const result = runSpecSchema.safeParse(data, { error: specIssueMessage });
  if (!result.success) throw new SpecError(file, schemaProblems(file, doc, result.error.issues, lines));
  return { spec: fillRunSpecDefaults(result.data), sha256 };
}
