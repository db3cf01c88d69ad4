// Reader for the NIST StRD linear-regression files kept in test/fixtures/nist-strd/.
// Line ranges come from each file's own header ("Certified Values (lines 31 to 46)",
// "Data (lines 61 to 96)"); nothing is hard-coded. CRLF and LF are both accepted.

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export interface CertifiedParameter {
  readonly estimate: number;
  readonly sd: number;
}

export interface NistDataset {
  readonly name: string;
  readonly y: Float64Array;
  readonly xs: readonly Float64Array[]; // one array per predictor column
  readonly parameters: readonly CertifiedParameter[]; // B0, B1, … in file order
  readonly residualSd: number;
  readonly rSquared: number;
  readonly residualDf: number;
  readonly residualSumOfSquares: number;
}

const NUMBER = String.raw`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`;

export function nistFixturePath(name: string): string {
  return fileURLToPath(new URL(`../../../../test/fixtures/nist-strd/${name}.dat`, import.meta.url));
}

function lineRange(lines: readonly string[], label: string, file: string): [number, number] {
  const pattern = new RegExp(String.raw`${label}\s*\(lines\s+(\d+)\s+to\s+(\d+)\)`);
  for (const line of lines) {
    const match = pattern.exec(line);
    if (match) return [Number(match[1]), Number(match[2])];
  }
  throw new Error(`${file}: no "${label} (lines a to b)" in the header`);
}

function parseNumber(text: string, file: string, line: number): number {
  const value = Number(text);
  if (!Number.isFinite(value)) throw new Error(`${file}:${line}: "${text.slice(0, 20)}" is not a number`);
  return value;
}

const PARAMETER_LINE = new RegExp(String.raw`^\s*B(\d+)\s+(${NUMBER})\s+(${NUMBER})\s*$`);
const RESIDUAL_SD_LINE = new RegExp(String.raw`^\s*Standard Deviation\s+(${NUMBER})`);
const R_SQUARED_LINE = new RegExp(String.raw`^\s*R-Squared\s+(${NUMBER})`);
const ANOVA_RESIDUAL_LINE = new RegExp(String.raw`^\s*Residual\s+(\d+)\s+(${NUMBER})\s+(${NUMBER})`);

function parseCertified(lines: readonly string[], [from, to]: [number, number], file: string) {
  const parameters: CertifiedParameter[] = [];
  let residualSd = NaN, rSquared = NaN, residualDf = NaN, residualSumOfSquares = NaN;
  for (let number = from; number <= to; number += 1) {
    const text = lines[number - 1] ?? '';
    const param = PARAMETER_LINE.exec(text);
    const sd = RESIDUAL_SD_LINE.exec(text);
    const r2 = R_SQUARED_LINE.exec(text);
    const anova = ANOVA_RESIDUAL_LINE.exec(text);
    if (param) parameters[Number(param[1])] = { estimate: parseNumber(param[2]!, file, number), sd: parseNumber(param[3]!, file, number) };
    if (sd) residualSd = parseNumber(sd[1]!, file, number);
    if (r2) rSquared = parseNumber(r2[1]!, file, number);
    if (anova) [residualDf, residualSumOfSquares] = [Number(anova[1]), parseNumber(anova[2]!, file, number)];
  }
  return { parameters: parameters.filter((p) => p !== undefined), residualSd, rSquared, residualDf, residualSumOfSquares };
}

function parseData(lines: readonly string[], [from, to]: [number, number], file: string) {
  const rows: number[][] = [];
  for (let number = from; number <= to; number += 1) {
    const fields = (lines[number - 1] ?? '').trim().split(/\s+/);
    rows.push(fields.map((field) => parseNumber(field, file, number)));
  }
  const width = rows[0]?.length ?? 0;
  if (width < 2 || rows.some((row) => row.length !== width)) throw new Error(`${file}: data rows ${from}-${to} are ragged`);
  const column = (j: number) => Float64Array.from(rows, (row) => row[j]!);
  return { y: column(0), xs: Array.from({ length: width - 1 }, (_, j) => column(j + 1)) };
}

export function readNistDataset(name: string): NistDataset {
  const file = `${name}.dat`;
  const lines = readFileSync(nistFixturePath(name), 'utf8').split(/\r?\n/);
  const certified = parseCertified(lines, lineRange(lines, 'Certified Values', file), file);
  const data = parseData(lines, lineRange(lines, 'Data', file), file);
  return { name, ...data, ...certified };
}

/** Log relative error −log10(|got − certified| / |certified|): about the number of matching digits. */
export function logRelativeError(got: number, certified: number): number {
  if (got === certified) return 16;
  return -Math.log10(Math.abs(got - certified) / Math.abs(certified));
}
