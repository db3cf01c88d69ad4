import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { switchMap, type Observable } from 'rxjs';

/** What the sign-in form sends; the server's local strategy reads `userName` and `password`. */
export interface SignInRequest {
  readonly userName: string;
  readonly password: string;
}

export const SESSION_URL = '/api/session';

/**
 * The session routes over HTTP. Answers stay `unknown` here: the `Session` service narrows them
 * (`personOf`) before anything is shown.
 */
@Injectable({ providedIn: 'root' })
export class SessionApi {
  private readonly http = inject(HttpClient);

  /** Who is signed in (`{ principal: … }`); the answer also refreshes the `XSRF-TOKEN` cookie. */
  current(): Observable<unknown> {
    return this.http.get<unknown>(SESSION_URL);
  }

  /**
   * Opens a session. The server refuses a sign-in without the CSRF header (login CSRF), so the
   * session is asked for first: its answer sets the `XSRF-TOKEN` cookie that HttpClient copies
   * into `X-XSRF-TOKEN` on the post. The server answers the post with the new session, and sets
   * the session cookie.
   */
  signIn(request: SignInRequest): Observable<unknown> {
    return this.current().pipe(switchMap(() => this.http.post<unknown>(SESSION_URL, request)));
  }

  /** Ends the session (the server answers 204 and clears its cookies). */
  signOut(): Observable<void> {
    return this.http.delete<void>(SESSION_URL);
  }
}
