import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeRun, type ComputedRun } from '../../../cli/src/batch/compute-run.js';
import { resultsPayload } from '../../../cli/src/batch/delivery-of.js';
import { fingerprintOf, resultCsvText } from '../../../cli/src/output/result-files.js';
import { createTestMachineToken, CSRF_HEADER, signedInAgent } from '../auth/auth-test-support.js';
import { renderFingerprint, sha256Hex } from '../contracts/result-fingerprint.js';
import { loadRunSpec } from '../contracts/run-spec.load.js';
import { MailMessage } from '../mail/mail-message.model.js';
import { User } from '../people/user.model.js';
import { inputFile, pushSpec, startApiFixture, type ApiFixture, type InputFile, type SignedIn } from '../runs/runs-test-support.js';
import { RELEASE_CAUTIONS } from './release-cautions.js';
import { DEMO_RECIPIENTS, ensureDemoDistributionList } from './demo-distribution-list.js';

// The published worked example (shared/reference/WORKED-EXAMPLE.md), its inputs copied byte for byte
// into test/fixtures/worked-example: monthly, as-of 2026-10-30, window 10, minimum 8.
const fixtures = (name: string): string => fileURLToPath(new URL(`../../../test/fixtures/worked-example/${name}`, import.meta.url));
const SPEC = `schema: 1
name: worked-example
inputs:
  prices:
    pattern: "prices.csv"
  market:
    source: price-file
    column: MKT
  riskFree:
    source: file
    pattern: "risk-free.csv"
    column: rate_pct
sampling:
  frequency: monthly
  window: 10
  minimum: 8
  asOf: "2026-10-30"
estimation:
  adjustment: blume
  rolling:
    count: 3
pricing:
  riskFreeRate: 0.02
  marketReturn: 0.08
report:
  distributionList: valuation-committee
`;

const bytesOf = (res: request.Response): Buffer => res.body as Buffer;
const binary = (res: unknown, done: (err: Error | null, body: Buffer) => void): void => {
  const chunks: Buffer[] = [];
  const stream = res as NodeJS.ReadableStream;
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('releases', () => {
  let fixture: ApiFixture;
  let supervisor: SignedIn;
  let specSha: string;
  let computed: ComputedRun;
  let inputs: InputFile[];
  const machine = (method: 'post' | 'put', url: string) => request(fixture.app)[method](url).set('Authorization', fixture.machine);
  const release = (who: SignedIn, runId: string, body: Record<string, unknown> = {}) => who.agent.post(`/api/runs/${runId}/release`).set(CSRF_HEADER, who.csrf).send(body);

  /** The worked example through the ingest protocol, computed by the CLI's engine (under another spec name when given). */
  async function ingestWorkedExample(key: string, spec: { sha256: string; name: string } = { sha256: specSha, name: 'worked-example' }): Promise<string> {
    const created = await machine('post', '/api/runs').send({ specSha256: spec.sha256, specName: spec.name, asOf: computed.asOf, inputs: inputs.map((i) => ({ name: i.name, sha256: i.sha256, size: i.bytes.length })) }).expect(201);
    for (const sha of created.body.missingInputs as string[]) {
      await machine('put', `/api/inputs/${sha}`).type('application/octet-stream').send((inputs.find((i) => i.sha256 === sha) as InputFile).bytes).expect(201);
    }
    await machine('post', `/api/runs/${created.body.runId}/computing`).send({}).expect(200);
    await machine('post', `/api/runs/${created.body.runId}/results`).set('Idempotency-Key', key).send(resultsPayload(computed)).expect(200);
    return created.body.runId as string;
  }

  beforeAll(async () => {
    fixture = await startApiFixture({ mailSink: true });
    await ensureDemoDistributionList(fixture.db.sequelize);
    specSha = await pushSpec(fixture, await fixture.as('analyst'), SPEC);
    computed = await computeRun(loadRunSpec(SPEC, 'worked-example.yaml').spec, { prices: fixtures('prices.csv'), riskFree: fixtures('risk-free.csv') });
    inputs = [];
    for (const name of ['prices.csv', 'risk-free.csv']) inputs.push(inputFile(name, await readFile(fixtures(name), 'utf8')));
    supervisor = await fixture.as('supervisor');
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('refuses to release a run that is not in review with RUN_NOT_RELEASABLE', async () => {
    const created = await machine('post', '/api/runs').send({ specSha256: specSha, specName: 'worked-example', asOf: '2026-09-30', inputs: [{ name: inputs[0]?.name, sha256: inputs[0]?.sha256, size: inputs[0]?.bytes.length }] }).expect(201);
    const res = await release(supervisor, created.body.runId).expect(409);
    expect(res.body.error.code).toBe('RUN_NOT_RELEASABLE');
  });

  it('refuses FOUR_EYES when the releaser authored the run\'s spec revision', async () => {
    const author = await fixture.as('analyst');
    const text = SPEC.replace('name: worked-example', 'name: authored-here');
    const sha = await pushSpec(fixture, author, text);
    const created = await machine('post', '/api/runs').send({ specSha256: sha, specName: 'authored-here', asOf: computed.asOf, inputs: inputs.map((i) => ({ name: i.name, sha256: i.sha256, size: i.bytes.length })) }).expect(201);
    for (const sha256 of created.body.missingInputs as string[]) await machine('put', `/api/inputs/${sha256}`).type('application/octet-stream').send((inputs.find((i) => i.sha256 === sha256) as InputFile).bytes);
    await machine('post', `/api/runs/${created.body.runId}/computing`).send({}).expect(200);
    await machine('post', `/api/runs/${created.body.runId}/results`).set('Idempotency-Key', 'four-eyes').send(resultsPayload(computed)).expect(200);
    await User.update({ role: 'supervisor' }, { where: { id: author.person.id } });
    const promoted = await signedInAgent(fixture.app, author.person);
    const res = await release({ person: author.person, ...promoted }, created.body.runId).expect(403);
    expect(res.body.error.code).toBe('FOUR_EYES');
    await release(supervisor, created.body.runId).expect(201);
  });

  it('refuses FOUR_EYES to the owner of the machine token that pushed the spec, and lets another supervisor release', async () => {
    const owner = await fixture.as('analyst');
    const token = await createTestMachineToken('owned-pusher', owner.person.id);
    const text = SPEC.replace('name: worked-example', 'name: pushed-by-owned-token');
    await request(fixture.app).post('/api/specs').set('Authorization', `Bearer ${token.value}`).send({ text }).expect(201);
    const runId = await ingestWorkedExample('owned-token', { sha256: sha256Hex(text), name: 'pushed-by-owned-token' });
    await User.update({ role: 'supervisor' }, { where: { id: owner.person.id } });
    const promoted = await signedInAgent(fixture.app, owner.person);
    const res = await release({ person: owner.person, ...promoted }, runId).expect(403);
    expect(res.body.error.code).toBe('FOUR_EYES');
    await release(supervisor, runId).expect(201);
  });

  it('refuses FOUR_EYES to everyone for a spec only an ownerless machine token pushed, until a person pushes the same text', async () => {
    const text = SPEC.replace('name: worked-example', 'name: pushed-by-machine');
    await machine('post', '/api/specs').send({ text }).expect(201);
    const runId = await ingestWorkedExample('ownerless-token', { sha256: sha256Hex(text), name: 'pushed-by-machine' });
    const refused = await release(supervisor, runId).expect(403);
    expect(refused.body.error.code).toBe('FOUR_EYES');
    expect(refused.body.error.message).toContain('pushed by the machine token test-worker, which acts for no person: a person must push the same spec text');

    const analyst = await fixture.as('analyst');
    await pushSpec(fixture, analyst, text);
    await release(supervisor, runId).expect(201);
  });

  it('refuses FOUR_EYES to a person who pushed the same text as an ownerless machine did, for a run of the machine\'s revision', async () => {
    const text = SPEC.replace('name: worked-example', 'name: attested-text');
    await machine('post', '/api/specs').send({ text }).expect(201);
    const runId = await ingestWorkedExample('attested', { sha256: sha256Hex(text), name: 'attested-text' });
    const attesting = await fixture.as('analyst');
    await pushSpec(fixture, attesting, text);
    await User.update({ role: 'supervisor' }, { where: { id: attesting.person.id } });
    const promoted = await signedInAgent(fixture.app, attesting.person);
    expect((await release({ person: attesting.person, ...promoted }, runId).expect(403)).body.error.code).toBe('FOUR_EYES');
    await release(supervisor, runId).expect(201);
  });

  it('shows the worked example\'s beta on the series line and its CAPM return on the security market line', async () => {
    const runId = await ingestWorkedExample('numbers');
    const series = await supervisor.agent.get(`/api/runs/${runId}/series/QZ1`).expect(200);
    // WORKED-EXAMPLE.md results: beta 1.19590747062, alpha 0.00393217903536, n 8.
    expect(series.body.fit.n).toBe(8);
    expect(series.body.fit.beta).toBeCloseTo(1.19590747062, 10);
    expect(series.body.fit.alpha).toBeCloseTo(0.00393217903536, 12);
    const sml = await supervisor.agent.get(`/api/runs/${runId}/sml`).expect(200);
    // WORKED-EXAMPLE.md: CAPM with r_f 2%, E[R_m] 8%, Blume beta 1.13060498042 → 0.0878362988249.
    expect(sml.body.line).toMatchObject({ intercept: 0.02, slope: 0.06 });
    expect(sml.body.points[0].beta).toBeCloseTo(1.13060498042, 10);
    expect(sml.body.points[0].expectedReturn).toBeCloseTo(0.0878362988249, 12);
  });

  it('releases a run in review and mails the CSV byte for byte as clino run --out writes it, with the fingerprint and the cautions', async () => {
    const runId = await ingestWorkedExample('mailed');
    const released = await release(supervisor, runId, { note: 'Month-end, reviewed.' }).expect(201);
    expect(released.body).toMatchObject({ runId, mailState: 'sent', distributionList: 'valuation-committee' });
    const cliCsv = Buffer.from(resultCsvText(loadRunSpec(SPEC, 'spec.yaml').spec, computed), 'utf8');
    const stored = await supervisor.agent.get(`/api/releases/${released.body.id}/csv`).buffer(true).parse(binary).expect(200);
    expect(Buffer.compare(bytesOf(stored), cliCsv)).toBe(0);
    const runCsv = await supervisor.agent.get(`/api/runs/${runId}/csv`).buffer(true).parse(binary).expect(200);
    expect(Buffer.compare(bytesOf(runCsv), cliCsv)).toBe(0);

    const message = await MailMessage.findOne({ where: { subject: `Clinometer release: worked-example as of 2026-10-30 (run ${runId})` } });
    expect(message).not.toBeNull();
    expect([...(message as MailMessage).envelopeTo].sort()).toEqual(DEMO_RECIPIENTS.map((r) => r.address).sort());
    const raw = await fixture.store.read((message as MailMessage).rawSha256);
    const parsed = await simpleParser(raw);
    const csvAttachment = parsed.attachments.find((a) => a.filename === 'worked-example-2026-10-30.csv');
    expect(Buffer.compare(csvAttachment?.content as Buffer, bytesOf(stored))).toBe(0);
    const fingerprint = renderFingerprint(fingerprintOf(specSha, computed));
    // The same name rule as clino run --out: <csv name>.fingerprint.
    expect(parsed.attachments.find((a) => a.filename === 'worked-example-2026-10-30.csv.fingerprint')?.content.toString('utf8')).toBe(fingerprint);
    expect(parsed.text).toContain('also attached as worked-example-2026-10-30.csv.fingerprint');
    for (const line of fingerprint.trimEnd().split('\n')) expect(parsed.text).toContain(line);
    for (const caution of RELEASE_CAUTIONS) expect(parsed.text?.replace(/\s+/g, ' ')).toContain(caution);

    const mailroom = await supervisor.agent.get(`/api/mail/${(message as MailMessage).id}/attachments/0`).buffer(true).parse(binary).expect(200);
    expect(Buffer.compare(bytesOf(mailroom), cliCsv)).toBe(0);
  });

  it('supersedes the earlier release of the same spec and as-of, and compares with it before release', async () => {
    const first = (await supervisor.agent.get('/api/releases?spec=worked-example&current=true').expect(200)).body.items[0];
    const runId = await ingestWorkedExample('second');
    const detail = await supervisor.agent.get(`/api/runs/${runId}`).expect(200);
    expect(detail.body.comparison).toMatchObject({ releasedRunId: first.runId, common: 1, bigMoves: 0, addedCount: 0, removedCount: 0 });
    expect(detail.body.comparison.largestChanges[0]).toMatchObject({ security: 'QZ1', change: 0 });

    const second = await release(supervisor, runId).expect(201);
    const earlierRun = await supervisor.agent.get(`/api/runs/${first.runId}`).expect(200);
    expect(earlierRun.body.state).toBe('superseded');
    expect(earlierRun.body.release.supersededBy).toBe(second.body.id);
    const current = await supervisor.agent.get('/api/releases?spec=worked-example&current=true').expect(200);
    expect(current.body.items.map((r: { id: string }) => r.id)).toEqual([second.body.id]);
    const mail = await supervisor.agent.get('/api/mail').expect(200);
    const detailMail = await supervisor.agent.get(`/api/mail/${mail.body.items[0].id}`).expect(200);
    expect(detailMail.body.text).toContain(`Supersedes:   release ${first.id}`);
  });

  it('refuses a second release of a released run', async () => {
    const list = await supervisor.agent.get('/api/releases?spec=worked-example&current=true').expect(200);
    const res = await release(supervisor, list.body.items[0].runId).expect(409);
    expect(res.body.error.code).toBe('RUN_NOT_RELEASABLE');
  });
});
