import type { z } from 'zod';

/** How an operation answers on success: JSON (the default), a CSV download, raw bytes, or nothing. */
export type Produces = 'json' | 'csv' | 'bytes' | 'empty';

/** One documented route: what the OpenAPI document says about it. Roles come from the role matrix. */
export interface ApiOperation {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Express form, as in the role matrix: `/api/runs/:id`. */
  path: string;
  tag: string;
  summary: string;
  description?: string;
  params?: z.ZodType;
  query?: z.ZodType;
  /** A zod schema for JSON, or `multipart` (a file upload) or `bytes` (the raw body). */
  body?: z.ZodType | 'multipart' | 'bytes';
  headers?: { name: string; required: boolean; description: string }[];
  /** Success status and its meaning; more statuses may be added. */
  success: { status: number; description: string; produces?: Produces };
  /** Error codes this operation answers beyond the ones every route may answer. */
  errors?: string[];
}
