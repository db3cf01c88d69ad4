import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { HttpErrorResponse } from '@angular/common/http';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Session } from '../auth/session';
import { errorMessage } from '../http/error-message';

/** Where to go after signing in when no (safe) return address was given. */
const HOME = '/runs';

/** Only paths inside the console: never an absolute or protocol-relative URL. */
function isConsolePath(url: string | undefined): url is string {
  return url !== undefined && url.startsWith('/') && !url.startsWith('//');
}

@Component({
  selector: 'clino-sign-in',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** From the `returnUrl` query parameter, set when a request met a 401. */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    userName: ['', [Validators.required, Validators.pattern(/\S/)]],
    password: ['', Validators.required],
  });
  private readonly status = toSignal(this.form.statusChanges, { initialValue: this.form.status });
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly canSubmit = computed(() => this.status() === 'VALID' && !this.pending());
  protected readonly hidePassword = signal(true);

  protected submit(): void {
    if (!this.canSubmit()) {
      return;
    }
    const { userName, password } = this.form.getRawValue();
    this.pending.set(true);
    this.failure.set(null);
    this.session.signIn({ userName: userName.trim(), password }).subscribe({
      next: () => {
        this.pending.set(false);
        const target = this.returnUrl();
        void this.router.navigateByUrl(isConsolePath(target) ? target : HOME);
      },
      error: (error: unknown) => {
        this.pending.set(false);
        this.failure.set(
          error instanceof HttpErrorResponse && error.status === 401
            ? 'The user name or password is not recognised.'
            : errorMessage(error),
        );
      },
    });
  }
}
