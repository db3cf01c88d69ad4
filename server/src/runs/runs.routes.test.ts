import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Run } from './run.model.js';
import { computingRun, inputFile, pushSpec, reviewedRun, specText, startApiFixture, syntheticRecord, type ApiFixture, type SignedIn } from './runs-test-support.js';

const PRICES = inputFile('prices-2026-06.csv', 'date,QZ1,MKT\n2026-06-30,101,2010\n');

describe('reading runs', () => {
  let fixture: ApiFixture;
  let viewer: SignedIn;
  let specA: string;
  let reviewed: string;
  beforeAll(async () => {
    fixture = await startApiFixture();
    const analyst = await fixture.as('analyst');
    specA = await pushSpec(fixture, analyst, specText('list-a', { window: 12, minimum: 8, rolling: 3 }));
    const specB = await pushSpec(fixture, analyst, specText('list-b', { window: 12, minimum: 8, rolling: 3 }));
    const rows = [syntheticRecord(0, 'QZ-B'), syntheticRecord(1, 'QZ-A'), syntheticRecord(2, '=QZ-C')];
    rows[0] = { ...rows[0], adjusted_beta: 1.4, flags: 'low-fit unstable' } as typeof rows[0];
    rows[1] = { ...rows[1], adjusted_beta: 0.7, flags: null } as typeof rows[1];
    rows[2] = { ...rows[2], adjusted_beta: 1.1, flags: 'unstable' } as typeof rows[2];
    reviewed = await reviewedRun(fixture, 'list-a', specA, '2026-03-31', [PRICES], { rows, series: [] });
    await computingRun(fixture, 'list-a', specA, '2026-06-30', [PRICES]);
    await computingRun(fixture, 'list-b', specB, '2026-06-30', [PRICES]);
    viewer = await fixture.as('viewer');
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('filters runs by spec, state and as-of range, sorted and paged', async () => {
    const bySpec = await viewer.agent.get('/api/runs?spec=list-a&sort=asOf').expect(200);
    expect(bySpec.body).toMatchObject({ total: 2, page: 1 });
    expect(bySpec.body.items.map((r: { asOf: string }) => r.asOf)).toEqual(['2026-03-31', '2026-06-30']);
    const byState = await viewer.agent.get('/api/runs?state=computing,failed').expect(200);
    expect(byState.body.items.every((r: { state: string }) => r.state === 'computing')).toBe(true);
    expect(byState.body.total).toBe(2);
    const range = await viewer.agent.get('/api/runs?asOfFrom=2026-04-01&asOfTo=2026-06-30&pageSize=1&page=2').expect(200);
    expect(range.body).toMatchObject({ total: 2, pageSize: 1, page: 2 });
    expect(range.body.items).toHaveLength(1);
    const unknownSpec = await viewer.agent.get('/api/runs?spec=nobody').expect(200);
    expect(unknownSpec.body.total).toBe(0);
  });

  it('refuses a filter it does not know, naming the query parameter', async () => {
    const res = await viewer.agent.get('/api/runs?state=done').expect(400);
    expect(res.body.error.details.issues[0]).toMatchObject({ in: 'query', path: 'state.0' });
  });

  it('shows a run\'s detail with its inputs, attempts and fingerprint', async () => {
    const res = await viewer.agent.get(`/api/runs/${reviewed}`).expect(200);
    expect(res.body).toMatchObject({ id: reviewed, specName: 'list-a', specRevision: 1, specSha256: specA, state: 'in-review', securityCount: 3, comparison: null, release: null });
    expect(res.body.inputs).toEqual([{ name: PRICES.name, sha256: PRICES.sha256, size: PRICES.bytes.length, stored: true }]);
    expect(res.body.attempts).toHaveLength(1);
    expect(res.body.fingerprint).toContain(`input ${PRICES.sha256} ${PRICES.name}`);
  });

  it('pages results, sorted by a statistic and filtered by a whole flag', async () => {
    const sorted = await viewer.agent.get(`/api/runs/${reviewed}/results?sort=-adjustedBeta`).expect(200);
    expect(sorted.body.items.map((r: { security: string }) => r.security)).toEqual(['QZ-B', '=QZ-C', 'QZ-A']);
    const flagged = await viewer.agent.get(`/api/runs/${reviewed}/results?flag=unstable`).expect(200);
    expect(flagged.body.items.map((r: { security: string }) => r.security)).toEqual(['=QZ-C', 'QZ-B']);
    expect(flagged.body.items[1].flags).toEqual(['low-fit', 'unstable']);
    const fit = await viewer.agent.get(`/api/runs/${reviewed}/results?flag=low-fit&pageSize=1`).expect(200);
    expect(fit.body).toMatchObject({ total: 1, attempt: 1 });
  });

  it('writes the CSV with spreadsheet-safe text and the fingerprint checksum header, only for runs with results', async () => {
    const csv = await viewer.agent.get(`/api/runs/${reviewed}/csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['x-clino-fingerprint-sha256']).toBe((await Run.findByPk(Number(reviewed)))?.fingerprintSha256);
    expect(csv.text.split('\n')[1]).toMatch(/^'=QZ-C,/);
    const computing = (await viewer.agent.get('/api/runs?state=computing&pageSize=1').expect(200)).body.items[0].id as string;
    const refused = await viewer.agent.get(`/api/runs/${computing}/csv`).expect(409);
    expect(refused.body.error.code).toBe('RUN_STATE_CONFLICT');
  });

  it('answers RUN_NOT_FOUND for a run that does not exist', async () => {
    const res = await request(fixture.app).get('/api/runs/424242').set('Authorization', fixture.machine).expect(404);
    expect(res.body.error.code).toBe('RUN_NOT_FOUND');
  });
});
