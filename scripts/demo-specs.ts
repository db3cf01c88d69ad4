// The start script's part for the demo specs: signs in to the server as the demo analyst (a person,
// so the revisions carry the analyst's name and four eyes apply) and pushes every spec of
// samples/specs/. A spec whose text the server holds already makes no new revision.
//
//   node --import tsx scripts/demo-specs.ts [server-url]     (default http://127.0.0.1:8640)
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';

export const DEMO_ANALYST = { userName: 'ben.analyst', password: 'demo-analyst-pass' };

class CookieJar {
  private readonly cookies = new Map<string, string>();

  take(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at).trim(), pair!.slice(at + 1).trim());
    }
  }

  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  get(name: string): string {
    return decodeURIComponent(this.cookies.get(name) ?? '');
  }
}

async function call(jar: CookieJar, url: string, method: string, body?: unknown): Promise<unknown> {
  const headers: Record<string, string> = { cookie: jar.header(), 'x-xsrf-token': jar.get('XSRF-TOKEN') };
  if (body !== undefined) headers['content-type'] = 'application/json';
  const response = await fetch(url, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
  jar.take(response);
  const answer = (await response.json()) as unknown;
  if (!response.ok) throw new Error(`${method} ${url}: ${response.status} ${JSON.stringify(answer)}`);
  return answer;
}

/** Pushes each sample spec as the demo analyst; answers `name revision N (new|unchanged)` lines. */
export async function pushDemoSpecs(serverUrl: string, specsFolder: string): Promise<string[]> {
  const jar = new CookieJar();
  await call(jar, `${serverUrl}/api/session`, 'GET');
  await call(jar, `${serverUrl}/api/session`, 'POST', DEMO_ANALYST);
  const lines: string[] = [];
  for (const file of readdirSync(specsFolder).filter((name) => name.endsWith('.yaml')).sort()) {
    const text = readFileSync(path.join(specsFolder, file), 'utf8');
    const pushed = (await call(jar, `${serverUrl}/api/specs`, 'POST', { text, file })) as { name: string; created: boolean; revision: { number: number } };
    lines.push(`${pushed.name} revision ${pushed.revision.number} (${pushed.created ? 'new' : 'unchanged'})`);
  }
  await call(jar, `${serverUrl}/api/session`, 'DELETE').catch(() => undefined);
  return lines;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const root = path.join(import.meta.dirname, '..');
  const lines = await pushDemoSpecs(process.argv[2] ?? 'http://127.0.0.1:8640', path.join(root, 'samples/specs'));
  process.stdout.write(`${lines.join('\n')}\n`);
}
