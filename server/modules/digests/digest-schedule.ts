import { Cron } from 'croner';
import { digestDays, type DigestDay } from '@shared/schemas/digest';

/** When the weekly digest goes out: a day and an hour in a time zone. */
export interface DigestScheduleSpec {
  day: DigestDay;
  hour: number;
  timezone: string;
}

/**
 * The cron pattern of the schedule: minute 0 of the hour on the day (day numbers as cron counts them,
 * Sunday = 0).
 *
 * @param schedule day and hour
 * @returns e.g. `0 7 * * 1` for Monday 07:00
 */
export function digestCronPattern(schedule: Pick<DigestScheduleSpec, 'day' | 'hour'>): string {
  return `0 ${schedule.hour} * * ${digestDays.indexOf(schedule.day)}`;
}

function pausedJob(schedule: DigestScheduleSpec): Cron {
  return new Cron(digestCronPattern(schedule), { timezone: schedule.timezone, paused: true });
}

/**
 * The latest scheduled slot at or before `now` (croner reads the hour in the schedule's time zone, so a
 * daylight-saving change keeps the digest at 07:00 local time).
 *
 * @param schedule day, hour and time zone
 * @param now the reference instant
 * @returns the slot
 */
export function latestDigestSlot(schedule: DigestScheduleSpec, now: Date): Date {
  const job = pausedJob(schedule);
  // previousRuns excludes the reference instant itself; one millisecond later includes a slot exactly at `now`.
  const [slot] = job.previousRuns(1, new Date(now.getTime() + 1));
  job.stop();
  return slot;
}

/**
 * The next scheduled slot after `now`.
 *
 * @param schedule day, hour and time zone
 * @param now the reference instant
 * @returns the slot, or null if croner finds none
 */
export function nextDigestSlot(schedule: DigestScheduleSpec, now: Date): Date | null {
  const job = pausedJob(schedule);
  const next = job.nextRun(now);
  job.stop();
  return next;
}

/**
 * The key of a slot's week: its local calendar date in the schedule's time zone, so that the unique key
 * (campaign, week) names the same week in every process and after every restart.
 *
 * @param slot a scheduled slot
 * @param timezone IANA zone
 * @returns `YYYY-MM-DD`
 * @example weekKeyOf(new Date('2026-06-01T05:00:00Z'), 'Europe/Berlin') // '2026-06-01'
 */
export function weekKeyOf(slot: Date, timezone: string): string {
  let format = dateFormats.get(timezone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', { timeZone: timezone, year: 'numeric', month: '2-digit', day: '2-digit' });
    dateFormats.set(timezone, format);
  }
  const part = (type: Intl.DateTimeFormatPartTypes) => format.formatToParts(slot).find((item) => item.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')}`;
}

// Building an Intl.DateTimeFormat costs far more than using one.
const dateFormats = new Map<string, Intl.DateTimeFormat>();
