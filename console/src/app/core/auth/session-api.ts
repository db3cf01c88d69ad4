import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

/** What the sign-in form sends; the server's local strategy reads `userName` and `password`. */
export interface SignInRequest {
  readonly userName: string;
  readonly password: string;
}

export const SESSION_URL = '/api/session';

@Injectable({ providedIn: 'root' })
export class SessionApi {
  private readonly http = inject(HttpClient);

  /** Opens a session; the server answers with the session cookie. */
  signIn(request: SignInRequest): Observable<unknown> {
    return this.http.post<unknown>(SESSION_URL, request);
  }
}
