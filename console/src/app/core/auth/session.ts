import { Injectable, computed, inject, signal } from '@angular/core';
import { type Observable, catchError, finalize, map, of, shareReplay, tap } from 'rxjs';
import { SessionApi, type SignInRequest } from './session-api';
import { type Role, type SessionPerson, personOf } from './session-person';

/**
 * Who is signed in, for the whole console. The server is asked once, the first time anyone needs
 * to know (the route guard, as the console starts); sign-in and sign-out then set the answer from
 * the server's own replies, and a 401 anywhere forgets it.
 */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly api = inject(SessionApi);
  private readonly current = signal<SessionPerson | null>(null);
  private readonly known = signal(false);
  private loading: Observable<SessionPerson | null> | null = null;

  /** The signed-in person, or null when nobody is (or before the server has answered). */
  readonly person = this.current.asReadonly();
  readonly role = computed<Role | null>(() => this.current()?.role ?? null);

  /**
   * The signed-in person, asking `GET /api/session` only when the answer is not known yet; callers
   * arriving while the request is out share it. A failed request counts as nobody signed in and is
   * asked again next time.
   */
  whenKnown(): Observable<SessionPerson | null> {
    if (this.known()) {
      return of(this.current());
    }
    this.loading ??= this.api.current().pipe(
      map(personOf),
      tap((person) => this.settle(person)),
      catchError(() => of(null)),
      finalize(() => (this.loading = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
    return this.loading;
  }

  /** Signs in, and keeps the person the server's answer names. */
  signIn(request: SignInRequest): Observable<SessionPerson> {
    return this.api.signIn(request).pipe(
      map((answer) => {
        const person = personOf(answer);
        if (person === null) {
          throw new Error('The server accepted the sign-in but did not say who is signed in.');
        }
        return person;
      }),
      tap((person) => this.settle(person)),
    );
  }

  /** Signs out on the server, then forgets the person. */
  signOut(): Observable<void> {
    return this.api.signOut().pipe(tap(() => this.settle(null)));
  }

  /** The server no longer knows the session (a request met 401). */
  forget(): void {
    this.settle(null);
  }

  private settle(person: SessionPerson | null): void {
    this.current.set(person);
    this.known.set(true);
  }
}
