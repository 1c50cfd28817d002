import { randomUUID } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import type { MailKind } from '@shared/schemas/mail';
import { OutboxMessage } from './outbox-message.entity';

/** A message to write to the outbox. */
export interface MailToSend {
  kind: MailKind;
  to: string;
  toName: string | null;
  from: string;
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
  digestRunId?: number | null;
}

// The host part of generated Message-IDs; RFC 5322 asks only that the id be unique worldwide.
const messageIdDomain = 'kcatalog.invalid';

/**
 * Writes a message to the outbox inside the caller's transaction, so that it exists if and only if what
 * it announces was committed; the delivery worker sends it after the commit (call `delivery.kick()`).
 *
 * @param manager the caller's transaction manager
 * @param mail the message
 * @returns the stored row (status `queued`, due now)
 */
export async function enqueueMail(manager: EntityManager, mail: MailToSend): Promise<OutboxMessage> {
  const repository = manager.getRepository(OutboxMessage);
  // insert, not save: save reads the row back, and a digest run queues one message per recipient.
  const message = repository.create({
    kind: mail.kind,
    toAddress: mail.to,
    toName: mail.toName,
    fromAddress: mail.from,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    headers: mail.headers ?? {},
    status: 'queued',
    attempts: 0,
    lastError: null,
    nextAttemptAt: new Date(),
    messageId: `<${randomUUID()}@${messageIdDomain}>`,
    sentAt: null,
    smtpResponse: null,
    digestRunId: mail.digestRunId ?? null,
  });
  const { identifiers } = await repository.insert(message);
  message.id = identifiers[0].id as number;
  return message;
}
