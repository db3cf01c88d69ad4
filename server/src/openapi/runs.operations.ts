import { createRunRequestSchema, postFailureRequestSchema, postResultsRequestSchema } from '../contracts/ingest.schemas.js';
import { jobIdParams, claimBody, doneBody, failedBody, listJobsQuery } from '../jobs/jobs.schemas.js';
import { listResultsQuery, listRunsQuery, rerunBody, runIdParams, seriesParams } from '../runs/runs.schemas.js';
import { diffQuery, pushSpecBody, revisionParams, specNameParams } from '../specs/specs.schemas.js';
import { z } from 'zod';
import type { ApiOperation } from './api-operation.js';

const shaParams = z.object({ sha256: z.string().regex(/^[0-9a-f]{64}$/) });
const idempotencyKey = (required: boolean) => ({ name: 'Idempotency-Key', required, description: 'Any unique text (a UUID): the same key again answers the first answer and stores nothing more.' });

/** Specs, ingest, runs and jobs. */
export const RUN_OPERATIONS: readonly ApiOperation[] = [
  { method: 'GET', path: '/api/specs', tag: 'specs', summary: 'List specs with their current revision', success: { status: 200, description: '{ items }' } },
  { method: 'GET', path: '/api/specs/:name', tag: 'specs', summary: 'A spec with its current revision (text and parsed spec)', params: specNameParams, success: { status: 200, description: 'The spec' } },
  { method: 'GET', path: '/api/specs/:name/revisions', tag: 'specs', summary: 'Revisions of a spec, newest first', params: specNameParams, success: { status: 200, description: '{ items }' } },
  { method: 'GET', path: '/api/specs/:name/revisions/:number', tag: 'specs', summary: 'One revision: text, sha256, author, time, parsed spec', params: revisionParams, success: { status: 200, description: 'The revision' } },
  { method: 'GET', path: '/api/specs/:name/revisions/:number/diff', tag: 'specs', summary: 'Unified diff from another revision (default: the one before)', params: revisionParams, query: diffQuery, success: { status: 200, description: '{ name, from, to, diff }' } },
  { method: 'POST', path: '/api/specs', tag: 'specs', summary: 'Push a spec text; a new revision when the text changed', body: pushSpecBody, success: { status: 201, description: 'A new revision (200 when the text equals the current one)' }, errors: ['SPEC_INVALID'] },
  { method: 'POST', path: '/api/runs', tag: 'ingest', summary: 'Create a run (received) and learn which inputs to upload', body: createRunRequestSchema, headers: [idempotencyKey(false)], success: { status: 201, description: '{ runId, attempt, state, missingInputs }' }, errors: ['SPEC_UNKNOWN'] },
  { method: 'PUT', path: '/api/inputs/:sha256', tag: 'ingest', summary: 'Upload an input file\'s bytes by checksum (verified)', params: shaParams, body: 'bytes', success: { status: 201, description: 'Stored (200 when already held)' }, errors: ['PAYLOAD_TOO_LARGE'] },
  { method: 'GET', path: '/api/inputs/:sha256', tag: 'ingest', summary: 'Fetch an input of a run or an upload by checksum', params: shaParams, success: { status: 200, description: 'The file\'s bytes', produces: 'bytes' } },
  { method: 'POST', path: '/api/runs/:id/computing', tag: 'ingest', summary: 'Mark a run computing (every input must be uploaded)', params: runIdParams, success: { status: 200, description: '{ runId, attempt, state }' }, errors: ['RUN_NOT_FOUND', 'RUN_STATE_CONFLICT'] },
  { method: 'POST', path: '/api/runs/:id/results', tag: 'ingest', summary: 'Post every security\'s results in one transaction → in-review', params: runIdParams, body: postResultsRequestSchema, headers: [idempotencyKey(true)], success: { status: 200, description: '{ runId, attempt, state, securityCount }' }, errors: ['RUN_NOT_FOUND', 'RUN_STATE_CONFLICT', 'PAYLOAD_TOO_LARGE'] },
  { method: 'POST', path: '/api/runs/:id/failure', tag: 'ingest', summary: 'Post a run\'s failure (code, message) → failed', params: runIdParams, body: postFailureRequestSchema, headers: [idempotencyKey(false)], success: { status: 200, description: '{ runId, attempt, state }' }, errors: ['RUN_NOT_FOUND', 'RUN_STATE_CONFLICT'] },
  { method: 'GET', path: '/api/runs', tag: 'runs', summary: 'List runs: filter by state, spec and as-of range; sort; pages', query: listRunsQuery, success: { status: 200, description: '{ items, page, pageSize, total }' } },
  { method: 'GET', path: '/api/runs/:id', tag: 'runs', summary: 'A run with inputs, attempts, fingerprint, release and the comparison with the spec\'s last released run', params: runIdParams, success: { status: 200, description: 'The run' }, errors: ['RUN_NOT_FOUND'] },
  { method: 'GET', path: '/api/runs/:id/results', tag: 'runs', summary: 'Per-security results, paged', params: runIdParams, query: listResultsQuery, success: { status: 200, description: '{ items, page, pageSize, total, attempt }' }, errors: ['RUN_NOT_FOUND'] },
  { method: 'GET', path: '/api/runs/:id/series/:security', tag: 'runs', summary: 'Scatter points with the fitted line, and rolling betas, of one security', params: seriesParams, success: { status: 200, description: 'The series' }, errors: ['RUN_NOT_FOUND'] },
  { method: 'GET', path: '/api/runs/:id/sml', tag: 'runs', summary: 'Security market line and each security\'s point on it', params: runIdParams, success: { status: 200, description: '{ line, beta, points }' }, errors: ['RUN_NOT_FOUND'] },
  { method: 'GET', path: '/api/runs/:id/csv', tag: 'runs', summary: 'The result CSV, byte-identical to clino run --out', params: runIdParams, success: { status: 200, description: 'CSV; header x-clino-fingerprint-sha256', produces: 'csv' }, errors: ['RUN_NOT_FOUND', 'RUN_STATE_CONFLICT'] },
  { method: 'POST', path: '/api/runs/:id/rerun', tag: 'runs', summary: 'Rerun an in-review or failed run: a new attempt as a job', params: runIdParams, body: rerunBody, success: { status: 202, description: '{ runId, attempt, jobId, state }' }, errors: ['RUN_NOT_FOUND', 'RUN_STATE_CONFLICT'] },
  { method: 'GET', path: '/api/jobs', tag: 'jobs', summary: 'The job queue, newest first', query: listJobsQuery, success: { status: 200, description: '{ items, page, pageSize, total }' } },
  { method: 'POST', path: '/api/jobs/claim', tag: 'jobs', summary: 'Claim the oldest queued job with a lease (SKIP LOCKED)', body: claimBody, success: { status: 200, description: 'The job (204 when none is queued)' } },
  { method: 'POST', path: '/api/jobs/:id/done', tag: 'jobs', summary: 'Finish a claimed job', params: jobIdParams, body: doneBody, success: { status: 200, description: 'The job' }, errors: ['RUN_STATE_CONFLICT'] },
  { method: 'POST', path: '/api/jobs/:id/failed', tag: 'jobs', summary: 'Fail a claimed job (a rerun\'s attempt fails with it)', params: jobIdParams, body: failedBody, success: { status: 200, description: 'The job' }, errors: ['RUN_STATE_CONFLICT'] },
  { method: 'GET', path: '/api/jobs/:id/spec', tag: 'jobs', summary: 'The spec revision a job computes with', params: jobIdParams, success: { status: 200, description: '{ jobId, specName, revision, sha256, text }' } },
];
