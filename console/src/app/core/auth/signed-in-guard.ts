import { inject } from '@angular/core';
import { type CanActivateChildFn, Router } from '@angular/router';
import { map } from 'rxjs';
import { Session } from './session';

/**
 * The console's areas need a signed-in person; anyone else is sent to sign in, with the address
 * they asked for as `returnUrl` so the sign-in page can bring them back.
 */
export const signedInGuard: CanActivateChildFn = (_route, state) => {
  const router = inject(Router);
  return inject(Session)
    .whenKnown()
    .pipe(
      map((person) =>
        person !== null ? true : router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } }),
      ),
    );
};
