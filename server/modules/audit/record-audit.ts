import type { EntityManager } from 'typeorm';
import { AuditEvent } from './audit-event.entity';

export interface AuditEntry {
  actorId: number | null;
  entityType: string;
  entityId: number;
  campaignId?: number | null;
  action: string;
  before?: unknown;
  after?: unknown;
}

/** Writes an audit event inside the caller's transaction, so the change and its record land together. */
export async function recordAudit(manager: EntityManager, entry: AuditEntry): Promise<void> {
  await manager.insert(AuditEvent, {
    actorId: entry.actorId,
    entityType: entry.entityType,
    entityId: entry.entityId,
    campaignId: entry.campaignId ?? null,
    action: entry.action,
    before: entry.before === undefined ? null : JSON.stringify(entry.before),
    after: entry.after === undefined ? null : JSON.stringify(entry.after),
  });
}
