import { TestBed } from '@angular/core/testing';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { Title } from '@angular/platform-browser';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { appConfig } from './app.config';
import { answerSessionWith, personWithRole } from './core/auth/session-testing';

/** Opens the console at `url` with an admin signed in, so every area's route can be reached. */
async function navigate(url: string): Promise<{ root: HTMLElement; router: Router }> {
  TestBed.configureTestingModule({ providers: [...appConfig.providers, provideHttpClientTesting()] });
  await answerSessionWith(personWithRole('admin'));
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

  it('shows the sign-in page on its own, without the shell around it', async () => {
    const { root } = await navigate('/sign-in');

    expect(testId(root, 'sign-in')).not.toBeNull();
    expect(testId(root, 'nav')).toBeNull();
  });
});
