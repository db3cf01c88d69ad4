import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER } from '../auth/auth-test-support.js';
import { sha256Hex } from '../contracts/result-fingerprint.js';
import { Job } from '../jobs/job.model.js';
import { pushSpec, specText, startApiFixture, type ApiFixture, type SignedIn } from '../runs/runs-test-support.js';
import { Upload } from './upload.model.js';

const CSV = 'date,QZ1,MKT\n2026-05-29,100,2000\n2026-06-30,101,2010\n';

describe('uploads', () => {
  let fixture: ApiFixture;
  let ops: SignedIn;
  const upload = (bytes: Buffer, filename: string, contentType = 'text/csv', spec?: string) => {
    const req = ops.agent.post('/api/uploads').set(CSRF_HEADER, ops.csrf).attach('file', bytes, { filename, contentType });
    return spec ? req.field('spec', spec) : req;
  };

  beforeAll(async () => {
    fixture = await startApiFixture();
    ops = await fixture.as('ops');
    await pushSpec(fixture, await fixture.as('analyst'), specText('upload-target'));
  });
  afterAll(async () => {
    await fixture.close();
  });

  it('stores a CSV by its checksum under a safe name and queues an upload job for it', async () => {
    const res = await upload(Buffer.from(CSV), '../../june prices.csv', 'text/csv', 'upload-target').expect(201);
    // The multipart parser already drops the path part of the name; the sanitiser makes the rest safe.
    expect(res.body).toMatchObject({ fileName: 'june-prices.csv', originalName: 'june prices.csv', sha256: sha256Hex(CSV), size: CSV.length, specName: 'upload-target', jobState: 'queued' });
    expect((await fixture.store.read(sha256Hex(CSV))).toString('utf8')).toBe(CSV);
    const job = await Job.findByPk(Number(res.body.jobId));
    expect(job).toMatchObject({ kind: 'upload', payload: { fileName: 'june-prices.csv', sha256: sha256Hex(CSV), specName: 'upload-target', uploadId: res.body.id } });
    const list = await ops.agent.get('/api/uploads').expect(200);
    expect(list.body.items[0].id).toBe(res.body.id);
  });

  it('refuses a file that is not CSV or text by its name or its type', async () => {
    const byName = await upload(Buffer.from(CSV), 'prices.xlsx').expect(415);
    expect(byName.body.error.code).toBe('VALIDATION_FAILED');
    await upload(Buffer.from(CSV), 'prices.csv', 'application/x-msdownload').expect(415);
  });

  it('refuses binary content, naming the file, line and column of the first bad byte', async () => {
    const before = await Upload.count();
    const res = await upload(Buffer.from('date,QZ1\n2026-06-30,1\u00000\n'), 'prices.csv').expect(400);
    expect(res.body.error.details).toMatchObject({ file: 'prices.csv', line: 2, column: 2 });
    expect(res.body.error.message).toMatch(/^prices\.csv:2:2: a NUL byte/);
    expect(await Upload.count()).toBe(before);
  });

  it('refuses a spec name the server does not hold, and a request without a file', async () => {
    await upload(Buffer.from(CSV), 'prices.csv', 'text/csv', 'no-such-spec').expect(400);
    const res = await ops.agent.post('/api/uploads').set(CSRF_HEADER, ops.csrf).field('spec', 'upload-target').expect(400);
    expect(res.body.error.message).toMatch(/"file"/);
  });

  it('is closed to viewers', async () => {
    const viewer = await fixture.as('viewer');
    await viewer.agent.post('/api/uploads').set(CSRF_HEADER, viewer.csrf).attach('file', Buffer.from(CSV), { filename: 'p.csv', contentType: 'text/csv' }).expect(403);
  });
});
