import { Op, type WhereOptions } from 'sequelize';
import { AuditEvent } from './audit-event.model.js';
import type { AuditEventDto, AuditPageDto, AuditQuery } from './audit.schemas.js';

/** JSON columns come back as text from MariaDB (JSON is LONGTEXT there); parse them once here. */
function jsonValue(value: unknown): unknown {
  if (typeof value !== 'string') return value ?? null;
  try {
    return JSON.parse(value) as unknown;
  } catch {
    return value;
  }
}

export function auditEventDto(e: AuditEvent): AuditEventDto {
  return {
    id: Number(e.id),
    occurredAt: e.occurredAt.toISOString(),
    actor: { kind: e.actorKind, id: e.actorId, name: e.actorName },
    action: e.action,
    entity: { type: e.entityType, id: e.entityId },
    before: jsonValue(e.beforeState),
    after: jsonValue(e.afterState),
    requestId: e.requestId,
  };
}

function whereOf(q: AuditQuery): WhereOptions<AuditEvent> {
  const occurredAt = { ...(q.from ? { [Op.gte]: new Date(q.from) } : {}), ...(q.to ? { [Op.lt]: new Date(q.to) } : {}) };
  return {
    ...(q.actor ? { actorName: q.actor } : {}),
    ...(q.actorKind ? { actorKind: q.actorKind } : {}),
    ...(q.action ? { action: q.action.endsWith('.*') ? { [Op.startsWith]: q.action.slice(0, -1) } : q.action } : {}),
    ...(q.entityType ? { entityType: q.entityType } : {}),
    ...(q.entityId ? { entityId: q.entityId } : {}),
    ...(q.from || q.to ? { occurredAt } : {}),
  };
}

/** One page of the audit trail, newest first (ties broken by id, so paging is stable). */
export async function queryAudit(q: AuditQuery): Promise<AuditPageDto> {
  const { rows, count } = await AuditEvent.findAndCountAll({
    where: whereOf(q),
    order: [['occurredAt', 'DESC'], ['id', 'DESC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: rows.map(auditEventDto), page: q.page, pageSize: q.pageSize, total: count };
}
