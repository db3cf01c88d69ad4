import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model.js';
import { sha256Hex } from '../contracts/result-fingerprint.js';
import { RunResult } from './run-result.model.js';
import { Run } from './run.model.js';
import { computingRun, inputFile, pushSpec, specText, startApiFixture, syntheticResults, type ApiFixture } from './runs-test-support.js';

const PRICES = inputFile('prices-2026-06.csv', 'date,QZ1,MKT\n2026-05-29,100,2000\n2026-06-30,101,2010\n');

describe('the ingest protocol', () => {
  let fixture: ApiFixture;
  let specSha: string;
  beforeAll(async () => {
    fixture = await startApiFixture();
    specSha = await pushSpec(fixture, await fixture.as('analyst'), specText('ingest-test'));
  });
  afterAll(async () => {
    await fixture.close();
  });

  const machine = (method: 'post' | 'put' | 'get', url: string) => request(fixture.app)[method](url).set('Authorization', fixture.machine);

  it('refuses a run of a spec the server does not hold with SPEC_UNKNOWN', async () => {
    const res = await machine('post', '/api/runs')
      .send({ specSha256: sha256Hex('never pushed'), specName: 'ingest-test', asOf: '2026-06-30', inputs: [{ name: PRICES.name, sha256: PRICES.sha256, size: PRICES.bytes.length }] })
      .expect(404);
    expect(res.body.error.code).toBe('SPEC_UNKNOWN');
  });

  it('creates a run in state received and answers the inputs the store lacks', async () => {
    const res = await machine('post', '/api/runs')
      .send({ specSha256: specSha, specName: 'ingest-test', asOf: '2026-06-30', inputs: [{ name: PRICES.name, sha256: PRICES.sha256, size: PRICES.bytes.length }] })
      .expect(201);
    expect(res.body).toMatchObject({ attempt: 1, state: 'received', missingInputs: [PRICES.sha256] });
    const run = await Run.findByPk(Number(res.body.runId));
    expect(run?.fingerprint).toBe(`clinometer-fingerprint 1\nspec ${specSha}\ninput ${PRICES.sha256} ${PRICES.name}\n`);
  });

  it('answers the same run when a create is retried with the same Idempotency-Key', async () => {
    const body = { specSha256: specSha, specName: 'ingest-test', asOf: '2026-08-31', inputs: [{ name: PRICES.name, sha256: PRICES.sha256, size: PRICES.bytes.length }] };
    const first = await machine('post', '/api/runs').set('Idempotency-Key', 'create-once').send(body).expect(201);
    const again = await machine('post', '/api/runs').set('Idempotency-Key', 'create-once').send(body).expect(201);
    expect(again.body).toEqual(first.body);
    expect(await Run.count({ where: { asOf: '2026-08-31' } })).toBe(1);
  });

  it('refuses to mark a run computing before its inputs are uploaded', async () => {
    const other = inputFile('prices-2026-07.csv', 'date,QZ1,MKT\n2026-07-31,102,2020\n');
    const created = await machine('post', '/api/runs').send({ specSha256: specSha, specName: 'ingest-test', asOf: '2026-07-31', inputs: [{ name: other.name, sha256: other.sha256, size: other.bytes.length }] }).expect(201);
    const res = await machine('post', `/api/runs/${created.body.runId}/computing`).send({}).expect(409);
    expect(res.body.error.code).toBe('RUN_STATE_CONFLICT');
  });

  it('refuses an input whose bytes do not hash to the checksum in the path, and stores nothing', async () => {
    const wrong = sha256Hex('something else');
    const res = await machine('put', `/api/inputs/${wrong}`).type('application/octet-stream').send(PRICES.bytes).expect(400);
    expect(res.body.error).toMatchObject({ code: 'CHECKSUM_MISMATCH', details: { expected: wrong, actual: PRICES.sha256 } });
    expect(await fixture.store.has(wrong)).toBe(false);
    expect(await fixture.store.has(PRICES.sha256)).toBe(false);
  });

  it('stores an input by checksum once, and hands it back byte for byte', async () => {
    await machine('put', `/api/inputs/${PRICES.sha256}`).type('application/octet-stream').send(PRICES.bytes).expect(201);
    await machine('put', `/api/inputs/${PRICES.sha256}`).type('application/octet-stream').send(PRICES.bytes).expect(200);
    const back = await machine('get', `/api/inputs/${PRICES.sha256}`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(Buffer.compare(back.body as Buffer, PRICES.bytes)).toBe(0);
  });

  it('stores results once when the same Idempotency-Key is posted twice, and answers the same', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2026-05-29', [PRICES]);
    const body = syntheticResults(3, 60, 24);
    const first = await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'key-once').send(body).expect(200);
    const second = await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'key-once').send(body).expect(200);
    expect(second.body).toEqual(first.body);
    expect(first.body).toMatchObject({ state: 'in-review', securityCount: 3 });
    expect(await RunResult.count({ where: { runId: Number(runId) } })).toBe(3);
    expect(await AuditEvent.count({ where: { action: 'run.results', entityId: runId } })).toBe(1);
  });

  it('refuses the same Idempotency-Key with a different body, and a second key on a run already in review', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2026-04-30', [PRICES]);
    await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'key-a').send(syntheticResults(2)).expect(200);
    const reused = await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'key-a').send(syntheticResults(4)).expect(409);
    expect(reused.body.error.code).toBe('IDEMPOTENCY_KEY_REUSED');
    const again = await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'key-b').send(syntheticResults(2)).expect(409);
    expect(again.body.error.message).toMatch(/in-review/);
  });

  it('needs an Idempotency-Key on results', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2026-03-31', [PRICES]);
    const res = await machine('post', `/api/runs/${runId}/results`).send(syntheticResults(1)).expect(400);
    expect(res.body.error.message).toMatch(/Idempotency-Key/);
  });

  it('refuses series longer than the spec allows (the window for scatter points)', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2026-02-27', [PRICES]);
    const res = await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'too-long').send(syntheticResults(1, 61, 24)).expect(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(await RunResult.count({ where: { runId: Number(runId) } })).toBe(0);
  });

  it('stores a 5,000-security post in one transaction within the body limit', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2026-01-30', [PRICES]);
    const body = syntheticResults(5000, 60, 24);
    expect(Buffer.byteLength(JSON.stringify(body))).toBeGreaterThan(1_000_000);
    const res = await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'big').send(body).expect(200);
    expect(res.body).toMatchObject({ state: 'in-review', securityCount: 5000 });
    expect(await RunResult.count({ where: { runId: Number(runId) } })).toBe(5000);
    const stored = await RunResult.findOne({ where: { runId: Number(runId), security: 'QZ-04999' } });
    expect(stored?.scatter?.market).toHaveLength(60);
    expect(stored?.rolling?.betas).toHaveLength(24);
  }, 120_000); // a guard for a loaded machine (22 MB through JSON and MariaDB), not a speed check

  it('keeps none of the rows when storing fails part way: all or nothing', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2025-12-31', [PRICES]);
    const queryInterface = fixture.db.sequelize.getQueryInterface();
    const original = queryInterface.bulkInsert.bind(queryInterface);
    let batches = 0;
    const spy = vi.spyOn(queryInterface, 'bulkInsert').mockImplementation(async (...args) => {
      batches += 1;
      if (batches === 3) throw new Error('disk full (injected)');
      return original(...args);
    });
    await machine('post', `/api/runs/${runId}/results`).set('Idempotency-Key', 'fails').send(syntheticResults(1500, 10, 3)).expect(500);
    spy.mockRestore();
    expect(batches).toBe(3);
    expect(await RunResult.count({ where: { runId: Number(runId) } })).toBe(0);
    expect((await Run.findByPk(Number(runId)))?.state).toBe('computing');
  });

  it('marks a run failed with its code and message, and refuses a failure for a run in review', async () => {
    const runId = await computingRun(fixture, 'ingest-test', specSha, '2025-11-28', [PRICES]);
    const failed = await machine('post', `/api/runs/${runId}/failure`).send({ code: 'INPUT_BAD_PRICE', message: 'prices-2026-06.csv:3:2 a zero price' }).expect(200);
    expect(failed.body.state).toBe('failed');
    const run = await Run.findByPk(Number(runId));
    expect(run).toMatchObject({ state: 'failed', failureCode: 'INPUT_BAD_PRICE' });
    const reviewed = await computingRun(fixture, 'ingest-test', specSha, '2025-10-31', [PRICES]);
    await machine('post', `/api/runs/${reviewed}/results`).set('Idempotency-Key', 'k').send(syntheticResults(1)).expect(200);
    const res = await machine('post', `/api/runs/${reviewed}/failure`).send({ code: 'INTERNAL', message: 'late' }).expect(409);
    expect(res.body.error.code).toBe('RUN_STATE_CONFLICT');
  });
});
