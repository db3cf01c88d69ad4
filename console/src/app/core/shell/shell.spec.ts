import { TestBed } from '@angular/core/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import { appConfig } from '../../app.config';

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

async function openShellAt(url: string): Promise<HTMLElement> {
  TestBed.configureTestingModule({ providers: appConfig.providers });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  await harness.fixture.whenStable();
  return harness.fixture.nativeElement as HTMLElement;
}

function navLinks(root: HTMLElement): HTMLAnchorElement[] {
  return Array.from(root.querySelectorAll<HTMLAnchorElement>('[data-testid="nav"] a'));
}

describe('Shell', () => {
  it('shows the product name Clinometer in the toolbar', async () => {
    const root = await openShellAt('/runs');

    const title = root.querySelector('mat-toolbar [data-testid="shell-title"]');
    expect(title?.textContent?.trim()).toBe('Clinometer');
  });

  it('lists the seven areas in order, each linking to its own path', async () => {
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
});
