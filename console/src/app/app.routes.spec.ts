import { TestBed } from '@angular/core/testing';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { Title } from '@angular/platform-browser';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { appConfig } from './app.config';
import type { Role } from './core/auth/session-person';
import { answerSessionWith, personWithRole } from './core/auth/session-testing';

/** Opens the console at `url` with someone signed in (an admin, who may open every area, unless told). */
async function navigate(url: string, role: Role = 'admin'): Promise<{ root: HTMLElement; router: Router }> {
  TestBed.configureTestingModule({ providers: [...appConfig.providers, provideHttpClientTesting()] });
  await answerSessionWith(personWithRole(role));
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  await harness.fixture.whenStable();
  return { root: harness.fixture.nativeElement as HTMLElement, router: TestBed.inject(Router) };
}

function testId(root: HTMLElement, id: string): Element | null {
  return root.querySelector(`[data-testid="${id}"]`);
}

describe('console routes', () => {
  it('sends an unknown path to the not-found page, keeping the address and the shell', async () => {
    const { root, router } = await navigate('/no/such/page');

    expect(testId(root, 'not-found')).not.toBeNull();
    expect(testId(root, 'not-found-path')?.textContent?.trim()).toBe('/no/such/page');
    expect(router.url).toBe('/no/such/page');
    expect(testId(root, 'shell-title')).not.toBeNull();
    expect(testId(root, 'area-coming')).toBeNull();
    expect(TestBed.inject(Title).getTitle()).toBe('Not found · Clinometer');
  });

  it('opens Runs when the console is entered at its root', async () => {
    const { root, router } = await navigate('/');

    expect(router.url).toBe('/runs');
    expect(testId(root, 'area-status')?.textContent?.trim()).toBe('The Runs area is coming.');
  });

  // DESIGN.md, "Names": the seven console areas.
  it.each([
    ['/runs', 'Runs'],
    ['/specs', 'Specs'],
    ['/uploads', 'Uploads'],
    ['/releases', 'Releases'],
    ['/mailroom', 'Mailroom'],
    ['/people', 'People'],
    ['/audit', 'Audit'],
  ])('loads %s lazily into a page that says the %s area is coming', async (url, label) => {
    const { root } = await navigate(url);

    expect(testId(root, 'area-title')?.textContent?.trim()).toBe(label);
    expect(testId(root, 'area-status')?.textContent?.trim()).toBe(`The ${label} area is coming.`);
    expect(testId(root, 'area-icon')?.textContent?.trim()).not.toBe('');
    expect(testId(root, 'not-found')).toBeNull();
  });

  // server/src/auth/role-matrix.yaml: "GET /api/people": [admin]; "GET /api/audit": [supervisor, admin].
  it.each([
    ['/people', 'viewer', 'People is open to the Admin role; you are signed in as Viewer.'],
    ['/people', 'supervisor', 'People is open to the Admin role; you are signed in as Supervisor.'],
    ['/audit', 'analyst', 'Audit is open to the Supervisor and Admin roles; you are signed in as Analyst.'],
    ['/audit', 'ops', 'Audit is open to the Supervisor and Admin roles; you are signed in as Ops.'],
  ] as const)('tells a person who opens %s as %s that the area is not open to their role', async (url, role, reason) => {
    const { root, router } = await navigate(url, role);

    expect(router.url).toBe(url);
    expect(testId(root, 'no-access-reason')?.textContent?.trim()).toBe(reason);
    expect(testId(root, 'area-coming')).toBeNull();
    expect(TestBed.inject(Title).getTitle()).toBe('Not open to your role · Clinometer');
  });

  it('opens Audit to a supervisor', async () => {
    const { root } = await navigate('/audit', 'supervisor');

    expect(testId(root, 'area-title')?.textContent?.trim()).toBe('Audit');
    expect(testId(root, 'no-access')).toBeNull();
  });

  it('shows the sign-in page on its own, without the shell around it', async () => {
    const { root } = await navigate('/sign-in');

    expect(testId(root, 'sign-in')).not.toBeNull();
    expect(testId(root, 'nav')).toBeNull();
  });
});
