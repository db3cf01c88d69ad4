import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RESULT_COLUMNS } from './result-columns.js';
import { listSpecKeys } from './run-spec.keys.js';
import { loadRunSpec } from './run-spec.load.js';

// docs/run-spec.md is the reference analysts read; these tests keep it in step with the zod schema.
const doc = readFileSync(new URL('../../../docs/run-spec.md', import.meta.url), 'utf8');

interface DocRow {
  readonly key: string;
  readonly cells: readonly string[];
}

/** Table rows whose first cell is a backticked key: `| \`sampling.window\` | type | default | allowed | meaning |`. */
function documentedKeys(): DocRow[] {
  const rows: DocRow[] = [];
  for (const line of doc.split('\n')) {
    const match = /^\| `([^`]+)` \|(.*)\|$/.exec(line);
    if (match?.[1] !== undefined && match[2] !== undefined) rows.push({ key: match[1], cells: match[2].split(' | ').map((cell) => cell.trim()) });
  }
  return rows;
}

const schemaKeys = listSpecKeys();
const docRows = documentedKeys();
const docByKey = new Map(docRows.map((row) => [row.key, row]));

function defaultText(value: unknown): string {
  // The Blume default is exactly 2/3 (the double nearest to it); the doc writes it as 2/3.
  return value === 2 / 3 ? '2/3' : String(value);
}

describe('docs/run-spec.md', () => {
  it('documents every key of the schema', () => {
    const missing = schemaKeys.map((key) => key.path).filter((path) => !docByKey.has(path));
    expect(missing).toEqual([]);
  });

  it('names no key the schema does not have', () => {
    const known = new Set(schemaKeys.map((key) => key.path));
    const unknown = docRows.map((row) => row.key).filter((key) => !known.has(key));
    expect(unknown).toEqual([]);
  });

  it('documents each key once', () => {
    const seen = docRows.map((row) => row.key);
    expect(seen.length).toBe(new Set(seen).size);
  });

  it('states each scalar default as the schema sets it', () => {
    const wrong = schemaKeys
      .filter((key) => key.hasDefault && (typeof key.defaultValue === 'string' || typeof key.defaultValue === 'number'))
      .filter((key) => docByKey.get(key.path)?.cells[1] !== `\`${defaultText(key.defaultValue)}\``)
      .map((key) => `${key.path}: ${defaultText(key.defaultValue)} vs ${docByKey.get(key.path)?.cells[1]}`);
    expect(wrong).toEqual([]);
  });

  it('lists every allowed value of each choice', () => {
    const missing = schemaKeys.flatMap((key) =>
      key.allowed.filter((value) => !(docByKey.get(key.path)?.cells[2] ?? '').includes(`\`${value}\``)).map((value) => `${key.path}: ${value}`),
    );
    expect(missing).toEqual([]);
  });

  it('has a complete example spec that the loader accepts', () => {
    const example = /```yaml\n([\s\S]*?)```/.exec(doc)?.[1] ?? '';
    const { spec } = loadRunSpec(example, 'docs/run-spec.md#example');
    expect(spec.name).toBe('core-holdings');
    expect(spec.pricing?.marketPremium).toBe(0.055);
    expect(spec.capitalStructure?.peerGroups[0]?.members).toEqual(['QZ1', 'QZ2', 'QZ3']);
    expect(Object.keys(spec.groups ?? {})).toEqual(['QZ1', 'QZ2', 'QZ3']);
  });

  it('lists the result columns in the writer\'s order with their units', () => {
    const rows = [...doc.matchAll(/^\| (\d+) \| `([a-z0-9_]+)` \| ([^|]+) \|/gm)].map((m) => [Number(m[1]), m[2], m[3]?.trim()]);
    expect(rows).toEqual(RESULT_COLUMNS.map((column, i) => [i + 1, column.name, column.unit]));
  });
});

describe('run spec schema descriptions', () => {
  it('describes every key with .describe()', () => {
    const undocumented = schemaKeys.filter((key) => (key.description ?? '').trim() === '').map((key) => key.path);
    expect(undocumented).toEqual([]);
  });
});
