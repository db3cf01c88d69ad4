import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { Session } from './session';
import { SESSION_URL } from './session-api';
import { personWithRole } from './session-testing';

// The session routes as the server answers them (server/src/auth/session.routes.ts and
// session.schemas.ts): GET and POST answer `{ principal: null | { kind: 'person', … } | { kind:
// 'machine', … } }`, DELETE answers 204 No Content (RFC 9110 §15.3.5).
function setUp(): { session: Session; backend: HttpTestingController } {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
  return { session: TestBed.inject(Session), backend: TestBed.inject(HttpTestingController) };
}

const ADMIN = personWithRole('admin');

describe('Session', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('asks GET /api/session once, shares the answer with callers that arrive meanwhile, and keeps it', async () => {
    const { session, backend } = setUp();

    const first = firstValueFrom(session.whenKnown());
    const second = firstValueFrom(session.whenKnown());
    backend.expectOne({ method: 'GET', url: SESSION_URL }).flush({ principal: ADMIN });

    expect(await first).toEqual(ADMIN);
    expect(await second).toEqual(ADMIN);
    expect(await firstValueFrom(session.whenKnown())).toEqual(ADMIN);
    backend.expectNone(SESSION_URL);
    expect(session.person()).toEqual(ADMIN);
    expect(session.role()).toBe('admin');
  });

  it('knows nobody is signed in when the server answers a null principal', async () => {
    const { session, backend } = setUp();

    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: null });

    expect(await known).toBeNull();
    expect(session.person()).toBeNull();
    expect(session.role()).toBeNull();
  });

  it('shows no person for a machine principal, which is not someone at the console', async () => {
    const { session, backend } = setUp();

    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: { kind: 'machine', id: 3, name: 'night-worker' } });

    expect(await known).toBeNull();
  });

  it('ignores a person whose role is not one of the five roles', async () => {
    const { session, backend } = setUp();

    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: { ...ADMIN, role: 'owner' } });

    expect(await known).toBeNull();
  });

  it('counts a failed GET /api/session as nobody signed in, and asks again the next time', async () => {
    const { session, backend } = setUp();

    const failed = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush(null, { status: 503, statusText: 'Service Unavailable' });
    expect(await failed).toBeNull();

    const retried = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: ADMIN });
    expect(await retried).toEqual(ADMIN);
  });

  it('keeps the person named by the answer to POST /api/session after signing in', async () => {
    const { session, backend } = setUp();

    const signedIn = firstValueFrom(session.signIn({ userName: ADMIN.userName, password: 'pass phrase' }));
    backend.expectOne({ method: 'GET', url: SESSION_URL }).flush({ principal: null });
    backend.expectOne({ method: 'POST', url: SESSION_URL }).flush({ principal: ADMIN });

    expect(await signedIn).toEqual(ADMIN);
    expect(session.person()).toEqual(ADMIN);
    expect(await firstValueFrom(session.whenKnown())).toEqual(ADMIN);
  });

  it('fails a sign-in whose answer names nobody, and keeps nobody signed in', async () => {
    const { session, backend } = setUp();

    const signedIn = firstValueFrom(session.signIn({ userName: ADMIN.userName, password: 'pass phrase' }));
    backend.expectOne({ method: 'GET', url: SESSION_URL }).flush({ principal: null });
    backend.expectOne({ method: 'POST', url: SESSION_URL }).flush({});

    await expect(signedIn).rejects.toThrow('did not say who is signed in');
    expect(session.person()).toBeNull();
  });

  it('sends DELETE /api/session to sign out, then knows nobody is signed in without asking again', async () => {
    const { session, backend } = setUp();
    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: ADMIN });
    await known;

    const signedOut = firstValueFrom(session.signOut(), { defaultValue: undefined });
    backend.expectOne({ method: 'DELETE', url: SESSION_URL }).flush(null, { status: 204, statusText: 'No Content' });
    await signedOut;

    expect(session.person()).toBeNull();
    expect(await firstValueFrom(session.whenKnown())).toBeNull();
    backend.expectNone(SESSION_URL);
  });

  it('keeps the person when the server refuses to sign out', async () => {
    const { session, backend } = setUp();
    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: ADMIN });
    await known;

    const signedOut = firstValueFrom(session.signOut(), { defaultValue: undefined });
    backend.expectOne({ method: 'DELETE', url: SESSION_URL }).flush(null, { status: 500, statusText: 'Server Error' });

    await expect(signedOut).rejects.toMatchObject({ status: 500 });
    expect(session.person()).toEqual(ADMIN);
  });

  it('forgets the person when told the server no longer knows the session', async () => {
    const { session, backend } = setUp();
    const known = firstValueFrom(session.whenKnown());
    backend.expectOne(SESSION_URL).flush({ principal: ADMIN });
    await known;

    session.forget();

    expect(session.person()).toBeNull();
    expect(await firstValueFrom(session.whenKnown())).toBeNull();
  });
});
