import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { AppError, NotFoundError } from './errors.js';

/** Requests that matched no route under /api. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`No route for ${req.method} ${req.path}`));
};

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
}

/** Errors raised by Express's own body parsers carry a status and a type. */
function fromHttpError(err: HttpishError): AppError | undefined {
  const status = err.status ?? err.statusCode;
  if (!status || status < 400 || status >= 500 || !err.expose) return undefined;
  if (err.type === 'entity.too.large') return new AppError(413, 'PAYLOAD_TOO_LARGE', 'The request body is too large');
  if (err.type === 'entity.parse.failed') return new AppError(400, 'VALIDATION_FAILED', 'The request body is not valid JSON');
  return new AppError(status, 'VALIDATION_FAILED', 'The request could not be read');
}

/** One error middleware for the whole API: the envelope, no stacks, unknown errors logged. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err: unknown, req, res, _next) => {
    const known = err instanceof AppError ? err : fromHttpError(err as HttpishError);
    if (known) {
      const body = { error: { code: known.code, message: known.message, ...(known.details === undefined ? {} : { details: known.details }) } };
      res.status(known.status).json(body);
      return;
    }
    const requestId = res.getHeader('x-request-id');
    logger.error({ err, requestId, method: req.method, url: req.originalUrl }, 'unexpected error');
    res.status(500).json({ error: { code: 'INTERNAL', message: `Unexpected error (request ${String(requestId ?? '-')})` } });
  };
}
