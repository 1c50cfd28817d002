import nodemailer from 'nodemailer';
import type { DataSource } from 'typeorm';
import type { MailMode } from '@shared/schemas/mail';
import { isoFromSqlite, sqliteFromDate } from '../../sqlite-datetime';
import { writeTransaction } from '../../write-transaction';

/** Where the worker hands messages: the local fake SMTP server, or a real one by URL. */
export type MailTarget = { kind: 'fake'; host: string; port: number } | { kind: 'smtp'; url: string };

/** How the delivery worker connects and how patiently it retries. */
export interface MailDeliveryOptions {
  target: MailTarget;
  /**
   * Waits before the 2nd, 3rd, … attempt after a temporary failure (connection refused, timeout, 4xx);
   * after the last one the message is marked failed. Default 10 s, 1 min, 5 min, 30 min, 2 h: an SMTP
   * server that is down for a restart or an afternoon still gets the message.
   */
  retryDelaysMs?: readonly number[];
  /** Longest sleep between looks at the outbox (messages queued by another process). */
  pollIntervalMs?: number;
  /** Messages handed to SMTP at the same time. */
  concurrency?: number;
}

interface DueRow {
  id: number;
  to_address: string;
  to_name: string | null;
  from_address: string;
  subject: string;
  text: string;
  html: string;
  headers: string;
  message_id: string;
  attempts: number;
}

const defaultRetryDelaysMs = [10_000, 60_000, 300_000, 1_800_000, 7_200_000];
const defaultPollIntervalMs = 60_000;
const batchSize = 50;
const errorMaxLength = 1000;

/**
 * The delivery worker: takes due messages from the outbox, hands them to SMTP through nodemailer and
 * records the outcome. A temporary failure is retried with growing waits; a permanent refusal (a 5xx
 * reply) or the last retry marks the message failed with the error, so nothing is lost silently.
 *
 * Each message is marked `sending` in one transaction, sent outside any transaction (the local fake
 * server writes what it receives to the same database), and its result recorded in another. Delivery is
 * at least once: a crash between the SMTP server's acceptance and the record leaves the message
 * `sending`, and `start()` puts it back in the queue.
 */
export class MailDelivery {
  readonly mode: Exclude<MailMode, 'none'>;
  readonly target: MailTarget;
  private readonly transporter: ReturnType<typeof nodemailer.createTransport>;
  private readonly retryDelaysMs: readonly number[];
  private readonly pollIntervalMs: number;
  private readonly concurrency: number;
  private draining: Promise<void> | null = null;
  private drainAgain = false;
  private wakeTimer: NodeJS.Timeout | null = null;
  private closed = false;

  constructor(
    private readonly dataSource: DataSource,
    options: MailDeliveryOptions,
  ) {
    this.target = options.target;
    this.mode = options.target.kind;
    this.retryDelaysMs = options.retryDelaysMs ?? defaultRetryDelaysMs;
    this.pollIntervalMs = options.pollIntervalMs ?? defaultPollIntervalMs;
    this.concurrency = options.concurrency ?? 4;
    // A pool of connections, each reused for many messages: opening an SMTP session costs a round of
    // greetings (and smtp-server waits 100 ms before its greeting), far more than a message does.
    const connection = {
      pool: true,
      maxConnections: this.concurrency,
      maxMessages: 100,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    } as const;
    this.transporter =
      options.target.kind === 'smtp'
        ? nodemailer.createTransport({ url: options.target.url, ...connection })
        : // The fake server offers neither STARTTLS nor AUTH: plain SMTP on the loopback interface.
          nodemailer.createTransport({ host: options.target.host, port: options.target.port, secure: false, ignoreTLS: true, ...connection });
  }

  /** Puts messages a crash left `sending` back in the queue and starts delivering. */
  async start(): Promise<void> {
    await writeTransaction(this.dataSource, (manager) =>
      manager.query(`UPDATE outbox_messages SET status = 'queued', next_attempt_at = ? WHERE status = 'sending'`, [sqliteFromDate(new Date())]),
    );
    this.kick();
  }

  /** Asks for a delivery round soon (after a commit that queued messages); rounds never overlap. */
  kick(): void {
    if (this.closed) return;
    if (this.draining) {
      this.drainAgain = true;
      return;
    }
    if (this.wakeTimer) clearTimeout(this.wakeTimer);
    this.wakeTimer = null;
    this.draining = this.drain()
      .catch((error: unknown) => console.error('Mail delivery round failed:', error))
      .finally(() => {
        this.draining = null;
        if (this.drainAgain) {
          this.drainAgain = false;
          this.kick();
        } else {
          void this.scheduleWake();
        }
      });
  }

  /** Resolves when no delivery round is running (tests and shutdown). */
  async idle(): Promise<void> {
    while (this.draining) await this.draining;
  }

  /** Stops the worker after the current round and closes the transport. */
  async close(): Promise<void> {
    this.closed = true;
    if (this.wakeTimer) clearTimeout(this.wakeTimer);
    this.wakeTimer = null;
    await this.idle();
    this.transporter.close();
  }

  private async drain(): Promise<void> {
    for (;;) {
      const due = await this.claimDue();
      if (due.length === 0) return;
      let next = 0;
      const worker = async () => {
        while (next < due.length) {
          const row = due[next];
          next += 1;
          await this.deliver(row);
        }
      };
      await Promise.all(Array.from({ length: Math.min(this.concurrency, due.length) }, worker));
      if (this.closed) return;
    }
  }

  private claimDue(): Promise<DueRow[]> {
    return writeTransaction(this.dataSource, async (manager) => {
      const rows = (await manager.query(
        `SELECT id, to_address, to_name, from_address, subject, text, html, headers, message_id, attempts
           FROM outbox_messages WHERE status = 'queued' AND next_attempt_at <= ? ORDER BY id LIMIT ?`,
        [sqliteFromDate(new Date()), batchSize],
      )) as DueRow[];
      if (rows.length > 0) {
        await manager.query(`UPDATE outbox_messages SET status = 'sending' WHERE id IN (${rows.map(() => '?').join(', ')})`, rows.map((row) => row.id));
      }
      return rows;
    });
  }

  private async deliver(row: DueRow): Promise<void> {
    const attempts = row.attempts + 1;
    try {
      const info = await this.transporter.sendMail({
        from: row.from_address,
        to: row.to_name ? { name: row.to_name, address: row.to_address } : row.to_address,
        subject: row.subject,
        text: row.text,
        html: row.html,
        headers: JSON.parse(row.headers) as Record<string, string>,
        messageId: row.message_id,
        // Base64 rather than quoted-printable for the (mostly non-ASCII-sprinkled) parts: Node encodes and
        // decodes it natively, several times faster than quoted-printable in JavaScript, for a third more bytes.
        textEncoding: 'base64',
      });
      await this.record(row.id, `UPDATE outbox_messages SET status = 'sent', attempts = ?, sent_at = ?, next_attempt_at = NULL, smtp_response = ?, last_error = NULL, updated_at = ? WHERE id = ?`, [
        attempts,
        sqliteFromDate(new Date()),
        String(info.response ?? '').slice(0, 500),
      ]);
    } catch (error) {
      const message = describeError(error);
      const delay = this.retryDelaysMs[attempts - 1];
      if (isPermanent(error) || delay === undefined) {
        await this.record(row.id, `UPDATE outbox_messages SET status = 'failed', attempts = ?, last_error = ?, next_attempt_at = NULL, updated_at = ? WHERE id = ?`, [attempts, message]);
        console.error(`Mail ${row.message_id} to ${row.to_address} failed for good after ${attempts} attempt(s): ${message}`);
      } else {
        await this.record(row.id, `UPDATE outbox_messages SET status = 'queued', attempts = ?, last_error = ?, next_attempt_at = ?, updated_at = ? WHERE id = ?`, [
          attempts,
          message,
          sqliteFromDate(new Date(Date.now() + delay)),
        ]);
      }
    }
  }

  private async record(id: number, sql: string, parameters: (string | number)[]): Promise<void> {
    await writeTransaction(this.dataSource, (manager) => manager.query(sql, [...parameters, sqliteFromDate(new Date()), id]));
  }

  /** Sleeps until the next retry is due (or the poll interval), without holding the process open. */
  private async scheduleWake(): Promise<void> {
    if (this.closed || !this.dataSource.isInitialized) return;
    const [row] = (await this.dataSource
      .query(`SELECT MIN(next_attempt_at) AS next FROM outbox_messages WHERE status = 'queued'`)
      .catch(() => [{ next: null }])) as { next: string | null }[];
    if (this.closed || this.draining) return;
    const dueInMs = row?.next ? new Date(isoFromSqlite(row.next)).getTime() - Date.now() : Number.POSITIVE_INFINITY;
    const waitMs = Math.max(0, Math.min(dueInMs, this.pollIntervalMs));
    if (this.wakeTimer) clearTimeout(this.wakeTimer);
    this.wakeTimer = setTimeout(() => this.kick(), waitMs);
    this.wakeTimer.unref();
  }
}

/** SMTP replies 5xx are permanent refusals (RFC 5321 §4.2.1); retrying them cannot help. */
function isPermanent(error: unknown): boolean {
  const responseCode = (error as { responseCode?: unknown })?.responseCode;
  return typeof responseCode === 'number' && responseCode >= 500 && responseCode < 600;
}

function describeError(error: unknown): string {
  if (!(error instanceof Error)) return String(error).slice(0, errorMaxLength);
  const code = (error as { code?: unknown }).code;
  const text = typeof code === 'string' && !error.message.includes(code) ? `${code}: ${error.message}` : error.message;
  return text.slice(0, errorMaxLength);
}
