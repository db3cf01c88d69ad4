import { HttpErrorResponse } from '@angular/common/http';
import { errorMessage } from './error-message';

describe('errorMessage', () => {
  it('uses the message of the server error envelope', () => {
    const error = new HttpErrorResponse({
      status: 409,
      statusText: 'Conflict',
      error: { error: { code: 'RUN_NOT_RELEASABLE', message: 'The run is still in review.' } },
    });

    expect(errorMessage(error)).toBe('The run is still in review.');
  });

  // Angular reports a request that never reached a server with status 0 (angular.dev, HttpErrorResponse).
  it('says the server cannot be reached when no answer came back', () => {
    expect(errorMessage(new HttpErrorResponse({ status: 0 }))).toBe(
      'The Clinometer server cannot be reached. Check the connection and try again.',
    );
  });

  it('names the HTTP status when the body is not an error envelope', () => {
    const error = new HttpErrorResponse({ status: 502, statusText: 'Bad Gateway', error: '<html>' });

    expect(errorMessage(error)).toBe('The server answered 502 Bad Gateway.');
  });

  // Angular's HttpClient reports an unparsable JSON body as an HttpErrorResponse that keeps the 2xx
  // status, with `error: { error, text }` [memory].
  it('says the answer could not be read when a successful status carries a body that is not JSON', () => {
    const error = new HttpErrorResponse({
      status: 200,
      statusText: 'OK',
      error: { error: new SyntaxError('Unexpected token <'), text: '<!doctype html>' },
    });

    expect(errorMessage(error)).toBe(
      'The server’s answer could not be read. Is /api served by the Clinometer server?',
    );
  });

  it('gives a general sentence for an error that did not come from HTTP', () => {
    expect(errorMessage(new Error('boom'))).toBe('Something went wrong. Please try again.');
  });
});
