import { z } from 'zod';
import { JOB_KINDS, JOB_STATES } from './job.model.js';

export const jobIdParams = z.object({ id: z.string().regex(/^[1-9]\d{0,9}$/, 'a job id').transform(Number) });

/** A worker names itself (host and process, say) so a claim can be traced and finished by its holder only. */
const worker = z.string().min(1).max(100).regex(/^[\x21-\x7e]+$/, 'printable ASCII without spaces, e.g. host-a:4312');

export const claimBody = z.strictObject({
  worker,
  kinds: z.array(z.enum(JOB_KINDS)).min(1).default([...JOB_KINDS]),
  leaseSeconds: z.number().int().min(30).max(3600).default(600),
});

export const doneBody = z.strictObject({ worker, outcome: z.string().max(2000).optional() });

export const failedBody = z.strictObject({
  worker,
  /** A SCREAMING_SNAKE code, ideally one of the shared error codes; a worker's own codes are kept as sent. */
  code: z.string().regex(/^[A-Z][A-Z0-9_]{0,63}$/, 'a SCREAMING_SNAKE error code').default('INTERNAL'),
  message: z.string().min(1).max(2000),
});

export const listJobsQuery = z.object({
  state: z.enum(JOB_STATES).optional(),
  kind: z.enum(JOB_KINDS).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});

export type ClaimRequest = z.output<typeof claimBody>;
export type FailedRequest = z.output<typeof failedBody>;
export type ListJobsQuery = z.output<typeof listJobsQuery>;
