import { HttpErrorResponse } from '@angular/common/http';
import type { ErrorBody } from '@contracts/errors.js';

/** The part of the server's error envelope (`{ error: { code, message, details? } }`) shown to people. */
interface EnvelopeMessage {
  readonly error: Pick<ErrorBody, 'message'>;
}

function isErrorEnvelope(body: unknown): body is EnvelopeMessage {
  if (typeof body !== 'object' || body === null || !('error' in body)) {
    return false;
  }
  const inner: unknown = body.error;
  return (
    typeof inner === 'object' &&
    inner !== null &&
    'message' in inner &&
    typeof inner.message === 'string' &&
    'code' in inner &&
    typeof inner.code === 'string'
  );
}

/** A sentence for a person, from whatever a failed request produced. */
export function errorMessage(error: unknown): string {
  if (!(error instanceof HttpErrorResponse)) {
    return 'Something went wrong. Please try again.';
  }
  if (error.status === 0) {
    return 'The Clinometer server cannot be reached. Check the connection and try again.';
  }
  if (error.status >= 200 && error.status < 300) {
    // HttpClient reports a body it could not parse as JSON as an error carrying the 2xx status.
    return 'The server’s answer could not be read. Is /api served by the Clinometer server?';
  }
  if (isErrorEnvelope(error.error)) {
    return error.error.error.message;
  }
  const status = [String(error.status), error.statusText].filter((part) => part !== '').join(' ');
  return `The server answered ${status}.`;
}
