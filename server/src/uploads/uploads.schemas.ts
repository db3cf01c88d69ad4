import { z } from 'zod';
import { slug } from '../contracts/run-spec.fields.js';

/** The form fields beside the file: optionally the spec the file is meant for. */
export const uploadFields = z.strictObject({ spec: slug.optional() });

export const listUploadsQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});
