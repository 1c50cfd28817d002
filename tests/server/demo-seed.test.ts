import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createApp } from '@server/app';
import { openDatabase } from '@server/data-source';
import type { DatabaseSessionStore } from '@server/modules/sessions/database-session-store';
import { demoSites } from '@server/seed/demo-scenario';
import { seedDemoIfEmpty } from '@server/seed/seed';
import { removeDataDir, signedIn, testSecret } from './test-app';

let dataSource: DataSource;
let dataDir: string;

beforeAll(async () => {
  dataDir = mkdtempSync(join(tmpdir(), 'kcatalog-demo-'));
  dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
  expect(await seedDemoIfEmpty(dataSource)).toBe(true);
}, 60_000);

afterAll(async () => {
  await dataSource.destroy();
  removeDataDir(dataDir);
});

describe('the demo seed', () => {
  it('seeds only an empty database', async () => {
    expect(await seedDemoIfEmpty(dataSource)).toBe(false);
  });

  it('yields a condition-matched comparison for most characterized variants', async () => {
    const [{ characterized, compared }] = await dataSource.query(
      `SELECT COUNT(*) AS characterized, COUNT(summary_ddg_kj_per_mol) AS compared
         FROM variants WHERE status = 'characterized' AND mutation_count > 0`,
    );
    expect(characterized).toBeGreaterThanOrEqual(30);
    expect(compared / characterized).toBeGreaterThanOrEqual(0.9);
  });

  it('looks like a real campaign: parent Km near 1 mM, the nucleophile worth about 10⁴ in kcat', async () => {
    const rows: { label: string; kcat: number; km: number }[] = await dataSource.query(
      `SELECT label, summary_kcat AS kcat, summary_km AS km FROM variants WHERE label IN ('parent', 'C112A', 'Y87F')`,
    );
    const byLabel = new Map(rows.map((row) => [row.label, row]));
    const parent = byLabel.get('parent')!;
    expect(parent.km).toBeGreaterThan(0.5e-3);
    expect(parent.km).toBeLessThan(2e-3);
    const nucleophileCost = parent.kcat / byLabel.get('C112A')!.kcat;
    expect(nucleophileCost).toBeGreaterThan(3e3);
    expect(nucleophileCost).toBeLessThan(3e4);
    // A conservative second-shell change stays within a few fold.
    const secondShell = parent.kcat / byLabel.get('Y87F')!.kcat;
    expect(secondShell).toBeGreaterThan(0.3);
    expect(secondShell).toBeLessThan(3);
  });

  it('has measurements in every review state, pH profiles and an audit trail', async () => {
    const states: { review_state: string }[] = await dataSource.query(`SELECT DISTINCT review_state FROM measurements`);
    expect(states.map((row) => row.review_state).sort()).toEqual(['approved', 'draft', 'flagged', 'retracted', 'submitted']);
    const [{ profiles }] = await dataSource.query(`SELECT COUNT(*) AS profiles FROM ph_profiles`);
    expect(profiles).toBeGreaterThanOrEqual(4);
    const [{ events }] = await dataSource.query(`SELECT COUNT(*) AS events FROM audit_events`);
    expect(events).toBeGreaterThan(100);
  });

  it('keeps a note on every annotated catalytic site', async () => {
    const sites: { position: number; note: string | null }[] = await dataSource.query(`SELECT position, note FROM catalytic_sites ORDER BY position`);
    expect(sites.length).toBe(demoSites.length);
    expect(sites.map((site) => site.note)).toEqual([...demoSites].sort((a, b) => a.position - b.position).map((site) => site.note));
  });

  it('serves the demo campaign through the API, with double-mutant cycles', async () => {
    const app = createApp(dataSource, { sessionSecret: testSecret });
    try {
      const lead = await signedIn(app, 'lead@kcatalog.example');
      const campaigns = (await lead.agent.get('/api/campaigns').expect(200)).body.rows;
      expect(campaigns).toHaveLength(1);
      const cycles = (await lead.agent.get(`/api/campaigns/${campaigns[0].id}/cycles`).expect(200)).body.cycles;
      expect(cycles.length).toBeGreaterThanOrEqual(3);
      await request(app).get('/api/campaigns').expect(401);
    } finally {
      (app.locals.sessionStore as DatabaseSessionStore).close();
    }
  });
});
