import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { Session } from '../auth/session';
import { personWithRole } from '../auth/session-testing';
import { provideIconFont } from '../icon-font';
import { SignIn } from './sign-in';

interface Page {
  fixture: ComponentFixture<SignIn>;
  http: HttpTestingController;
  navigateByUrl: ReturnType<typeof vi.fn>;
}

async function openSignIn(returnUrl?: string): Promise<Page> {
  TestBed.configureTestingModule({
    providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), provideIconFont()],
  });
  const navigateByUrl = vi.fn().mockResolvedValue(true);
  vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockImplementation(navigateByUrl);
  const fixture = TestBed.createComponent(SignIn);
  if (returnUrl !== undefined) {
    fixture.componentRef.setInput('returnUrl', returnUrl);
  }
  await fixture.whenStable();
  return { fixture, http: TestBed.inject(HttpTestingController), navigateByUrl };
}

/** What the server answers a successful POST /api/session with (server/src/auth/session.routes.ts). */
const SIGNED_IN = { principal: personWithRole('analyst') };

function element<T extends Element>(fixture: ComponentFixture<SignIn>, id: string): T {
  const found = (fixture.nativeElement as HTMLElement).querySelector<T>(`[data-testid="${id}"]`);
  if (found === null) {
    throw new Error(`No element with data-testid="${id}"`);
  }
  return found;
}

async function type(fixture: ComponentFixture<SignIn>, id: string, value: string): Promise<void> {
  const input = element<HTMLInputElement>(fixture, id);
  input.value = value;
  input.dispatchEvent(new Event('input'));
  await fixture.whenStable();
}

function submitButton(fixture: ComponentFixture<SignIn>): HTMLButtonElement {
  return element<HTMLButtonElement>(fixture, 'sign-in-submit');
}

async function fillAndSubmit(page: Page): Promise<void> {
  await type(page.fixture, 'sign-in-username', 'a.ledger');
  await type(page.fixture, 'sign-in-password', 'correct horse');
  submitButton(page.fixture).click();
  await page.fixture.whenStable();
}

// Common practice: a form's submit button stays disabled until every required field holds a value.
describe('SignIn', () => {
  it('disables the sign-in button while both fields are empty', async () => {
    const { fixture } = await openSignIn();

    expect(element(fixture, 'sign-in')).toBeTruthy();
    expect(submitButton(fixture).disabled).toBe(true);
  });

  it('keeps the button disabled with only the user name filled', async () => {
    const { fixture } = await openSignIn();

    await type(fixture, 'sign-in-username', 'a.ledger');

    expect(submitButton(fixture).disabled).toBe(true);
  });

  it('keeps the button disabled with only the password filled', async () => {
    const { fixture } = await openSignIn();

    await type(fixture, 'sign-in-password', 'correct horse');

    expect(submitButton(fixture).disabled).toBe(true);
  });

  it('keeps the button disabled when the user name is only blanks', async () => {
    const { fixture } = await openSignIn();

    await type(fixture, 'sign-in-username', '   ');
    await type(fixture, 'sign-in-password', 'correct horse');

    expect(submitButton(fixture).disabled).toBe(true);
  });

  it('enables the button once both fields are filled, and disables it again when one is cleared', async () => {
    const { fixture } = await openSignIn();

    await type(fixture, 'sign-in-username', 'a.ledger');
    await type(fixture, 'sign-in-password', 'correct horse');
    expect(submitButton(fixture).disabled).toBe(false);

    await type(fixture, 'sign-in-password', '');
    expect(submitButton(fixture).disabled).toBe(true);
  });

  it('posts the user name and password to /api/session, then returns to the page that asked', async () => {
    const page = await openSignIn('/specs');

    await fillAndSubmit(page);
    page.http.expectOne({ method: 'GET', url: '/api/session' }).flush({ principal: null });
    const request = page.http.expectOne({ method: 'POST', url: '/api/session' });
    expect(request.request.body).toEqual({ userName: 'a.ledger', password: 'correct horse' });
    expect(submitButton(page.fixture).disabled).toBe(true);
    request.flush(SIGNED_IN);
    await page.fixture.whenStable();

    expect(page.navigateByUrl).toHaveBeenCalledWith('/specs');
    expect(TestBed.inject(Session).person()).toEqual(SIGNED_IN.principal);
    page.http.verify();
  });

  it('goes to Runs instead of a return address outside the console', async () => {
    const page = await openSignIn('//elsewhere.example/runs');

    await fillAndSubmit(page);
    page.http.expectOne({ method: 'GET', url: '/api/session' }).flush({ principal: null });
    page.http.expectOne({ method: 'POST', url: '/api/session' }).flush(SIGNED_IN);
    await page.fixture.whenStable();

    expect(page.navigateByUrl).toHaveBeenCalledWith('/runs');
  });

  it('says the credentials are not recognised when the server answers 401, and stays on the form', async () => {
    const page = await openSignIn();

    await fillAndSubmit(page);
    // RFC 9110 §15.5.2: 401 means the request lacks valid authentication credentials.
    page.http.expectOne({ method: 'GET', url: '/api/session' }).flush({ principal: null });
    page.http
      .expectOne({ method: 'POST', url: '/api/session' })
      .flush(null, { status: 401, statusText: 'Unauthorized' });
    await page.fixture.whenStable();

    expect(element(page.fixture, 'sign-in-error').textContent?.trim()).toBe(
      'The user name or password is not recognised.',
    );
    expect(page.navigateByUrl).not.toHaveBeenCalled();
    expect(submitButton(page.fixture).disabled).toBe(false);
  });
});
