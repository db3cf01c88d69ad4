import { TestBed } from '@angular/core/testing';
import { HttpTestingController, type TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { appConfig } from '../../app.config';
import { SESSION_URL } from './session-api';
import type { SessionPerson } from './session-person';
import { personWithRole } from './session-testing';

interface Visit {
  root: HTMLElement;
  router: Router;
  backend: HttpTestingController;
}

/** Opens the console at `url` as it starts in a browser: the guard asks GET /api/session, answered here. */
async function startAt(url: string, answer: (request: TestRequest) => void): Promise<Visit> {
  TestBed.configureTestingModule({ providers: [...appConfig.providers, provideHttpClientTesting()] });
  const backend = TestBed.inject(HttpTestingController);
  const harness = await RouterTestingHarness.create();
  const navigation = harness.navigateByUrl(url);
  await vi.waitFor(() => answer(backend.expectOne({ method: 'GET', url: SESSION_URL })));
  await navigation;
  await harness.fixture.whenStable();
  return { root: harness.fixture.nativeElement as HTMLElement, router: TestBed.inject(Router), backend };
}

function signedInAs(person: SessionPerson | null): (request: TestRequest) => void {
  return (request: TestRequest) => request.flush({ principal: person });
}

function testId(root: HTMLElement, id: string): Element | null {
  return root.querySelector(`[data-testid="${id}"]`);
}

// Common practice for a signed-in area: an anonymous visitor is sent to the sign-in page with the
// address asked for (angular.dev, "Route guards": a guard may answer with a UrlTree to redirect).
describe('signedInGuard', () => {
  it('sends a visitor nobody has signed in to /sign-in, with the address asked for as returnUrl', async () => {
    const { root, router } = await startAt('/specs', signedInAs(null));

    expect(router.url).toBe('/sign-in?returnUrl=%2Fspecs');
    expect(testId(root, 'sign-in')).not.toBeNull();
    expect(testId(root, 'nav')).toBeNull();
  });

  it('keeps the query of the address asked for inside returnUrl', async () => {
    const { router } = await startAt('/runs?state=failed', signedInAs(null));

    expect(router.parseUrl(router.url).queryParams).toEqual({ returnUrl: '/runs?state=failed' });
  });

  it('sends a visitor nobody has signed in from a role-restricted area to sign in, not to the refusal', async () => {
    const { root, router } = await startAt('/audit', signedInAs(null));

    expect(router.url).toBe('/sign-in?returnUrl=%2Faudit');
    expect(testId(root, 'no-access')).toBeNull();
  });

  it('lets a signed-in person through to the area asked for', async () => {
    const { root, router } = await startAt('/specs', signedInAs(personWithRole('viewer')));

    expect(router.url).toBe('/specs');
    expect(testId(root, 'area-title')?.textContent?.trim()).toBe('Specs');
  });

  it('sends the visitor to sign in when the session cannot be asked for', async () => {
    const { router } = await startAt(
      '/releases',
      (request) => request.flush(null, { status: 503, statusText: 'Service Unavailable' }),
    );

    expect(router.url).toBe('/sign-in?returnUrl=%2Freleases');
  });

  it('asks the server only once while the person moves between areas', async () => {
    const { root, router, backend } = await startAt('/runs', signedInAs(personWithRole('analyst')));

    await router.navigateByUrl('/uploads');

    backend.expectNone(SESSION_URL);
    expect(router.url).toBe('/uploads');
    expect(testId(root, 'nav')).not.toBeNull();
  });
});
