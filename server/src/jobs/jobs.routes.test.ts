import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER } from '../auth/auth-test-support.js';
import { RunResult } from '../runs/run-result.model.js';
import { Run } from '../runs/run.model.js';
import { inputFile, pushSpec, reviewedRun, specText, startApiFixture, syntheticResults, type ApiFixture } from '../runs/runs-test-support.js';
import { Job } from './job.model.js';

const PRICES = inputFile('prices-2026-06.csv', 'date,QZ1,MKT\n2026-05-29,100,2000\n2026-06-30,101,2010\n');

describe('the job queue', () => {
  let fixture: ApiFixture;
  let specSha: string;
  const machine = (method: 'post' | 'get', url: string) => request(fixture.app)[method](url).set('Authorization', fixture.machine);
  const claim = (worker: string, extra: Record<string, unknown> = {}) => machine('post', '/api/jobs/claim').send({ worker, ...extra });

  beforeAll(async () => {
    fixture = await startApiFixture();
    specSha = await pushSpec(fixture, await fixture.as('analyst'), specText('jobs-test', { window: 60, rolling: 24 }));
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('gives concurrent claimers different jobs, each claimed once', async () => {
    await Job.destroy({ where: {} });
    const jobs = await Promise.all(Array.from({ length: 6 }, (_, i) => Job.create({ kind: 'upload', payload: { n: i }, createdBy: 'test' })));
    const answers = await Promise.all(Array.from({ length: 6 }, (_, i) => claim(`host-${i}`)));
    const claimed = answers.map((a) => (a.status === 200 ? String(a.body.id) : null));
    expect(claimed.every((id) => id !== null)).toBe(true);
    expect(new Set(claimed).size).toBe(6);
    expect(new Set(claimed)).toEqual(new Set(jobs.map((j) => String(j.id))));
    const stored = await Job.findAll();
    expect(stored.every((j) => j.state === 'claimed' && j.claimCount === 1)).toBe(true);
    await claim('late-comer').expect(204);
  });

  it('hands a job whose lease ran out to another worker, and refuses the first worker\'s done', async () => {
    await Job.destroy({ where: {} });
    const job = await Job.create({ kind: 'upload', payload: {}, createdBy: 'test' });
    await claim('slow-host', { leaseSeconds: 30 }).expect(200);
    await claim('other-host').expect(204);
    await Job.update({ leaseUntil: new Date(Date.now() - 1000) }, { where: { id: job.id } });
    const taken = await claim('other-host').expect(200);
    expect(taken.body).toMatchObject({ id: String(job.id), claimCount: 2 });
    const refused = await machine('post', `/api/jobs/${job.id}/done`).send({ worker: 'slow-host' }).expect(409);
    expect(refused.body.error).toMatchObject({ code: 'JOB_STATE_CONFLICT', message: expect.stringMatching(/other-host/) });
    const done = await machine('post', `/api/jobs/${job.id}/done`).send({ worker: 'other-host', outcome: 'ok' }).expect(200);
    expect(done.body.state).toBe('done');
    await machine('post', `/api/jobs/${job.id}/done`).send({ worker: 'other-host', outcome: 'ok' }).expect(200);
  });

  it('reruns a run in review as a new attempt through a job a worker claims, computes and posts', async () => {
    await Job.destroy({ where: {} });
    const runId = await reviewedRun(fixture, 'jobs-test', specSha, '2026-06-30', [PRICES], syntheticResults(4));
    const ops = await fixture.as('ops');
    const rerun = await ops.agent.post(`/api/runs/${runId}/rerun`).set(CSRF_HEADER, ops.csrf).send({ reason: 'vendor corrected a price' }).expect(202);
    expect(rerun.body).toMatchObject({ runId, attempt: 2, state: 'received' });

    const job = await claim('worker-a').expect(200);
    expect(job.body).toMatchObject({ id: rerun.body.jobId, kind: 'rerun', payload: { runId, attempt: 2, specName: 'jobs-test', specSha256: specSha, asOf: '2026-06-30', inputs: [{ name: PRICES.name, sha256: PRICES.sha256, size: PRICES.bytes.length }] } });
    const spec = await machine('get', `/api/jobs/${job.body.id}/spec`).expect(200);
    expect(spec.body).toMatchObject({ specName: 'jobs-test', revision: 1, sha256: specSha });
    await machine('get', `/api/inputs/${PRICES.sha256}`).expect(200);
    await machine('post', `/api/runs/${runId}/computing`).send({}).expect(200);
    await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', `rerun-${runId}-2`).send(syntheticResults(5)).expect(200);
    await machine('post', `/api/jobs/${job.body.id}/done`).send({ worker: 'worker-a' }).expect(200);

    const detail = await ops.agent.get(`/api/runs/${runId}`).expect(200);
    expect(detail.body).toMatchObject({ state: 'in-review', attempt: 2, securityCount: 5 });
    expect(detail.body.attempts.map((a: { number: number; state: string }) => [a.number, a.state])).toEqual([[1, 'in-review'], [2, 'in-review']]);
    expect(await RunResult.count({ where: { runId: Number(runId), attempt: 1 } })).toBe(4);
    const results = await ops.agent.get(`/api/runs/${runId}/results`).expect(200);
    expect(results.body).toMatchObject({ attempt: 2, total: 5 });
  });

  it('refuses a rerun of a run that is still computing, and fails the attempt with its job', async () => {
    await Job.destroy({ where: {} });
    const supervisor = await fixture.as('supervisor');
    const runId = await reviewedRun(fixture, 'jobs-test', specSha, '2026-05-29', [PRICES], syntheticResults(2));
    await supervisor.agent.post(`/api/runs/${runId}/rerun`).set(CSRF_HEADER, supervisor.csrf).send({}).expect(202);
    const busy = await supervisor.agent.post(`/api/runs/${runId}/rerun`).set(CSRF_HEADER, supervisor.csrf).send({}).expect(409);
    expect(busy.body.error.code).toBe('RUN_STATE_CONFLICT');
    const job = await claim('worker-b').expect(200);
    await machine('post', `/api/jobs/${job.body.id}/failed`).send({ worker: 'worker-b', code: 'INPUT_UNREADABLE', message: 'input fetch failed' }).expect(200);
    const run = await Run.findByPk(Number(runId));
    expect(run).toMatchObject({ state: 'failed', attempt: 2, failureCode: 'INPUT_UNREADABLE' });
  });
});
