import { TestBed } from '@angular/core/testing';
import { HttpClient, HttpErrorResponse, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { Session } from './session';
import { SESSION_URL } from './session-api';
import { personWithRole } from './session-testing';
import { unauthorizedInterceptor } from './unauthorized-interceptor';

function setUp(): { http: HttpClient; backend: HttpTestingController; navigate: ReturnType<typeof vi.fn> } {
  TestBed.configureTestingModule({
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([unauthorizedInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const navigate = vi.fn().mockResolvedValue(true);
  vi.spyOn(TestBed.inject(Router), 'navigate').mockImplementation(navigate);
  return { http: TestBed.inject(HttpClient), backend: TestBed.inject(HttpTestingController), navigate };
}

async function failure(pending: Promise<unknown>): Promise<HttpErrorResponse> {
  try {
    await pending;
  } catch (error: unknown) {
    if (error instanceof HttpErrorResponse) {
      return error;
    }
    throw error;
  }
  throw new Error('The request was expected to fail.');
}

// RFC 9110 §15.5.2: 401 Unauthorized means the request lacks valid authentication credentials.
describe('unauthorizedInterceptor', () => {
  it('sends the person to sign in, with a way back, when a request answers 401', async () => {
    const { http, backend, navigate } = setUp();

    const pending = firstValueFrom(http.get('/api/runs'));
    backend.expectOne('/api/runs').flush(null, { status: 401, statusText: 'Unauthorized' });

    expect((await failure(pending)).status).toBe(401);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/' } });
  });

  it('forgets the signed-in person when a request answers 401', async () => {
    const { http, backend } = setUp();
    const session = TestBed.inject(Session);
    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: personWithRole('analyst') });
    await known;

    const pending = firstValueFrom(http.get('/api/specs'));
    backend.expectOne('/api/specs').flush(null, { status: 401, statusText: 'Unauthorized' });
    await failure(pending);

    expect(session.person()).toBeNull();
  });

  it('leaves a refused sign-in to the sign-in form', async () => {
    const { http, backend, navigate } = setUp();

    const pending = firstValueFrom(http.post('/api/session', { userName: 'a', password: 'b' }));
    backend.expectOne('/api/session').flush(null, { status: 401, statusText: 'Unauthorized' });

    expect((await failure(pending)).status).toBe(401);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('passes other errors to the caller without navigating', async () => {
    const { http, backend, navigate } = setUp();

    const pending = firstValueFrom(http.get('/api/runs'));
    backend.expectOne('/api/runs').flush(null, { status: 403, statusText: 'Forbidden' });

    expect((await failure(pending)).status).toBe(403);
    expect(navigate).not.toHaveBeenCalled();
  });
});
