import { createHash, randomBytes } from 'node:crypto';

/** Machine tokens carry this prefix so a leaked one is easy to recognise in logs and secret scanners. */
export const MACHINE_TOKEN_PREFIX = 'clino_';

/** A new token value: 32 random bytes, base64url. Shown once; only its sha256 is kept. */
export function newMachineTokenValue(): string {
  return `${MACHINE_TOKEN_PREFIX}${randomBytes(32).toString('base64url')}`;
}

export function machineTokenSha256(value: string): string {
  return createHash('sha256').update(value, 'utf8').digest('hex');
}

/** The token of an `Authorization: Bearer <token>` header; undefined when the header is absent or of another scheme. */
export function bearerTokenOf(authorization: string | undefined): string | undefined {
  if (!authorization) return undefined;
  const match = /^Bearer[ \t]+(.*)$/i.exec(authorization.trim());
  return match ? (match[1] ?? '').trim() : undefined;
}
