import { LessThan, type DataSource, type EntityManager, type FindOptionsWhere } from 'typeorm';
import { outboxStatuses, type OutboxStatus, type PageDto } from '@shared/schemas/mail';
import type { DigestPreviewDto, DigestRunDto, DigestRunListQuery, DigestRunSummaryDto } from '@shared/schemas/digest';
import { HttpError, notFound } from '../../http/errors';
import { isoFromSqlite } from '../../sqlite-datetime';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { enqueueMail } from '../mail/enqueue-mail';
import type { MailOptions } from '../mail/mail-options';
import { buildDigestContent, type DigestContentOptions } from './digest-content';
import { renderDigest } from './digest-render';
import { DigestRun } from './digest-run.entity';
import { weekKeyOf } from './digest-schedule';
import { loadDigestSettings } from './digest-settings';
import { currentRecipients, requireCampaign } from './digest-subscriptions';

/** Audit entity type of digest runs started by a person. */
export const digestRunAuditType = 'digest-run';

/** Client path of the unsubscribe page; the token follows as `?token=`. */
export const unsubscribePagePath = '/unsubscribe';

/**
 * The scheduled digests of one slot: for every active campaign with recipients, claims the run of
 * (campaign, week) and generates and queues it. A run that exists already is skipped, or, if a restart
 * interrupted it while `preparing`, finished; so each campaign gets one digest per week.
 *
 * @param dataSource the data source
 * @param mail mail options
 * @param slot the scheduled slot
 * @returns the ids of the runs this call completed
 */
export async function runScheduledDigests(dataSource: DataSource, mail: MailOptions, slot: Date): Promise<number[]> {
  const weekKey = weekKeyOf(slot, mail.timezone);
  const campaigns = (await dataSource.query(`SELECT id FROM campaigns WHERE status = 'active' ORDER BY id`)) as { id: number }[];
  const completed: number[] = [];
  for (const campaign of campaigns) {
    const runId = await claimScheduledRun(dataSource, campaign.id, weekKey, slot);
    if (runId !== null && (await completeDigestRun(dataSource, mail, runId))) completed.push(runId);
  }
  if (completed.length > 0) mail.delivery?.kick();
  return completed;
}

/**
 * Finishes every run a restart left `preparing`: they are generated and queued now, once.
 *
 * @param dataSource the data source
 * @param mail mail options
 * @returns the ids of the runs completed
 */
export async function resumeInterruptedDigestRuns(dataSource: DataSource, mail: MailOptions): Promise<number[]> {
  const runs = await dataSource.getRepository(DigestRun).find({ where: { status: 'preparing' }, order: { id: 'ASC' } });
  const completed: number[] = [];
  for (const run of runs) if (await completeDigestRun(dataSource, mail, run.id)) completed.push(run.id);
  if (completed.length > 0) mail.delivery?.kick();
  return completed;
}

/**
 * "Send now": a manual run of one campaign's digest to its current recipients, outside the weekly
 * schedule (the scheduled run of the week still happens). 409 `no_recipients` when nobody would get it.
 *
 * @param dataSource the data source
 * @param mail mail options
 * @param campaignId the campaign; 404 when unknown
 * @param actorId the lead or admin
 * @returns the run
 */
export async function sendDigestNow(dataSource: DataSource, mail: MailOptions, campaignId: number, actorId: number): Promise<DigestRunSummaryDto> {
  const runId = await writeTransaction(dataSource, async (manager) => {
    await requireCampaign(manager, campaignId);
    const recipients = await currentRecipients(manager, campaignId, { createLeadRow: false });
    if (recipients.length === 0) {
      throw new HttpError(409, 'no_recipients', 'Nobody receives this campaign’s digest yet. Subscribe first (the campaign lead is subscribed by default).');
    }
    const repository = manager.getRepository(DigestRun);
    const run = await repository.save(
      repository.create({ campaignId, kind: 'manual', weekKey: null, status: 'preparing', scheduledFor: new Date(), triggeredById: actorId, subject: null, snapshot: null, recipientCount: 0, completedAt: null }),
    );
    await recordAudit(manager, { actorId, entityType: digestRunAuditType, entityId: run.id, campaignId, action: 'send', after: { id: run.id, kind: 'manual' } });
    return run.id;
  });
  await completeDigestRun(dataSource, mail, runId);
  mail.delivery?.kick();
  return getDigestRunSummary(dataSource, runId);
}

/**
 * Claims the scheduled run of a campaign and week. Returns its id when this caller should generate it: a
 * new claim, or one a restart left `preparing`; null when the week's digest was already sent or nobody
 * would receive it.
 *
 * @param dataSource the data source
 * @param campaignId the campaign
 * @param weekKey the week (see weekKeyOf)
 * @param slot the scheduled slot
 * @returns the run id, or null
 */
export async function claimScheduledRun(dataSource: DataSource, campaignId: number, weekKey: string, slot: Date): Promise<number | null> {
  try {
    return await writeTransaction(dataSource, async (manager) => {
      const repository = manager.getRepository(DigestRun);
      const existing = await repository.findOneBy({ campaignId, weekKey });
      if (existing) return existing.status === 'preparing' ? existing.id : null;
      if ((await currentRecipients(manager, campaignId, { createLeadRow: false })).length === 0) return null;
      const run = await repository.save(
        repository.create({ campaignId, kind: 'scheduled', weekKey, status: 'preparing', scheduledFor: slot, triggeredById: null, subject: null, snapshot: null, recipientCount: 0, completedAt: null }),
      );
      return run.id;
    });
  } catch (error) {
    // Another process claimed the same (campaign, week) between the read and the insert: the unique key decides.
    if (String((error as Error)?.message).includes('UNIQUE constraint failed')) return null;
    throw error;
  }
}

/**
 * Generates a claimed run's content and, in one transaction, queues one message per current recipient
 * and marks the run `queued` with its snapshot. A run that is no longer `preparing` is left alone, so
 * resuming twice never sends twice.
 *
 * @param dataSource the data source
 * @param mail mail options
 * @param runId the run
 * @returns whether this call completed it
 */
export async function completeDigestRun(dataSource: DataSource, mail: MailOptions, runId: number): Promise<boolean> {
  const run = await dataSource.getRepository(DigestRun).findOneBy({ id: runId });
  if (!run || run.status !== 'preparing') return false;
  const content = await buildDigestContent(dataSource.manager, run.campaignId, await contentOptions(dataSource.manager, mail, run.campaignId, run.scheduledFor, run.id));
  if (!content) return false;
  return writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(DigestRun);
    const current = await repository.findOneBy({ id: runId });
    if (!current || current.status !== 'preparing') return false;
    const recipients = await currentRecipients(manager, run.campaignId, { createLeadRow: true });
    let subject = '';
    for (const recipient of recipients) {
      const token = recipient.unsubscribeToken ?? '';
      const message = renderDigest(content, mail.publicUrl, { name: recipient.name, unsubscribeUrl: `${mail.publicUrl}${unsubscribePagePath}?token=${token}`, asLead: recipient.isLead });
      subject = message.subject;
      await enqueueMail(manager, {
        kind: 'digest',
        to: recipient.email,
        toName: recipient.name,
        from: mail.from,
        ...message,
        // RFC 2369 and RFC 8058: mail clients offer an unsubscribe button that POSTs here without a session.
        headers: {
          'List-Unsubscribe': `<${mail.publicUrl}/api/digests/unsubscribe?token=${token}>`,
          'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
          'List-Id': `Kcatalog weekly ranking, campaign ${run.campaignId} <campaign-${run.campaignId}.digests.kcatalog.invalid>`,
        },
        digestRunId: runId,
      });
    }
    current.status = 'queued';
    current.snapshot = content;
    current.subject = subject || renderDigest(content, mail.publicUrl, { name: '', unsubscribeUrl: null, asLead: false }).subject;
    current.recipientCount = recipients.length;
    current.completedAt = new Date();
    await repository.save(current);
    return true;
  });
}

/**
 * The next digest of a campaign as the signed-in user would receive it now (the preview writes nothing).
 *
 * @param dataSource the data source
 * @param mail mail options
 * @param campaignId the campaign; 404 when unknown
 * @param user the signed-in user
 * @returns subject, HTML, text, content and the number of recipients
 */
export async function previewDigest(dataSource: DataSource, mail: MailOptions, campaignId: number, user: { id: number; name: string }): Promise<DigestPreviewDto> {
  const leadId = await requireCampaign(dataSource.manager, campaignId);
  const content = await buildDigestContent(dataSource.manager, campaignId, await contentOptions(dataSource.manager, mail, campaignId, new Date(), null));
  if (!content) throw notFound('The campaign');
  const recipients = await currentRecipients(dataSource.manager, campaignId, { createLeadRow: false });
  const mine = recipients.find((recipient) => recipient.userId === user.id);
  const unsubscribeUrl = mine?.unsubscribeToken ? `${mail.publicUrl}${unsubscribePagePath}?token=${mine.unsubscribeToken}` : null;
  const message = renderDigest(content, mail.publicUrl, { name: user.name, unsubscribeUrl, asLead: leadId === user.id });
  return { ...message, content, recipientCount: recipients.length };
}

async function contentOptions(manager: EntityManager, mail: MailOptions, campaignId: number, periodEnd: Date, runId: number | null): Promise<DigestContentOptions> {
  const settings = await loadDigestSettings(manager, campaignId);
  const where: FindOptionsWhere<DigestRun> = { campaignId, status: 'queued', ...(runId === null ? {} : { id: LessThan(runId) }) };
  const previous = await manager.getRepository(DigestRun).findOne({ where, order: { id: 'DESC' } });
  return {
    reviewStates: settings.reviewStates,
    topCount: settings.topCount,
    periodEnd,
    timezone: mail.timezone,
    previous:
      previous?.snapshot
        ? { runId: previous.id, at: previous.scheduledFor, ranking: previous.snapshot.ranking.map((entry) => ({ variantId: entry.variantId, rank: entry.rank })) }
        : null,
  };
}

interface RunRow {
  id: number;
  campaign_id: number;
  campaign_name: string;
  kind: DigestRunSummaryDto['kind'];
  week_key: string | null;
  status: DigestRunSummaryDto['status'];
  scheduled_for: string;
  subject: string | null;
  triggered_by_id: number | null;
  triggered_by_name: string | null;
  recipient_count: number;
  created_at: string;
  completed_at: string | null;
}

const runSelect = `SELECT r.id, r.campaign_id, c.name AS campaign_name, r.kind, r.week_key, r.status, r.scheduled_for, r.subject,
       r.triggered_by_id, u.name AS triggered_by_name, r.recipient_count, r.created_at, r.completed_at
  FROM digest_runs r JOIN campaigns c ON c.id = r.campaign_id LEFT JOIN users u ON u.id = r.triggered_by_id`;

/**
 * Past digest runs, newest first, optionally of one campaign, with how their messages stand.
 *
 * @param dataSource the data source
 * @param query campaign filter and page
 * @returns one page
 */
export async function listDigestRuns(dataSource: DataSource, query: DigestRunListQuery): Promise<PageDto<DigestRunSummaryDto>> {
  const where = query.campaignId === undefined ? '' : 'WHERE r.campaign_id = ?';
  const parameters = query.campaignId === undefined ? [] : [query.campaignId];
  const [{ n }] = (await dataSource.query(`SELECT COUNT(*) AS n FROM digest_runs r ${where}`, parameters)) as { n: number }[];
  const rows = (await dataSource.query(`${runSelect} ${where} ORDER BY r.id DESC LIMIT ? OFFSET ?`, [
    ...parameters,
    query.pageSize,
    (query.page - 1) * query.pageSize,
  ])) as RunRow[];
  const delivery = await deliveryCounts(dataSource.manager, rows.map((row) => row.id));
  return { rows: rows.map((row) => toRunSummary(row, delivery.get(row.id))), total: n, page: query.page, pageSize: query.pageSize };
}

/**
 * One run with its recipients (only for those who may manage digests) and its content snapshot rendered
 * again, without anyone's unsubscribe link.
 *
 * @param dataSource the data source
 * @param mail mail options
 * @param id the run; 404 when unknown
 * @param withRecipients whether to list the recipients' addresses
 * @returns the run DTO
 */
export async function getDigestRun(dataSource: DataSource, mail: MailOptions, id: number, withRecipients: boolean): Promise<DigestRunDto> {
  const summary = await getDigestRunSummary(dataSource, id);
  const run = await dataSource.getRepository(DigestRun).findOneByOrFail({ id });
  const recipients = withRecipients
    ? ((await dataSource.query(
        `SELECT id, to_address, to_name, status, sent_at, last_error FROM outbox_messages WHERE digest_run_id = ? ORDER BY to_name, id`,
        [id],
      )) as { id: number; to_address: string; to_name: string | null; status: OutboxStatus; sent_at: string | null; last_error: string | null }[])
    : [];
  const rendered = run.snapshot ? renderDigest(run.snapshot, mail.publicUrl, { name: '', unsubscribeUrl: null, asLead: false }) : null;
  return {
    ...summary,
    recipients: recipients.map((row) => ({
      email: row.to_address,
      name: row.to_name,
      status: row.status,
      sentAt: row.sent_at === null ? null : isoFromSqlite(row.sent_at),
      lastError: row.last_error,
      outboxMessageId: row.id,
    })),
    content: run.snapshot,
    html: rendered?.html ?? null,
    text: rendered?.text ?? null,
  };
}

async function getDigestRunSummary(dataSource: DataSource, id: number): Promise<DigestRunSummaryDto> {
  const [row] = (await dataSource.query(`${runSelect} WHERE r.id = ?`, [id])) as RunRow[];
  if (!row) throw notFound('The digest run');
  return toRunSummary(row, (await deliveryCounts(dataSource.manager, [id])).get(id));
}

async function deliveryCounts(manager: EntityManager, runIds: readonly number[]): Promise<Map<number, Record<OutboxStatus, number>>> {
  const counts = new Map<number, Record<OutboxStatus, number>>();
  if (runIds.length === 0) return counts;
  const rows = (await manager.query(
    `SELECT digest_run_id, status, COUNT(*) AS n FROM outbox_messages WHERE digest_run_id IN (${runIds.map(() => '?').join(', ')}) GROUP BY digest_run_id, status`,
    [...runIds],
  )) as { digest_run_id: number; status: OutboxStatus; n: number }[];
  for (const row of rows) {
    const entry = counts.get(row.digest_run_id) ?? emptyCounts();
    entry[row.status] = row.n;
    counts.set(row.digest_run_id, entry);
  }
  return counts;
}

function emptyCounts(): Record<OutboxStatus, number> {
  return Object.fromEntries(outboxStatuses.map((status) => [status, 0])) as Record<OutboxStatus, number>;
}

function toRunSummary(row: RunRow, delivery: Record<OutboxStatus, number> | undefined): DigestRunSummaryDto {
  return {
    id: row.id,
    campaignId: row.campaign_id,
    campaignName: row.campaign_name,
    kind: row.kind,
    weekKey: row.week_key,
    status: row.status,
    scheduledFor: isoFromSqlite(row.scheduled_for),
    subject: row.subject,
    triggeredBy: row.triggered_by_id === null ? null : { id: row.triggered_by_id, name: row.triggered_by_name ?? '' },
    recipientCount: row.recipient_count,
    delivery: delivery ?? emptyCounts(),
    createdAt: isoFromSqlite(row.created_at),
    completedAt: row.completed_at === null ? null : isoFromSqlite(row.completed_at),
  };
}
