// The client of the Clinometer server: base URL, the machine token as `Authorization: Bearer`,
// JSON in and out, the error envelope turned into a CliError with the server's code, and a server
// that cannot be reached turned into SERVER_UNREACHABLE (which the outbox retries).
import { errorEnvelopeSchema } from '../../../server/src/contracts/errors.js';
import { CliError } from '../errors/cli-error.js';

export interface RequestOptions {
  readonly json?: unknown;
  readonly body?: Uint8Array;
  readonly contentType?: string;
  readonly idempotencyKey?: string;
  /** Answer statuses that are not errors for this call (e.g. 404 when "absent" is an answer). */
  readonly accept?: readonly number[];
}

export interface ServerAnswer {
  readonly status: number;
  readonly body: Uint8Array;
  readonly contentType: string;
  json(): unknown;
  text(): string;
}

export interface ServerClient {
  readonly baseUrl: string;
  request(method: string, path: string, options?: RequestOptions): Promise<ServerAnswer>;
}

export type Fetch = typeof fetch;

function answerOf(status: number, body: Uint8Array, contentType: string): ServerAnswer {
  const text = (): string => Buffer.from(body).toString('utf8');
  return { status, body, contentType, text, json: () => JSON.parse(text()) as unknown };
}

function refusal(answer: ServerAnswer, method: string, path: string): CliError {
  let parsed: ReturnType<typeof errorEnvelopeSchema.safeParse> | undefined;
  try {
    parsed = errorEnvelopeSchema.safeParse(answer.json());
  } catch {
    parsed = undefined;
  }
  if (parsed?.success === true) {
    const { code, message, details } = parsed.data.error;
    const hint = code === 'UNAUTHENTICATED' ? 'run clino login <server-url> with a machine token, or set CLINO_TOKEN' : undefined;
    return new CliError(code, `${method} ${path}: ${message}`, { hint, details });
  }
  const code = answer.status === 401 ? 'UNAUTHENTICATED' : answer.status === 403 ? 'FORBIDDEN' : answer.status === 404 ? 'NOT_FOUND' : 'INTERNAL';
  return new CliError(code, `${method} ${path}: the server answered ${answer.status}`);
}

function unreachable(baseUrl: string, error: unknown): CliError {
  const cause = (error as { cause?: { code?: string; message?: string } }).cause;
  const reason = cause?.code ?? cause?.message ?? (error as Error).message;
  return new CliError('SERVER_UNREACHABLE', `cannot reach the server at ${baseUrl} (${reason})`, {
    hint: 'check the URL (--server, CLINO_SERVER_URL or clino login) and that the server is running',
  });
}

export function createServerClient(baseUrl: string, token: string | undefined, fetchImpl: Fetch = fetch): ServerClient {
  return {
    baseUrl,
    async request(method, path, options = {}) {
      const headers: Record<string, string> = { accept: 'application/json, text/csv, application/octet-stream' };
      if (token !== undefined) headers['authorization'] = `Bearer ${token}`;
      if (options.idempotencyKey !== undefined) headers['idempotency-key'] = options.idempotencyKey;
      let body: string | Blob | undefined = options.body === undefined ? undefined : new Blob([Buffer.from(options.body)]);
      if (options.json !== undefined) {
        headers['content-type'] = 'application/json';
        body = JSON.stringify(options.json);
      } else if (body !== undefined) {
        headers['content-type'] = options.contentType ?? 'application/octet-stream';
      }
      let response: Response;
      try {
        response = await fetchImpl(`${baseUrl}${path}`, { method, headers, body });
      } catch (error) {
        throw unreachable(baseUrl, error);
      }
      const answer = answerOf(response.status, new Uint8Array(await response.arrayBuffer()), response.headers.get('content-type') ?? '');
      if (response.ok || options.accept?.includes(response.status) === true) return answer;
      if (response.status === 502 || response.status === 503 || response.status === 504) {
        throw new CliError('SERVER_UNREACHABLE', `${method} ${path}: the server is unavailable (${response.status})`);
      }
      throw refusal(answer, method, path);
    },
  };
}

/** A client that needs the token: fails early with a hint when none is configured. */
export function requireToken(token: string | undefined): string {
  if (token !== undefined) return token;
  throw new CliError('NOT_LOGGED_IN', 'no machine token is configured', {
    hint: 'run clino login <server-url>, or set CLINO_TOKEN',
  });
}
