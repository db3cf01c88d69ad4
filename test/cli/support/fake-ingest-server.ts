// A stand-in for the server's ingest routes, for watcher tests that must switch the server off and on:
// bearer check, create run (once per Idempotency-Key), content-addressed uploads (checked against
// their sha256), computing, results stored once per key. It records what it was sent.
import { createHash } from 'node:crypto';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface StoredResults {
  readonly runId: string;
  readonly key: string;
  readonly body: { rows: { security: string | null; n: number | null }[]; series: unknown[] };
}

export interface FakeJob {
  readonly id: string;
  readonly kind: 'rerun' | 'upload';
  readonly payload: Record<string, unknown>;
}

export interface FakeIngestServer {
  readonly url: string;
  readonly token: string;
  readonly runs: Map<string, { runId: string; body: unknown }>;
  readonly results: StoredResults[];
  readonly uploads: Map<string, Buffer>;
  /** Queued jobs (claimed in order) and how each ended: `done: …` or `failed CODE: …`. */
  readonly jobs: FakeJob[];
  readonly jobOutcomes: Map<string, string>;
  /** Spec texts by name, answered by GET /api/specs and GET /api/specs/:name. */
  readonly specs: Map<string, string>;
  /** Every request as `METHOD path`. */
  readonly requests: string[];
  stop(): Promise<void>;
  start(): Promise<void>;
}

async function bodyOf(req: IncomingMessage): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

function send(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'content-type': 'application/json' }).end(JSON.stringify(body));
}

export async function startFakeIngestServer(token = 'clino_test-token'): Promise<FakeIngestServer> {
  const state = {
    runs: new Map<string, { runId: string; body: unknown }>(), results: [] as StoredResults[], uploads: new Map<string, Buffer>(), requests: [] as string[],
    jobs: [] as FakeJob[], jobOutcomes: new Map<string, string>(), specs: new Map<string, string>(),
  };
  let nextRun = 1;
  const claimed = new Set<string>();
  const specSummary = (name: string) => ({
    name, description: null, revisionCount: 1,
    latest: { number: 1, sha256: createHash('sha256').update(state.specs.get(name) ?? '').digest('hex'), authorName: 'test', createdAt: '2026-12-01T00:00:00.000Z' },
  });
  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = req.url ?? '/';
    state.requests.push(`${req.method} ${url}`);
    if (req.headers.authorization !== `Bearer ${token}`) return send(res, 401, { error: { code: 'UNAUTHENTICATED', message: 'no token' } });
    const body = await bodyOf(req);
    const key = String(req.headers['idempotency-key'] ?? '');
    if (req.method === 'GET' && url === '/api/specs') return send(res, 200, { items: [...state.specs.keys()].map(specSummary) });
    const specByName = /^\/api\/specs\/([^/]+)$/.exec(url);
    if (req.method === 'GET' && specByName && state.specs.has(specByName[1]!)) {
      const name = specByName[1]!;
      return send(res, 200, { ...specSummary(name), current: { ...specSummary(name).latest, specName: name, text: state.specs.get(name) } });
    }
    if (req.method === 'POST' && url === '/api/jobs/claim') {
      const job = state.jobs.find((j) => !state.jobOutcomes.has(j.id) && !claimed.has(j.id));
      if (job === undefined) return void res.writeHead(204).end();
      claimed.add(job.id);
      return send(res, 200, job);
    }
    const finished = /^\/api\/jobs\/(\d+)\/(done|failed)$/.exec(url);
    if (req.method === 'POST' && finished) {
      const answer = JSON.parse(body.toString('utf8')) as { code?: string; message?: string; outcome?: string };
      state.jobOutcomes.set(finished[1]!, finished[2] === 'done' ? `done: ${answer.outcome ?? ''}` : `failed ${answer.code}: ${answer.message}`);
      return send(res, 200, {});
    }
    const download = /^\/api\/inputs\/([0-9a-f]{64})$/.exec(url);
    if (req.method === 'GET' && download && state.uploads.has(download[1]!)) {
      return void res.writeHead(200, { 'content-type': 'application/octet-stream' }).end(state.uploads.get(download[1]!));
    }
    if (req.method === 'GET' && url.startsWith('/api/runs?')) return send(res, 200, { items: [], page: 1, pageSize: 1, total: 0 });
    if (req.method === 'POST' && url === '/api/runs') {
      const request = JSON.parse(body.toString('utf8')) as { inputs: { sha256: string }[] };
      const earlier = state.runs.get(key) ?? { runId: String(nextRun++), body: request };
      state.runs.set(key, earlier);
      const missing = request.inputs.map((i) => i.sha256).filter((sha) => !state.uploads.has(sha));
      return send(res, 201, { runId: earlier.runId, attempt: 1, state: 'received', missingInputs: [...new Set(missing)] });
    }
    const upload = /^\/api\/inputs\/([0-9a-f]{64})$/.exec(url);
    if (req.method === 'PUT' && upload) {
      if (createHash('sha256').update(body).digest('hex') !== upload[1]) return send(res, 400, { error: { code: 'VALIDATION_FAILED', message: 'checksum' } });
      state.uploads.set(upload[1]!, body);
      return send(res, 201, {});
    }
    if (req.method === 'POST' && /^\/api\/runs\/\d+\/computing$/.test(url)) return send(res, 200, {});
    const results = /^\/api\/runs\/(\d+)\/results$/.exec(url);
    if (req.method === 'POST' && results) {
      if (!state.results.some((r) => r.key === key)) state.results.push({ runId: results[1]!, key, body: JSON.parse(body.toString('utf8')) as StoredResults['body'] });
      return send(res, 200, { runId: results[1], state: 'in-review' });
    }
    return send(res, 404, { error: { code: 'NOT_FOUND', message: url } });
  }
  let server: Server = createServer((req, res) => void handle(req, res));
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    token,
    ...state,
    stop: () => new Promise<void>((resolve) => {
      server.closeAllConnections();
      server.close(() => resolve());
    }),
    start: async () => {
      server = createServer((req, res) => void handle(req, res));
      await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
    },
  };
}
