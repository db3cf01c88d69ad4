import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { BreakpointObserver } from '@angular/cdk/layout';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { map } from 'rxjs';
import { AREAS } from '../areas';
import { mayOpenArea } from '../auth/area-roles';
import { Session } from '../auth/session';
import { ROLE_LABELS } from '../auth/session-person';
import { errorMessage } from '../http/error-message';
import { Cautions } from '../../shared/cautions/cautions';

/** Below this width the navigation slides over the page instead of sitting beside it. */
const WIDE_LAYOUT = '(min-width: 960px)';
/** Below this width the toolbar is short of room: sign-out shrinks to an icon. */
const PHONE_LAYOUT = '(max-width: 599.98px)';

@Component({
  selector: 'clino-shell',
  imports: [
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatSidenavModule,
    MatToolbarModule,
    Cautions,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly person = this.session.person;
  protected readonly roleLabel = computed(() => {
    const role = this.session.role();
    return role === null ? '' : ROLE_LABELS[role];
  });
  /** Only the areas the person's role may open (the server refuses the others anyway). */
  protected readonly areas = computed(() => {
    const role = this.session.role();
    return AREAS.filter((area) => mayOpenArea(role, area.path));
  });
  protected readonly signingOut = signal(false);
  /** Why the last sign-out failed, shown under the toolbar until dismissed or signed out. */
  protected readonly signOutFailure = signal<string | null>(null);
  private readonly breakpoints = inject(BreakpointObserver);
  protected readonly wide = toSignal(this.breakpoints.observe(WIDE_LAYOUT).pipe(map((state) => state.matches)), {
    initialValue: false,
  });
  protected readonly phone = toSignal(this.breakpoints.observe(PHONE_LAYOUT).pipe(map((state) => state.matches)), {
    initialValue: false,
  });

  protected signOut(): void {
    this.signingOut.set(true);
    this.signOutFailure.set(null);
    this.session
      .signOut()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => void this.router.navigateByUrl('/sign-in'),
        error: (error: unknown) => {
          this.signingOut.set(false);
          // Inline rather than a snack bar: the snack bar's share of the overlay code would push the
          // initial bundle towards its 500 kB budget for a failure this rare.
          this.signOutFailure.set(`Signing out failed. ${errorMessage(error)}`);
        },
      });
  }
}
