import { createHash } from 'node:crypto';
import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import { AppError, ValidationError } from '../shared/errors.js';
import { IdempotencyRecord } from './idempotency-record.model.js';

export interface Answer {
  status: number;
  body: Record<string, unknown>;
}

const KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;

/** The request's Idempotency-Key header: printable ASCII, at most 200 characters. */
export function idempotencyKeyOf(req: Request, required: boolean): string | undefined {
  const key = req.get('idempotency-key');
  if (key === undefined || key === '') {
    if (required) throw new ValidationError('This request needs an Idempotency-Key header (e.g. a UUID)');
    return undefined;
  }
  if (!KEY_PATTERN.test(key)) throw new ValidationError('The Idempotency-Key header must be 1 to 200 printable ASCII characters');
  return key;
}

/**
 * Runs `produce` once per (scope, key), inside the caller's transaction; the same key again answers
 * what the first request answered, without doing anything. The same key with a different body is a
 * client bug and is refused. Callers lock the entity the scope names first, so two requests with
 * one key run one after the other.
 */
export async function oncePerKey(
  transaction: Transaction,
  scope: string,
  key: string | undefined,
  requestBody: unknown,
  produce: () => Promise<Answer>,
): Promise<Answer> {
  if (key === undefined) return produce();
  const requestSha256 = createHash('sha256').update(JSON.stringify(requestBody ?? null)).digest('hex');
  const earlier = await IdempotencyRecord.findOne({ where: { scope, idempotencyKey: key }, transaction, lock: transaction.LOCK.UPDATE });
  if (earlier) {
    if (earlier.requestSha256 !== requestSha256) {
      throw new AppError(409, 'IDEMPOTENCY_KEY_REUSED', 'This Idempotency-Key was already used with a different request body');
    }
    return { status: earlier.responseStatus, body: earlier.responseBody };
  }
  const answer = await produce();
  await IdempotencyRecord.create({ scope, idempotencyKey: key, requestSha256, responseStatus: answer.status, responseBody: answer.body }, { transaction });
  return answer;
}
