/**
 * `npm run bench:digest`: the weekly digest for 50 subscribers across 5 campaigns on the demo data,
 * generated and handed to SMTP. Seeds the demo campaign five times (through the same services the API
 * uses) into a temporary database, subscribes ten people to each, starts the local fake SMTP server and
 * the delivery worker as the server does, then times one scheduled slot from the start of the run until
 * the SMTP server has accepted all 50 messages. Target (issue): under 2 seconds.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase } from '../../server/data-source';
import { runScheduledDigests } from '../../server/modules/digests/digest-runs';
import { newUnsubscribeToken } from '../../server/modules/digests/digest-subscriptions';
import { startFakeSmtpServer } from '../../server/modules/mail/fake-smtp-server';
import { MailDelivery } from '../../server/modules/mail/mail-delivery';
import { resolveMailOptions } from '../../server/modules/mail/mail-options';
import { hashPassword } from '../../server/modules/users/password';
import { seedDemoAccounts } from '../../server/seed/demo-accounts';
import { seedDemoCampaign } from '../../server/seed/demo-campaign';

const campaignCount = 5;
const subscribersPerCampaign = 10;
const targetMs = 2000;

const dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-bench-digest-'));
const dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
try {
  console.log(`Seeding the demo campaign ${campaignCount} times…`);
  await seedDemoAccounts(dataSource);
  for (let copy = 1; copy <= campaignCount; copy += 1) {
    await seedDemoCampaign(dataSource);
    // The demo's names are unique; the copy just written steps aside for the next one.
    if (copy < campaignCount) {
      await dataSource.query(`UPDATE campaigns SET name = name || ' (copy ${copy})' WHERE name NOT LIKE '% (copy %)'`);
      await dataSource.query(`UPDATE enzymes SET name = name || ' (copy ${copy})' WHERE name NOT LIKE '% (copy %)'`);
    }
  }
  const campaigns = (await dataSource.query(`SELECT id, lead_id FROM campaigns ORDER BY id`)) as { id: number; lead_id: number }[];

  // 50 people: the five demo accounts and 45 invented colleagues, ten subscribed to each campaign.
  const passwordHash = await hashPassword('bench-password-unused');
  for (let index = 1; index <= campaignCount * subscribersPerCampaign - 5; index += 1) {
    await dataSource.query(`INSERT INTO users (email, name, password_hash, role, active, preferences, version) VALUES (?, ?, ?, 'viewer', 1, '{}', 1)`, [
      `colleague-${index}@kcatalog.example`,
      `Invented Colleague ${index}`,
      passwordHash,
    ]);
  }
  const users = (await dataSource.query(`SELECT id FROM users ORDER BY id`)) as { id: number }[];
  for (const [index, campaign] of campaigns.entries()) {
    const subscribers = users.slice(index * subscribersPerCampaign, (index + 1) * subscribersPerCampaign).map((user) => user.id);
    for (const userId of subscribers) {
      await dataSource.query(`INSERT INTO digest_subscriptions (campaign_id, user_id, active, unsubscribe_token, version) VALUES (?, ?, 1, ?, 1)`, [campaign.id, userId, newUnsubscribeToken()]);
    }
    // The lead is subscribed by default to every campaign; here only to the ten-person list it is on.
    if (!subscribers.includes(campaign.lead_id)) {
      await dataSource.query(`INSERT INTO digest_subscriptions (campaign_id, user_id, active, unsubscribe_token, version) VALUES (?, ?, 0, ?, 1)`, [campaign.id, campaign.lead_id, newUnsubscribeToken()]);
    }
  }
  const [{ variants, measurements }] = (await dataSource.query(
    `SELECT (SELECT COUNT(*) FROM variants) AS variants, (SELECT COUNT(*) FROM measurements) AS measurements`,
  )) as { variants: number; measurements: number }[];

  const fake = await startFakeSmtpServer(dataSource, { port: 0 });
  const delivery = new MailDelivery(dataSource, { target: { kind: 'fake', host: fake.host, port: fake.port } });
  await delivery.start();
  const mail = resolveMailOptions({ publicUrl: 'http://localhost:3000', delivery });

  const cpuBefore = process.cpuUsage();
  const startedAt = performance.now();
  const runs = await runScheduledDigests(dataSource, mail, new Date('2026-06-01T07:00:00.000Z'));
  const queuedAt = performance.now();
  // The run kicked the delivery worker; its round ends when every due message has its SMTP answer.
  await delivery.idle();
  const handedAt = performance.now();
  const cpu = process.cpuUsage(cpuBefore);
  const [{ sent, bytes }] = (await dataSource.query(`SELECT COUNT(*) AS sent, SUM(LENGTH(html) + LENGTH(text)) AS bytes FROM outbox_messages WHERE status = 'sent'`)) as {
    sent: number;
    bytes: number;
  }[];
  const [{ failed }] = (await dataSource.query(`SELECT COUNT(*) AS failed FROM outbox_messages WHERE status = 'failed'`)) as { failed: number }[];
  const [{ received }] = (await dataSource.query(`SELECT COUNT(*) AS received FROM received_messages`)) as { received: number }[];
  await delivery.close();
  await fake.close();

  const totalMs = handedAt - startedAt;
  console.log(`\n${campaignCount} campaigns (${variants} variants, ${measurements} measurements), ${runs.length} runs, ${sent} messages accepted by SMTP, ${failed} failed, ${received} stored by the fake server`);
  console.log(`average message ${(bytes / Math.max(sent, 1) / 1024).toFixed(1)} KiB (HTML and text parts)`);
  console.log(`generated and queued in ${(queuedAt - startedAt).toFixed(0)} ms; handed to SMTP in ${(handedAt - queuedAt).toFixed(0)} ms`);
  // The SMTP server runs in this process too, so the CPU time counts both ends of every message.
  console.log(`CPU time of this process in that span ${((cpu.user + cpu.system) / 1000).toFixed(0)} ms (all threads; it runs both ends of SMTP)`);
  console.log(`total ${totalMs.toFixed(0)} ms (target < ${targetMs} ms) ${totalMs < targetMs ? 'ok' : 'TOO SLOW'}`);
  if (totalMs >= targetMs || failed > 0 || sent !== campaignCount * subscribersPerCampaign) process.exitCode = 1;
} finally {
  await dataSource.destroy();
  rmSync(dataDir, { recursive: true, force: true });
}
