// The compact per-security series a run stores beside its rows: the scatter of the window's
// observations (market and security excess returns, pairwise-complete) and the rolling betas
// (period label of each end, oldest first; null where that window was insufficient).
import { MAX_SERIES_POINTS, type SecuritySeries } from '../../../server/src/contracts/ingest.schemas.js';
import type { AlignedSample } from '../engine/align.js';
import type { RollingBetas } from '../engine/rolling.js';
import { windowSample } from '../engine/window.js';
import type { IndexRange } from '../engine/types.js';

export function securitySeries(
  aligned: AlignedSample,
  index: number,
  window: IndexRange,
  minimum: number,
  rolling: RollingBetas,
): SecuritySeries {
  const security = aligned.securities[index]!;
  const sample = windowSample(aligned, security.excess, { first: window.start, last: window.end }, minimum);
  // rolling.count `all` may reach further back than a stored series holds: keep the most recent ends.
  const from = Math.max(0, rolling.ends.length - MAX_SERIES_POINTS);
  const ends = Array.from(rolling.ends.subarray(from));
  const betas = Array.from(rolling.beta.subarray(from), (beta) => (Number.isFinite(beta) ? beta : null));
  return {
    security: security.id,
    scatter: { market: Array.from(sample.marketExcess), security: Array.from(sample.securityExcess) },
    rolling: { periods: ends.map((end) => aligned.grid.labels[end]!), betas },
  };
}
