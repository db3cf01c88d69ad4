// PLACEHOLDER until the engine's statistics land; replaced below.
import type { ResultRow } from '../../../server/src/contracts/result-columns.js';
import type { SecuritySeries } from '../../../server/src/contracts/ingest.schemas.js';
import type { ResolvedRunSpec } from '../../../server/src/contracts/run-spec.schema.js';
import type { InputChecksum } from './input-checksums.js';
import type { RunInputPaths } from './input-roles.js';

export interface ComputedRun {
  readonly asOf: string;
  readonly rows: readonly ResultRow[];
  readonly series: readonly SecuritySeries[];
  readonly inputs: readonly InputChecksum[];
}

export interface ComputeRunOptions {
  readonly asOf?: string;
  readonly priorBetas?: ReadonlyMap<string, number>;
  readonly onProgress?: (done: number, total: number) => void;
}

export async function computeRun(spec: ResolvedRunSpec, inputPaths: RunInputPaths, options: ComputeRunOptions = {}): Promise<ComputedRun> {
  void spec; void inputPaths; void options;
  throw new Error('not yet');
}
