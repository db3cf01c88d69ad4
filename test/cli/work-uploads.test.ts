// `clino work --drop` on upload jobs, with a stand-in server: each uploaded file is fetched by
// checksum into the worker's drop folder and processed as a dropped file; the job is reported done,
// or failed with the reader's code.
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clino, isolatedEnv } from './support/clino.js';
import { startFakeIngestServer, type FakeIngestServer } from './support/fake-ingest-server.js';
import { DROP_SPEC, priceFile, riskFreeFile } from './support/small-drop-files.js';

let server: FakeIngestServer;

function upload(id: string, fileName: string, text: string): void {
  const bytes = Buffer.from(text);
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  server.uploads.set(sha256, bytes);
  server.jobs.push({ id, kind: 'upload', payload: { fileName, sha256, size: bytes.length, specName: null, uploadId: id } });
}

beforeAll(async () => {
  server = await startFakeIngestServer();
  server.specs.set('drop-test', DROP_SPEC);
});

afterAll(async () => {
  await server.stop();
});

describe('clino work with upload jobs', { timeout: 180_000 }, () => {
  it('runs the spec once the price and risk-free uploads are both in, and reports each job', async () => {
    upload('1', 'rf-0101.csv', riskFreeFile(18));
    upload('2', 'px-0101.csv', priceFile(18));
    upload('3', 'px-bad.csv', 'date,QZ-A,QZ-B,MKT\n2025-01-31,10,20,1000\n2025-02-28,-4,21,1001\n');
    const drop = path.join(mkdtempSync(path.join(tmpdir(), 'clino-work-')), 'drop');
    const env = isolatedEnv({ CLINO_SERVER_URL: server.url, CLINO_TOKEN: server.token });
    const result = await clino(['work', '--once', '--drop', drop], { env });
    expect(result.exitCode).toBe(0);
    expect(server.jobOutcomes.get('1')).toBe('done: rf-0101.csv kept as a market or risk-free input for the runs that need it');
    expect(server.jobOutcomes.get('2')).toBe('done: px-0101.csv processed and archived');
    expect(server.jobOutcomes.get('3')).toBe('failed INPUT_BAD_PRICE: px-bad.csv rejected: price "-4" is not positive (column "QZ-A")');
    expect(server.results).toHaveLength(1);
    expect(existsSync(path.join(drop, 'rejected', 'px-bad.csv.error.txt'))).toBe(true);
    expect(readdirSync(path.join(drop, 'incoming'))).toEqual([]);
  });
});
