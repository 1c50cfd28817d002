import { Cron } from 'croner';
import type { DataSource } from 'typeorm';
import type { MailOptions } from '../mail/mail-options';
import { resumeInterruptedDigestRuns, runScheduledDigests } from './digest-runs';
import { digestCronPattern, latestDigestSlot } from './digest-schedule';

/**
 * How long after a slot a starting server still sends that week's digest: a restart around 07:00 must
 * not skip the week, but a server first started on a Thursday should not send Monday's digest.
 */
export const digestCatchUpWindowMs = 60 * 60 * 1000;

/**
 * The weekly digest schedule (croner, in the installation's time zone). On start it finishes runs a
 * restart interrupted and catches up a slot that passed within the last hour; then it runs each slot.
 * The unique (campaign, week) key makes a slot's digests happen once however the runs overlap.
 */
export class DigestScheduler {
  private job: Cron | null = null;
  private running: Promise<unknown> = Promise.resolve();

  constructor(
    private readonly dataSource: DataSource,
    private readonly mail: MailOptions,
  ) {}

  /**
   * Resumes, catches up and schedules.
   *
   * @param now the current time (tests pass their own)
   */
  async start(now = new Date()): Promise<void> {
    const schedule = { ...this.mail.digestSchedule, timezone: this.mail.timezone };
    await this.enqueue(async () => {
      await resumeInterruptedDigestRuns(this.dataSource, this.mail);
      const slot = latestDigestSlot(schedule, now);
      if (now.getTime() - slot.getTime() <= digestCatchUpWindowMs) await runScheduledDigests(this.dataSource, this.mail, slot);
    });
    this.job = new Cron(
      digestCronPattern(schedule),
      { timezone: schedule.timezone, unref: true, protect: true, catch: (error) => console.error('Digest run failed:', error) },
      async () => {
        await this.enqueue(() => runScheduledDigests(this.dataSource, this.mail, latestDigestSlot(schedule, new Date())));
      },
    );
  }

  /** Stops the schedule and waits for a run in progress. */
  async stop(): Promise<void> {
    this.job?.stop();
    this.job = null;
    await this.running;
  }

  private enqueue(work: () => Promise<unknown>): Promise<unknown> {
    const run = this.running.then(work);
    this.running = run.catch((error: unknown) => console.error('Digest run failed:', error));
    return run;
  }
}
