// The local result files of a run: the CSV (written only by the contracts' writer) and its companion
// `<out>.fingerprint` (spec sha256 and input checksums). Same spec and files, same bytes.
import { renderResultCsv, resultRecords } from '../../../server/src/contracts/result-csv.js';
import { fingerprintFileName, renderFingerprint, type Fingerprint } from '../../../server/src/contracts/result-fingerprint.js';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import type { ComputedRun } from '../batch/compute-run.js';
import { writeFileAtomic } from './atomic-write.js';

export function fingerprintOf(specSha256: string, run: ComputedRun): Fingerprint {
  return { specSha256, inputs: run.inputs.map(({ name, sha256 }) => ({ name, sha256 })) };
}

export function resultCsvText(spec: ResolvedRunSpec, run: ComputedRun): string {
  return renderResultCsv(run.rows, { columns: spec.report.columns });
}

export function fingerprintFileOf(out: string): string {
  return fingerprintFileName(out);
}

export async function writeResultFiles(out: string, spec: ResolvedRunSpec, specSha256: string, run: ComputedRun): Promise<void> {
  await writeFileAtomic(out, resultCsvText(spec, run));
  await writeFileAtomic(fingerprintFileOf(out), renderFingerprint(fingerprintOf(specSha256, run)));
}

/** The `--json` document: the CSV's content as data, with the fingerprint beside it. */
export function resultJson(spec: ResolvedRunSpec, specSha256: string, run: ComputedRun, extra: Record<string, unknown> = {}): string {
  const fingerprint = fingerprintOf(specSha256, run);
  const document = {
    spec: spec.name,
    asOf: run.asOf,
    fingerprint: { specSha256, inputs: fingerprint.inputs },
    rows: resultRecords(run.rows, { columns: spec.report.columns }),
    ...extra,
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}
