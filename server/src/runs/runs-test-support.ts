// Helpers for the run, job, upload and release API tests (imported by *.test.ts files only).
import { mkdtemp, rm } from 'node:fs/promises';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { SMTPServer } from 'smtp-server';
import request from 'supertest';
import { createTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { createTestMachineToken, createTestPerson, CSRF_HEADER, signedInAgent, type TestAgent, type TestPerson } from '../auth/auth-test-support.js';
import type { Role } from '../auth/principal.js';
import type { PostResultsRequest } from '../contracts/ingest.schemas.js';
import { RESULT_COLUMNS, type ResultColumn } from '../contracts/result-columns.js';
import { sha256Hex } from '../contracts/result-fingerprint.js';
import { createMailSink, listen } from '../mail/mail-sink.js';
import { storeSinkedMessage } from '../mail/mail-store.service.js';
import { createLogger } from '../shared/logger.js';
import { ContentStore } from '../store/content-store.js';

export interface SignedIn {
  person: TestPerson;
  agent: TestAgent;
  csrf: string;
}

export interface ApiFixture {
  db: TestDatabase;
  app: Express;
  store: ContentStore;
  /** `Authorization` header value of a machine token. */
  machine: string;
  as(role: Role): Promise<SignedIn>;
  close(): Promise<void>;
}

/**
 * The real app on a fresh migrated database, with its own content store in a temporary folder and,
 * when asked, the mail sink on a free loopback port storing into that database (as main.ts wires it).
 */
export async function startApiFixture(options: { mailSink?: boolean } = {}): Promise<ApiFixture> {
  const db = await createTestDatabase();
  const dataDir = await mkdtemp(path.join(tmpdir(), 'clino-api-'));
  const store = new ContentStore(dataDir);
  let sink: SMTPServer | undefined;
  let mailPort = 1;
  if (options.mailSink) {
    sink = createMailSink((message) => storeSinkedMessage(store, message), createLogger('silent'));
    await listen(sink, 0, '127.0.0.1');
    mailPort = (sink.server.address() as AddressInfo).port;
  }
  const settings = {
    ...db.settings,
    server: { ...db.settings.server, dataDir },
    mail: { ...db.settings.mail, host: '127.0.0.1', port: mailPort, secure: false, user: '', password: '', sink: false },
  };
  const app = createApp({ settings, sequelize: db.sequelize, logger: createLogger('silent') });
  const token = await createTestMachineToken('test-worker');
  return {
    db,
    app,
    store,
    machine: `Bearer ${token.value}`,
    async as(role) {
      const person = await createTestPerson(role);
      return { person, ...(await signedInAgent(app, person)) };
    },
    async close() {
      if (sink) await new Promise<void>((resolve) => (sink as SMTPServer).close(() => resolve()));
      await db.drop();
      await rm(dataDir, { recursive: true, force: true });
    },
  };
}

/** A valid run spec (monthly, market in the price file, constant risk-free); `name` and extra YAML vary it. */
export function specText(name: string, options: { window?: number; minimum?: number; rolling?: number; extra?: string } = {}): string {
  return [
    'schema: 1',
    `name: ${name}`,
    'inputs:',
    '  prices:',
    '    pattern: "prices-*.csv"',
    '  market:',
    '    source: price-file',
    '    column: MKT',
    '  riskFree:',
    '    source: constant',
    '    annualYield: 0.03',
    'sampling:',
    '  frequency: monthly',
    `  window: ${options.window ?? 60}`,
    `  minimum: ${options.minimum ?? 36}`,
    'estimation:',
    '  adjustment: blume',
    '  rolling:',
    `    count: ${options.rolling ?? 24}`,
    'pricing:',
    '  riskFreeRate: 0.02',
    '  marketReturn: 0.08',
    'report:',
    '  distributionList: valuation-committee',
    ...(options.extra ? [options.extra] : []),
    '',
  ].join('\n');
}

export async function pushSpec(fixture: ApiFixture, author: SignedIn, text: string): Promise<string> {
  await author.agent.post('/api/specs').set(CSRF_HEADER, author.csrf).send({ text, file: 'spec.yaml' }).expect((res) => {
    if (res.status !== 201 && res.status !== 200) throw new Error(`push answered ${res.status}: ${JSON.stringify(res.body)}`);
  });
  return sha256Hex(text);
}

/** An invented result record for security number i: every column present, numbers varying with i. */
export function syntheticRecord(i: number, security = `QZ-${String(i).padStart(5, '0')}`): PostResultsRequest['rows'][number] {
  const record: Record<string, string | number | null> = {};
  for (const column of RESULT_COLUMNS as readonly ResultColumn[]) {
    record[column.name] = column.type === 'number' ? 0.5 + ((i * 7919 + column.name.length * 104729) % 10007) / 10007 : null;
  }
  Object.assign(record, { security, group: 'Invented', status: 'ok', n: 60, minimum: 36, first_period: '2021-07', last_period: '2026-06', estimator: 'ols', flags: i % 3 === 0 ? 'low-fit' : null });
  return record as PostResultsRequest['rows'][number];
}

/** Results for `count` invented securities with full scatter (window points) and rolling series (count points). */
export function syntheticResults(count: number, points = 60, rolling = 24): PostResultsRequest {
  const rows = Array.from({ length: count }, (_, i) => syntheticRecord(i));
  const series = rows.map((row, i) => ({
    security: row.security as string,
    scatter: {
      market: Array.from({ length: points }, (_, t) => Math.sin(t + i) / 20),
      security: Array.from({ length: points }, (_, t) => Math.sin(t + i) / 18 + 0.001),
    },
    rolling: { periods: Array.from({ length: rolling }, (_, k) => `2024-${String((k % 12) + 1).padStart(2, '0')}`), betas: Array.from({ length: rolling }, (_, k) => 1 + k / 100) },
  }));
  return { rows, series };
}

export interface InputFile {
  name: string;
  bytes: Buffer;
  sha256: string;
}

export function inputFile(name: string, text: string): InputFile {
  const bytes = Buffer.from(text, 'utf8');
  return { name, bytes, sha256: sha256Hex(bytes), };
}

/** The ingest protocol up to `computing`: create, upload what is missing, mark computing. Answers the run id. */
export async function computingRun(fixture: ApiFixture, specName: string, specSha256: string, asOf: string, inputs: readonly InputFile[]): Promise<string> {
  const created = await request(fixture.app)
    .post('/api/runs')
    .set('Authorization', fixture.machine)
    .send({ specSha256, specName, asOf, inputs: inputs.map((i) => ({ name: i.name, sha256: i.sha256, size: i.bytes.length })) })
    .expect(201);
  const runId = created.body.runId as string;
  for (const sha of created.body.missingInputs as string[]) {
    const input = inputs.find((i) => i.sha256 === sha) as InputFile;
    await request(fixture.app).put(`/api/inputs/${sha}`).set('Authorization', fixture.machine).type('application/octet-stream').send(input.bytes).expect(201);
  }
  await request(fixture.app).post(`/api/runs/${runId}/computing`).set('Authorization', fixture.machine).send({}).expect(200);
  return runId;
}

/** A run in review: computing, then results posted. */
export async function reviewedRun(fixture: ApiFixture, specName: string, specSha256: string, asOf: string, inputs: readonly InputFile[], results: PostResultsRequest): Promise<string> {
  const runId = await computingRun(fixture, specName, specSha256, asOf, inputs);
  await request(fixture.app).post(`/api/runs/${runId}/results`).set('Authorization', fixture.machine).set('Idempotency-Key', `results-${runId}`).send(results).expect(200);
  return runId;
}
