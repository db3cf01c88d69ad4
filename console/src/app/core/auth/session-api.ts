import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { switchMap, type Observable } from 'rxjs';

/** What the sign-in form sends; the server's local strategy reads `userName` and `password`. */
export interface SignInRequest {
  readonly userName: string;
  readonly password: string;
}

export const SESSION_URL = '/api/session';

@Injectable({ providedIn: 'root' })
export class SessionApi {
  private readonly http = inject(HttpClient);

  /**
   * Opens a session. The server refuses a sign-in without the CSRF header (login CSRF), so the
   * session is asked for first: its answer sets the `XSRF-TOKEN` cookie that HttpClient copies
   * into `X-XSRF-TOKEN` on the post. The server answers the post with the session cookie.
   */
  signIn(request: SignInRequest): Observable<unknown> {
    return this.http.get<unknown>(SESSION_URL).pipe(switchMap(() => this.http.post<unknown>(SESSION_URL, request)));
  }
}
