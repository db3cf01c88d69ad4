// The server's answers about jobs, narrowed from unknown JSON: a claimed job, its spec revision and
// the payloads of rerun and upload jobs.
import { z } from 'zod';
import { sha256Schema } from '../../../server/src/contracts/ingest.schemas.js';

export const claimedJobSchema = z.object({
  id: z.string(),
  kind: z.enum(['rerun', 'upload']),
  payload: z.record(z.string(), z.unknown()),
});

export const jobSpecSchema = z.object({
  jobId: z.string(),
  specName: z.string(),
  revision: z.number().int(),
  sha256: sha256Schema,
  text: z.string(),
});

export const rerunPayloadSchema = z.object({
  runId: z.string(),
  attempt: z.number().int().min(1),
  specName: z.string(),
  specSha256: sha256Schema,
  asOf: z.string(),
  inputs: z.array(z.object({ name: z.string(), sha256: sha256Schema, size: z.number().int() })).min(1),
});

export const uploadPayloadSchema = z.object({
  fileName: z.string().min(1),
  sha256: sha256Schema,
  size: z.number().int(),
  specName: z.string().nullable().optional(),
});

export type ClaimedJob = z.infer<typeof claimedJobSchema>;
export type RerunPayload = z.infer<typeof rerunPayloadSchema>;
export type UploadPayload = z.infer<typeof uploadPayloadSchema>;
