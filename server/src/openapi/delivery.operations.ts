import { z } from 'zod';
import { distributionListBody, listIdParams } from '../releases/distribution-lists.schemas.js';
import { listReleasesQuery, releaseBody, releaseIdParams } from '../releases/releases.schemas.js';
import { runIdParams } from '../runs/runs.schemas.js';
import { listUploadsQuery } from '../uploads/uploads.schemas.js';
import type { ApiOperation } from './api-operation.js';

const mailId = z.object({ id: z.string().regex(/^[1-9]\d{0,9}$/) });
const attachmentParams = z.object({ id: z.string().regex(/^[1-9]\d{0,9}$/), index: z.string().regex(/^\d{1,4}$/) });
const page = z.object({ page: z.coerce.number().int().min(1).default(1), pageSize: z.coerce.number().int().min(1).max(500).default(50) });

/** Uploads, releases, distribution lists, the Mailroom and this document. */
export const DELIVERY_OPERATIONS: readonly ApiOperation[] = [
  { method: 'POST', path: '/api/uploads', tag: 'uploads', summary: 'Upload a CSV file (multipart field `file`, optional field `spec`): stored, then an upload job', body: 'multipart', success: { status: 201, description: 'The upload with its job' }, errors: ['PAYLOAD_TOO_LARGE'] },
  { method: 'GET', path: '/api/uploads', tag: 'uploads', summary: 'Uploads, newest first, with their job\'s state', query: listUploadsQuery, success: { status: 200, description: '{ items, page, pageSize, total }' } },
  { method: 'POST', path: '/api/runs/:id/release', tag: 'releases', summary: 'Release an in-review run: store its CSV, supersede the earlier release, mail the distribution list', params: runIdParams, body: releaseBody, success: { status: 201, description: 'The release with its mail state' }, errors: ['RUN_NOT_FOUND', 'RUN_NOT_RELEASABLE', 'FOUR_EYES'] },
  { method: 'GET', path: '/api/releases', tag: 'releases', summary: 'Releases, newest first', query: listReleasesQuery, success: { status: 200, description: '{ items, page, pageSize, total }' } },
  { method: 'POST', path: '/api/releases/:id/resend', tag: 'releases', summary: 'Mail a release again (after a failed send)', params: releaseIdParams, success: { status: 200, description: 'The release with its mail state' } },
  { method: 'GET', path: '/api/releases/:id/csv', tag: 'releases', summary: 'The released CSV, exactly as mailed', params: releaseIdParams, success: { status: 200, description: 'CSV', produces: 'csv' } },
  { method: 'GET', path: '/api/distribution-lists', tag: 'releases', summary: 'Distribution lists with their recipients', success: { status: 200, description: '{ items }' } },
  { method: 'POST', path: '/api/distribution-lists', tag: 'releases', summary: 'Create a distribution list', body: distributionListBody, success: { status: 201, description: 'The list' } },
  { method: 'PUT', path: '/api/distribution-lists/:id', tag: 'releases', summary: 'Replace a distribution list\'s name, description and recipients', params: listIdParams, body: distributionListBody, success: { status: 200, description: 'The list' } },
  { method: 'GET', path: '/api/mail', tag: 'mailroom', summary: 'Messages the local mail sink received, newest first', query: page, success: { status: 200, description: '{ items, page, pageSize, total }' } },
  { method: 'GET', path: '/api/mail/:id', tag: 'mailroom', summary: 'One message: envelope, headers, text, attachments', params: mailId, success: { status: 200, description: 'The message' } },
  { method: 'GET', path: '/api/mail/:id/attachments/:index', tag: 'mailroom', summary: 'An attachment\'s bytes', params: attachmentParams, success: { status: 200, description: 'The attachment', produces: 'bytes' } },
  { method: 'GET', path: '/api/docs', tag: 'docs', summary: 'This OpenAPI document', success: { status: 200, description: 'OpenAPI 3.1 JSON' } },
];
