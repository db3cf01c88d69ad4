import { z } from 'zod';
import { ACTOR_KINDS, type ActorKind } from './audit-event.model.js';

const instant = z.iso.datetime({ offset: true });

/** GET /api/audit filters. `action` ending in `.*` matches every action of that entity (`person.*`). */
export const auditQuerySchema = z
  .strictObject({
    actor: z.string().trim().min(1).max(200).optional(),
    actorKind: z.enum(ACTOR_KINDS).optional(),
    action: z.string().trim().regex(/^[a-z0-9-]+(\.[a-z0-9-]+)*(\.\*)?$/, 'a dotted action such as person.create, or person.* for all of them').optional(),
    entityType: z.string().trim().min(1).max(64).optional(),
    entityId: z.string().trim().min(1).max(100).optional(),
    from: instant.optional().describe('inclusive, ISO 8601 with offset'),
    to: instant.optional().describe('exclusive, ISO 8601 with offset'),
    page: z.coerce.number().int().min(1).max(1_000_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(50),
  })
  .refine((q) => !q.from || !q.to || Date.parse(q.from) < Date.parse(q.to), { message: 'from must be before to', path: ['to'] });

export type AuditQuery = z.output<typeof auditQuerySchema>;

export interface AuditEventDto {
  id: number;
  occurredAt: string;
  actor: { kind: ActorKind; id: number | null; name: string };
  action: string;
  entity: { type: string; id: string | null };
  before: unknown;
  after: unknown;
  requestId: string | null;
}

export interface AuditPageDto {
  items: AuditEventDto[];
  page: number;
  pageSize: number;
  total: number;
}
