import { fingerprintFileName } from '../contracts/result-fingerprint.js';
import { RELEASE_CAUTIONS } from './release-cautions.js';

export interface ReleaseFacts {
  releaseId: number;
  runId: number;
  attempt: number;
  specName: string;
  specRevision: number;
  asOf: string;
  securityCount: number;
  releasedByName: string;
  releasedAt: Date;
  note: string;
  csvName: string;
  csvSha256: string;
  fingerprint: string;
  supersedes: number[];
}

export interface ReleaseMessage {
  subject: string;
  text: string;
  fingerprintName: string;
}

/** The release mail's subject and plain-text body: the facts, the fingerprint, then the cautions. */
export function composeReleaseMessage(facts: ReleaseFacts): ReleaseMessage {
  const fingerprintName = fingerprintFileName(facts.csvName);
  const lines = [
    `Clinometer release ${facts.releaseId}: ${facts.specName} as of ${facts.asOf}`,
    '',
    `Spec:         ${facts.specName}, revision ${facts.specRevision}`,
    `As of:        ${facts.asOf}`,
    `Run:          ${facts.runId}, attempt ${facts.attempt}`,
    `Securities:   ${facts.securityCount}`,
    `Released by:  ${facts.releasedByName} at ${facts.releasedAt.toISOString()}`,
    ...(facts.supersedes.length > 0 ? [`Supersedes:   release ${facts.supersedes.join(', ')} of the same spec and as-of date`] : []),
    ...(facts.note ? ['', 'Note:', facts.note] : []),
    '',
    `The attached ${facts.csvName} is the result report (sha256 ${facts.csvSha256}).`,
    `Its fingerprint ties every number to the spec revision and the input files (also attached as ${fingerprintName}):`,
    '',
    ...facts.fingerprint.trimEnd().split('\n').map((line) => `    ${line}`),
    '',
    'Cautions',
    ...RELEASE_CAUTIONS.map((caution) => `- ${caution}`),
    '',
  ];
  return { subject: `Clinometer release: ${facts.specName} as of ${facts.asOf} (run ${facts.runId})`, text: lines.join('\n'), fingerprintName };
}
