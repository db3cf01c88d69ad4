import { z } from 'zod';
import { calendarDate } from '../contracts/run-spec.fields.js';

export const releaseIdParams = z.object({ id: z.string().regex(/^[1-9]\d{0,9}$/, 'a release id').transform(Number) });

/** The distribution list defaults to the spec's `report.distributionList`. */
export const releaseBody = z
  .strictObject({
    note: z.string().max(4000).default(''),
    distributionList: z.string().min(1).max(100).optional(),
  })
  .prefault({});

export const listReleasesQuery = z.object({
  spec: z.string().min(1).max(100).optional(),
  asOfFrom: calendarDate.optional(),
  asOfTo: calendarDate.optional(),
  current: z.enum(['true', 'false']).transform((v) => v === 'true').optional().describe('true: only releases not superseded.'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});

export type ReleaseRequest = z.output<typeof releaseBody>;
export type ListReleasesQuery = z.output<typeof listReleasesQuery>;
