import type { Transaction } from 'sequelize';
import type { ResultRecord } from '../contracts/result-columns.js';
import { renderResultCsvFromRecords } from '../contracts/result-csv.js';
import type { ResolvedRunSpec } from '../contracts/run-spec.schema.js';
import { AppError } from '../shared/errors.js';
import { SpecRevision } from '../specs/spec-revision.model.js';
import { Spec } from '../specs/spec.model.js';
import { RunResult } from './run-result.model.js';
import type { Run } from './run.model.js';

export interface RunCsv {
  csv: string;
  fileName: string;
  fingerprint: string;
  fingerprintSha256: string;
}

/** Runs whose current attempt has results. */
const WITH_RESULTS = ['in-review', 'released', 'superseded'];

/**
 * The run's result CSV from the stored records through the contracts' one writer, with the spec
 * revision's `report.columns`: the same bytes `clino run --out` writes for the same spec and inputs.
 */
export async function runCsv(run: Run, transaction?: Transaction): Promise<RunCsv> {
  if (!WITH_RESULTS.includes(run.state)) {
    throw new AppError(409, 'RUN_STATE_CONFLICT', `Run ${run.id} is ${run.state}: it has no results to write`);
  }
  const revision = await SpecRevision.findByPk(run.specRevisionId, { transaction });
  const spec = await Spec.findByPk(run.specId, { transaction });
  const parsed = revision?.parsed as unknown as ResolvedRunSpec | undefined;
  const rows = await RunResult.findAll({ where: { runId: run.id, attempt: run.attempt }, attributes: ['record'], transaction });
  const csv = renderResultCsvFromRecords(
    rows.map((r) => r.record as unknown as ResultRecord),
    parsed?.report.columns ? { columns: parsed.report.columns } : {},
  );
  return { csv, fileName: `${spec?.name ?? 'run'}-${run.asOf}.csv`, fingerprint: run.fingerprint, fingerprintSha256: run.fingerprintSha256 };
}
