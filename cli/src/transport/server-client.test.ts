import { describe, expect, it } from 'vitest';
import { CliError } from '../errors/cli-error.js';
import { createServerClient, type Fetch } from './server-client.js';

function fakeFetch(status: number, body: unknown, seen: { url?: string; init?: RequestInit }[] = []): Fetch {
  return (async (url: string | URL | Request, init?: RequestInit) => {
    seen.push({ url: String(url), init });
    return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
  }) as Fetch;
}

describe('the server client', () => {
  it('sends the machine token as a bearer token and the idempotency key as a header', async () => {
    const seen: { url?: string; init?: RequestInit }[] = [];
    await createServerClient('http://h.invalid', 'clino_abc', fakeFetch(200, {}, seen)).request('POST', '/api/x', { json: { a: 1 }, idempotencyKey: 'k1' });
    const headers = seen[0]!.init!.headers as Record<string, string>;
    expect(seen[0]!.url).toBe('http://h.invalid/api/x');
    expect(headers['authorization']).toBe('Bearer clino_abc');
    expect(headers['idempotency-key']).toBe('k1');
  });

  it('turns the error envelope into an error with the server\'s code', async () => {
    const client = createServerClient('http://h.invalid', 't', fakeFetch(404, { error: { code: 'SPEC_UNKNOWN', message: 'not held' } }));
    const attempt = client.request('POST', '/api/runs', { json: {} });
    await expect(attempt).rejects.toMatchObject({ code: 'SPEC_UNKNOWN', message: 'POST /api/runs: not held' });
  });

  it('reports a server it cannot reach as SERVER_UNREACHABLE', async () => {
    const failing = (async () => {
      throw new TypeError('fetch failed', { cause: { code: 'ECONNREFUSED' } });
    }) as Fetch;
    const attempt = createServerClient('http://127.0.0.1:9', 't', failing).request('GET', '/api/specs');
    await expect(attempt).rejects.toBeInstanceOf(CliError);
    await expect(attempt).rejects.toMatchObject({ code: 'SERVER_UNREACHABLE', message: 'cannot reach the server at http://127.0.0.1:9 (ECONNREFUSED)' });
  });
});
