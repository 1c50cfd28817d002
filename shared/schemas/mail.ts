import { z } from 'zod';

/** What a message is for; the Outbox page filters by it. */
export const mailKinds = ['invitation', 'password-reset', 'digest'] as const;
export type MailKind = (typeof mailKinds)[number];

/**
 * Where an outgoing message stands: `queued` waits for its (next) attempt, `sending` is with the SMTP
 * server right now, `sent` was accepted by it, `failed` gave up after the retries or on a permanent refusal.
 */
export const outboxStatuses = ['queued', 'sending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof outboxStatuses)[number];

/**
 * How this installation delivers mail: `fake` to the local fake SMTP server the app started (messages
 * are kept for the Outbox page), `smtp` to a real server, `none` when no delivery runs in this process.
 */
export type MailMode = 'fake' | 'smtp' | 'none';

const page = z.coerce.number({ error: 'must be a whole number from 1' }).int('must be a whole number from 1').min(1, 'must be a whole number from 1').default(1);
const pageSize = z.coerce
  .number({ error: 'must be a whole number from 1 to 200' })
  .int('must be a whole number from 1 to 200')
  .min(1, 'must be a whole number from 1 to 200')
  .max(200, 'must be a whole number from 1 to 200')
  .default(50);

/** Query of GET /api/outbox/messages (the send log). */
export const outboxMessageListQuery = z.object({
  status: z.enum(outboxStatuses, { error: `must be one of ${outboxStatuses.join(', ')}` }).optional(),
  kind: z.enum(mailKinds, { error: `must be one of ${mailKinds.join(', ')}` }).optional(),
  page,
  pageSize,
});
export type OutboxMessageListQuery = z.infer<typeof outboxMessageListQuery>;

/** Query of GET /api/outbox/received. */
export const receivedMessageListQuery = z.object({ page, pageSize });
export type ReceivedMessageListQuery = z.infer<typeof receivedMessageListQuery>;

/** GET /api/outbox: how mail is delivered and how many messages are in each state. */
export interface OutboxStatusDto {
  mode: MailMode;
  /** The local fake SMTP server, in `fake` mode. */
  fakeServer: { host: string; port: number } | null;
  counts: Record<OutboxStatus, number>;
  received: number;
}

/** One entry of the send log. */
export interface OutboxMessageSummaryDto {
  id: number;
  kind: MailKind;
  to: string;
  toName: string | null;
  subject: string;
  status: OutboxStatus;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string | null;
  sentAt: string | null;
  messageId: string;
  digestRunId: number | null;
  createdAt: string;
}

/** One entry of the send log with what was sent. */
export interface OutboxMessageDto extends OutboxMessageSummaryDto {
  from: string;
  text: string;
  html: string;
  headers: Record<string, string>;
  smtpResponse: string | null;
}

/** A message as the local fake SMTP server received it. */
export interface ReceivedMessageSummaryDto {
  id: number;
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  sizeBytes: number;
  receivedAt: string;
}

/** A received message with its parts and header lines, as parsed from what arrived over SMTP. */
export interface ReceivedMessageDto extends ReceivedMessageSummaryDto {
  text: string;
  html: string | null;
  headers: { name: string; value: string }[];
}

/** A page of a list. */
export interface PageDto<T> {
  rows: T[];
  total: number;
  page: number;
  pageSize: number;
}
