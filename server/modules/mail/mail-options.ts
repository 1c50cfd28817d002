import type { DigestDay } from '@shared/schemas/digest';
import type { MailDelivery } from './mail-delivery';

/** Default port of the local fake SMTP server (the conventional unprivileged submission port). */
export const defaultFakeSmtpPort = 2525;
/** Default sender; `localhost` so that nothing pretends to be a real domain. */
export const defaultMailFrom = 'Kcatalog <kcatalog@localhost>';
/**
 * Default time zone of the digest schedule and of dates in mail: UTC, so that moving the server to a
 * machine with another local zone never shifts when digests go out. Teams set their own.
 */
export const defaultMailTimezone = 'UTC';
/** Monday 07:00: the lead opens it at the start of the week. */
export const defaultDigestSchedule: { day: DigestDay; hour: number } = { day: 'monday', hour: 7 };
const defaultPublicUrl = 'http://localhost:3000';

/** `address` or `Name <address>` (with an optional quoted name). */
export const mailboxPattern = /^(?:[^<>\r\n]*<[^\s<>@]+@[^\s<>@]+>|[^\s<>@]+@[^\s<>@]+)$/;

/**
 * Whether the runtime knows an IANA time zone name.
 *
 * @param value e.g. `Europe/Berlin`
 * @returns true when Intl accepts it
 */
export function isTimeZone(value: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

/** What the app needs to write and send mail. */
export interface MailOptions {
  /** Base of links in messages, without a trailing slash. */
  publicUrl: string;
  /** The From header. */
  from: string;
  /** IANA time zone of dates in mail and of the digest schedule. */
  timezone: string;
  /** When the weekly digest goes out, in `timezone`. */
  digestSchedule: { day: DigestDay; hour: number };
  /**
   * Hands queued messages to SMTP. Without one (API tests that send no mail) messages are still written
   * to the outbox and wait there.
   */
  delivery: MailDelivery | null;
}

/**
 * Fills in the defaults of whatever the caller left out.
 *
 * @param options partial options (AppOptions.mail)
 * @returns complete options
 */
export function resolveMailOptions(options: Partial<MailOptions> = {}): MailOptions {
  return {
    publicUrl: (options.publicUrl ?? defaultPublicUrl).replace(/\/+$/, ''),
    from: options.from ?? defaultMailFrom,
    timezone: options.timezone ?? defaultMailTimezone,
    digestSchedule: options.digestSchedule ?? defaultDigestSchedule,
    delivery: options.delivery ?? null,
  };
}

/**
 * Formats an instant for a message, in the installation's time zone and with its name.
 *
 * @param date the instant
 * @param timezone IANA zone
 * @returns e.g. `Mon 1 Jun 2026, 07:00 (UTC)`
 */
export function formatMailDateTime(date: Date, timezone: string): string {
  return `${formatter('date-time', timezone).format(date)} (${timezone})`;
}

/**
 * Formats a calendar date for a message, in the installation's time zone.
 *
 * @param date the instant
 * @param timezone IANA zone
 * @returns e.g. `1 Jun 2026`
 */
export function formatMailDate(date: Date, timezone: string): string {
  return formatter('date', timezone).format(date);
}

// Building an Intl.DateTimeFormat costs far more than formatting with one, and a digest formats many dates.
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(kind: 'date' | 'date-time', timezone: string): Intl.DateTimeFormat {
  const key = `${kind} ${timezone}`;
  let format = formatters.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(
      'en-GB',
      kind === 'date'
        ? { timeZone: timezone, day: 'numeric', month: 'short', year: 'numeric' }
        : { timeZone: timezone, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' },
    );
    formatters.set(key, format);
  }
  return format;
}
