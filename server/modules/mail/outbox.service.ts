import type { DataSource } from 'typeorm';
import {
  outboxStatuses,
  type OutboxMessageDto,
  type OutboxMessageListQuery,
  type OutboxMessageSummaryDto,
  type OutboxStatus,
  type OutboxStatusDto,
  type PageDto,
  type ReceivedMessageDto,
  type ReceivedMessageListQuery,
  type ReceivedMessageSummaryDto,
} from '@shared/schemas/mail';
import { notFound } from '../../http/errors';
import type { MailDelivery } from './mail-delivery';
import { OutboxMessage } from './outbox-message.entity';
import { ReceivedMessage } from './received-message.entity';

/**
 * How this process delivers mail and how many messages are in each state.
 *
 * @param dataSource the data source
 * @param delivery the delivery worker, if one runs
 * @returns the status DTO
 */
export async function getOutboxStatus(dataSource: DataSource, delivery: MailDelivery | null): Promise<OutboxStatusDto> {
  const rows = (await dataSource.query(`SELECT status, COUNT(*) AS n FROM outbox_messages GROUP BY status`)) as { status: OutboxStatus; n: number }[];
  const counts = Object.fromEntries(outboxStatuses.map((status) => [status, 0])) as Record<OutboxStatus, number>;
  for (const row of rows) counts[row.status] = row.n;
  const [{ n: received }] = (await dataSource.query(`SELECT COUNT(*) AS n FROM received_messages`)) as { n: number }[];
  const target = delivery?.target;
  return {
    mode: delivery?.mode ?? 'none',
    fakeServer: target?.kind === 'fake' ? { host: target.host, port: target.port } : null,
    counts,
    received,
  };
}

/**
 * The send log, newest first.
 *
 * @param dataSource the data source
 * @param query status and kind filters, page
 * @returns one page
 */
export async function listOutboxMessages(dataSource: DataSource, query: OutboxMessageListQuery): Promise<PageDto<OutboxMessageSummaryDto>> {
  const [rows, total] = await dataSource.getRepository(OutboxMessage).findAndCount({
    where: { ...(query.status ? { status: query.status } : {}), ...(query.kind ? { kind: query.kind } : {}) },
    order: { id: 'DESC' },
    skip: (query.page - 1) * query.pageSize,
    take: query.pageSize,
  });
  return { rows: rows.map(toOutboxSummary), total, page: query.page, pageSize: query.pageSize };
}

/**
 * One entry of the send log with what was sent; 404 when there is none.
 *
 * @param dataSource the data source
 * @param id the message id
 * @returns the DTO
 */
export async function getOutboxMessage(dataSource: DataSource, id: number): Promise<OutboxMessageDto> {
  const message = await dataSource.getRepository(OutboxMessage).findOneBy({ id });
  if (!message) throw notFound('The message');
  return {
    ...toOutboxSummary(message),
    from: message.fromAddress,
    text: message.text,
    html: message.html,
    headers: message.headers,
    smtpResponse: message.smtpResponse,
  };
}

/**
 * Messages the local fake SMTP server received, newest first.
 *
 * @param dataSource the data source
 * @param query page
 * @returns one page
 */
export async function listReceivedMessages(dataSource: DataSource, query: ReceivedMessageListQuery): Promise<PageDto<ReceivedMessageSummaryDto>> {
  const [rows, total] = await dataSource.getRepository(ReceivedMessage).findAndCount({
    select: { id: true, messageId: true, fromHeader: true, envelopeTo: true, subject: true, sizeBytes: true, receivedAt: true },
    order: { id: 'DESC' },
    skip: (query.page - 1) * query.pageSize,
    take: query.pageSize,
  });
  return { rows: rows.map(toReceivedSummary), total, page: query.page, pageSize: query.pageSize };
}

/**
 * One received message with its parts and headers; 404 when there is none.
 *
 * @param dataSource the data source
 * @param id the received message id
 * @returns the DTO
 */
export async function getReceivedMessage(dataSource: DataSource, id: number): Promise<ReceivedMessageDto> {
  const message = await dataSource.getRepository(ReceivedMessage).findOneBy({ id });
  if (!message) throw notFound('The message');
  return { ...toReceivedSummary(message), text: message.text, html: message.html, headers: message.headers };
}

function toOutboxSummary(message: OutboxMessage): OutboxMessageSummaryDto {
  return {
    id: message.id,
    kind: message.kind,
    to: message.toAddress,
    toName: message.toName,
    subject: message.subject,
    status: message.status,
    attempts: message.attempts,
    lastError: message.lastError,
    nextAttemptAt: message.nextAttemptAt?.toISOString() ?? null,
    sentAt: message.sentAt?.toISOString() ?? null,
    messageId: message.messageId,
    digestRunId: message.digestRunId,
    createdAt: message.createdAt.toISOString(),
  };
}

function toReceivedSummary(message: ReceivedMessage): ReceivedMessageSummaryDto {
  return {
    id: message.id,
    messageId: message.messageId,
    from: message.fromHeader,
    to: message.envelopeTo,
    subject: message.subject,
    sizeBytes: message.sizeBytes,
    receivedAt: message.receivedAt.toISOString(),
  };
}
