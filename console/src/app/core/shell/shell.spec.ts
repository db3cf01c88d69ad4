import { TestBed } from '@angular/core/testing';
import { BreakpointObserver, type BreakpointState } from '@angular/cdk/layout';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { of } from 'rxjs';
import { appConfig } from '../../app.config';
import { Session } from '../auth/session';
import { SESSION_URL } from '../auth/session-api';
import type { SessionPerson } from '../auth/session-person';
import { answerSessionWith, personWithRole } from '../auth/session-testing';

// The console's areas and their order: DESIGN.md, "Names" ("Console areas: Runs, Specs, Uploads,
// Releases, Mailroom, People, Audit"); each area lives under its own lower-case path.
const EXPECTED_AREAS = [
  { label: 'Runs', href: '/runs' },
  { label: 'Specs', href: '/specs' },
  { label: 'Uploads', href: '/uploads' },
  { label: 'Releases', href: '/releases' },
  { label: 'Mailroom', href: '/mailroom' },
  { label: 'People', href: '/people' },
  { label: 'Audit', href: '/audit' },
] as const;

const ADMIN = personWithRole('admin');

interface OpenShell {
  root: HTMLElement;
  harness: RouterTestingHarness;
  backend: HttpTestingController;
}

/** A screen on which only the media queries for which `matches` answers true hold. */
function screenWhere(matches: (query: string) => boolean): { provide: typeof BreakpointObserver; useValue: Pick<BreakpointObserver, 'observe'> } {
  const observe = (query: string | readonly string[]) => {
    const queries = typeof query === 'string' ? [query] : query;
    const state: BreakpointState = { matches: queries.some(matches), breakpoints: {} };
    return of(state);
  };
  return { provide: BreakpointObserver, useValue: { observe } };
}

async function openShellAs(person: SessionPerson, url = '/runs', screen = screenWhere(() => false)): Promise<OpenShell> {
  TestBed.configureTestingModule({ providers: [...appConfig.providers, provideHttpClientTesting(), screen] });
  await answerSessionWith(person);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  await harness.fixture.whenStable();
  return { root: harness.fixture.nativeElement as HTMLElement, harness, backend: TestBed.inject(HttpTestingController) };
}

async function openShellAt(url: string): Promise<HTMLElement> {
  return (await openShellAs(ADMIN, url)).root;
}

function navLinks(root: HTMLElement): HTMLAnchorElement[] {
  return Array.from(root.querySelectorAll<HTMLAnchorElement>('[data-testid="nav"] a'));
}

function navLabels(root: HTMLElement): string[] {
  return navLinks(root).map((link) => link.querySelector('[matListItemTitle]')?.textContent?.trim() ?? '');
}

function testId(root: HTMLElement, id: string): HTMLElement | null {
  return root.querySelector<HTMLElement>(`[data-testid="${id}"]`);
}

describe('Shell', () => {
  it('shows the product name Clinometer in the toolbar', async () => {
    const root = await openShellAt('/runs');

    const title = root.querySelector('mat-toolbar [data-testid="shell-title"]');
    expect(title?.textContent?.trim()).toBe('Clinometer');
  });

  it('lists the seven areas in order to an admin, each linking to its own path', async () => {
    const root = await openShellAt('/runs');

    const links = navLinks(root).map((link) => ({
      label: link.querySelector('[matListItemTitle]')?.textContent?.trim(),
      href: link.getAttribute('href'),
    }));
    expect(links).toEqual(EXPECTED_AREAS);
  });

  it('gives every navigation entry an icon drawn with the shipped Material Symbols font', async () => {
    const root = await openShellAt('/runs');

    const icons = navLinks(root).map((link) => link.querySelector('mat-icon'));
    expect(icons).toHaveLength(EXPECTED_AREAS.length);
    for (const icon of icons) {
      // Material Symbols draws a glyph from the ligature name inside the element (common practice).
      expect(icon?.classList).toContain('material-symbols-outlined');
      expect(icon?.textContent?.trim()).toMatch(/^[a-z_]+$/);
    }
  });

  it('marks the link of the area being shown as the current page, and only that one', async () => {
    const root = await openShellAt('/mailroom');

    const current = navLinks(root).filter((link) => link.getAttribute('aria-current') === 'page');
    expect(current.map((link) => link.getAttribute('href'))).toEqual(['/mailroom']);
  });

  it('shows the cautions in the footer of every page', async () => {
    const root = await openShellAt('/audit');

    // DESIGN.md, "Cautions the product shows".
    const text = root.querySelector('[data-testid="cautions"]')?.textContent ?? '';
    expect(text).toContain('estimates from a sample and a model');
    expect(text).toContain('CAPM rests on strong assumptions');
    expect(text).toContain('only a proxy for the market portfolio');
    expect(text).toContain('historical betas may not hold going forward');
    expect(text).toContain('not investment advice');
  });
  it('shows the signed-in person’s display name and role in the toolbar, and no Sign in link', async () => {
    const { root } = await openShellAs(personWithRole('supervisor'));

    expect(testId(root, 'shell-person-name')?.textContent?.trim()).toBe('Lu Okonkwe');
    expect(testId(root, 'shell-person-role')?.textContent?.trim()).toBe('Supervisor');
    expect(testId(root, 'shell-sign-out')?.textContent?.trim()).toContain('Sign out');
    expect(testId(root, 'shell-sign-in')).toBeNull();
  });

  it('signs out with DELETE /api/session, then goes to the sign-in page', async () => {
    const { root, harness, backend } = await openShellAs(ADMIN);

    testId(root, 'shell-sign-out')?.click();
    // RFC 9110 §15.3.5: 204 No Content, the server's answer to a sign-out.
    backend.expectOne({ method: 'DELETE', url: SESSION_URL }).flush(null, { status: 204, statusText: 'No Content' });
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/sign-in');
    expect(TestBed.inject(Session).person()).toBeNull();
    expect(testId(root, 'sign-in')).not.toBeNull();
  });

  it('stays signed in, and says so, when the server fails to sign out', async () => {
    const { root, harness, backend } = await openShellAs(ADMIN);

    testId(root, 'shell-sign-out')?.click();
    backend
      .expectOne({ method: 'DELETE', url: SESSION_URL })
      .flush(
        // server/src/auth/csrf.ts: a write without a matching X-XSRF-TOKEN header.
        { error: { code: 'CSRF_REJECTED', message: 'The X-XSRF-TOKEN header is missing or does not match' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await harness.fixture.whenStable();

    expect(testId(root, 'shell-sign-out-error')?.textContent).toContain(
      'Signing out failed. The X-XSRF-TOKEN header is missing or does not match',
    );
    expect(TestBed.inject(Router).url).toBe('/runs');
    expect(testId(root, 'shell-person-name')?.textContent?.trim()).toBe(ADMIN.displayName);
    expect((testId(root, 'shell-sign-out') as HTMLButtonElement | null)?.disabled).toBe(false);
  });

  it('offers Sign in instead of the person once the session is forgotten', async () => {
    const { root, harness } = await openShellAs(ADMIN);

    TestBed.inject(Session).forget();
    await harness.fixture.whenStable();

    expect(testId(root, 'shell-sign-in')?.getAttribute('href')).toBe('/sign-in');
    expect(testId(root, 'shell-person')).toBeNull();
    expect(testId(root, 'shell-sign-out')).toBeNull();
  });

  // server/src/auth/role-matrix.yaml: "GET /api/people": [admin]; "GET /api/audit": [supervisor, admin].
  it('hides People and Audit from a viewer', async () => {
    const { root } = await openShellAs(personWithRole('viewer'));

    expect(navLabels(root)).toEqual(['Runs', 'Specs', 'Uploads', 'Releases', 'Mailroom']);
  });

  it('shows People and Audit to an admin', async () => {
    const { root } = await openShellAs(ADMIN);

    expect(navLabels(root)).toEqual(EXPECTED_AREAS.map((area) => area.label));
  });

  it('shows Audit but not People to a supervisor', async () => {
    const { root } = await openShellAs(personWithRole('supervisor'));

    expect(navLabels(root)).toEqual(['Runs', 'Specs', 'Uploads', 'Releases', 'Mailroom', 'Audit']);
  });
  it('keeps sign-out on a phone as an icon button that still says "Sign out" to assistive technology', async () => {
    const { root } = await openShellAs(ADMIN, '/runs', screenWhere((query) => query.includes('max-width')));

    const button = testId(root, 'shell-sign-out');
    expect(button?.getAttribute('aria-label')).toBe('Sign out');
    expect(button?.textContent?.trim()).toBe('logout');
    expect(testId(root, 'shell-person-role')?.textContent?.trim()).toBe('Admin');
  });
});
