import type { DataSource } from 'typeorm';
import type { AuditListDto, ListAuditQuery } from '@shared/schemas/audit';
import { isoFromSqlite } from '../../sqlite-datetime';

interface AuditRecord {
  id: number;
  at: string;
  actor_id: number | null;
  actor_name: string | null;
  entity_type: string;
  entity_id: number;
  campaign_id: number | null;
  action: string;
  before: string | null;
  after: string | null;
}

/**
 * One page of audit events, newest first, with the actor's name; filtered by entity type, entity id
 * and campaign on the indexes `(entity_type, entity_id, at)`, `(campaign_id, at)` and `(at)`.
 */
export async function listAuditEvents(dataSource: DataSource, query: ListAuditQuery): Promise<AuditListDto> {
  const where: string[] = [];
  const parameters: unknown[] = [];
  if (query.entityType !== undefined) {
    where.push('a.entity_type = ?');
    parameters.push(query.entityType);
  }
  if (query.entityId !== undefined) {
    where.push('a.entity_id = ?');
    parameters.push(query.entityId);
  }
  if (query.campaignId !== undefined) {
    where.push('a.campaign_id = ?');
    parameters.push(query.campaignId);
  }
  const whereSql = where.length === 0 ? '' : `WHERE ${where.join(' AND ')}`;
  const [{ total }] = await dataSource.query(`SELECT COUNT(*) AS total FROM audit_events a ${whereSql}`, parameters);
  const records: AuditRecord[] = await dataSource.query(
    `SELECT a.id, a.at, a.actor_id, u.name AS actor_name, a.entity_type, a.entity_id, a.campaign_id, a.action, a.before, a.after
       FROM audit_events a LEFT JOIN users u ON u.id = a.actor_id
       ${whereSql}
      ORDER BY a.at DESC, a.id DESC
      LIMIT ? OFFSET ?`,
    [...parameters, query.pageSize, (query.page - 1) * query.pageSize],
  );
  return {
    rows: records.map((record) => ({
      id: record.id,
      at: isoFromSqlite(record.at),
      actor: record.actor_id === null ? null : { id: record.actor_id, name: record.actor_name ?? '' },
      entityType: record.entity_type,
      entityId: record.entity_id,
      campaignId: record.campaign_id,
      action: record.action,
      before: record.before === null ? null : JSON.parse(record.before),
      after: record.after === null ? null : JSON.parse(record.after),
    })),
    total: Number(total),
    page: query.page,
    pageSize: query.pageSize,
  };
}
