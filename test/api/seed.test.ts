/** The demo seed: idempotent, with the demo studies' data and plans attached byte for byte. */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/db/seed';
import { Dataset, ReviewRequest, User } from '../../server/models/index';
import { REQUEST_STATES } from '../../shared/api/types';
import { TEST_PASSWORD, useApiHarness } from './support/harness';

describe('demo seed', () => {
  const h = useApiHarness();

  it('adds nothing when run again', async () => {
    const before = { users: await User.count(), requests: await ReviewRequest.count(), datasets: await Dataset.count() };
    const report = await seedDemo(h.sequelize, { password: TEST_PASSWORD, rounds: 4 });
    expect(report).toEqual({ office: false, users: 0, requests: 0, datasets: 0 });
    expect({ users: await User.count(), requests: await ReviewRequest.count(), datasets: await Dataset.count() }).toEqual(before);
  });

  it('covers every state but withdrawn', async () => {
    const states = new Set((await ReviewRequest.findAll()).map((r) => r.state));
    expect([...states].sort()).toEqual(REQUEST_STATES.filter((s) => s !== 'withdrawn').sort());
  });

  it('stores each fixture file unchanged with its SHA-256 and the plan from <slug>.plan.json', async () => {
    const rows = await Dataset.scope('withBytes').findAll();
    expect(rows.length).toBe(fs.readdirSync('fixtures/demo').filter((f) => f.endsWith('.csv')).length);
    for (const d of rows) {
      const file = fs.readFileSync(`fixtures/demo/${d.filename}`);
      expect(Buffer.compare(d.bytes, file), d.filename).toBe(0);
      expect(d.sha256).toBe(createHash('sha256').update(file).digest('hex'));
      expect(d.rowCount).toBe(file.toString('utf8').trim().split(/\r?\n/).length - 1);
      const r = (await ReviewRequest.findByPk(d.requestId))!;
      const plan = JSON.parse(fs.readFileSync(`fixtures/demo/${d.filename.replace(/\.csv$/, '.plan.json')}`, 'utf8')) as Record<string, unknown>;
      expect(r.plan).toMatchObject(plan);
    }
  });

  it('lets every demo account sign in with the demo password', async () => {
    for (const key of ['submitter', 'reviewer', 'reviewer2', 'head', 'admin']) await expect(h.as(key)).resolves.toBeTruthy();
  });
});
