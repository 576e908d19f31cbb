import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, signal, viewChild } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';
import { toApiProblem } from '../api-client/api-error';
import { ServerInfoService } from '../api-client/server-info-service';
import { BrandMark } from '../shell/brand-mark';
import { CautionNote } from '../shell/caution-note';
import { firstAllowedPath } from '../shell/nav-items';
import { AuthService } from './auth-service';
import { DEFAULT_DEMO_PASSWORD, DEMO_ACCOUNTS, DemoAccount } from './demo-accounts';

/** The public sign-in page: institution single sign-on, a local account form and, in demo mode, the demo accounts. */
@Component({
  selector: 'as-sign-in-page',
  imports: [
    ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, MatProgressBarModule,
    BrandMark, CautionNote,
  ],
  templateUrl: './sign-in-page.html',
  styleUrl: './sign-in-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  private readonly serverInfo = inject(ServerInfoService);
  private readonly emailInput = viewChild<ElementRef<HTMLInputElement>>('emailInput');

  /** Query parameter: where to go after signing in. */
  readonly returnUrl = input<string | undefined>();
  /** Query parameter: set when a 401 ended the previous session. */
  readonly expired = input<string | undefined>();
  /** Query parameter: why institution sign-in was refused (set by the server's SSO callback). */
  readonly ssoError = input<string | undefined>(undefined, { alias: 'sso-error' });

  /** The SSO refusal in plain words. */
  protected readonly ssoProblem = computed(() => {
    const code = this.ssoError();
    if (!code) return '';
    const messages: Record<string, string> = {
      'no-role': 'Your institution signed you in, but your account has no Assayer role yet. Ask the office administrator to grant one.',
      inactive: 'Your Assayer account is switched off. Ask the office administrator.',
      'no-email': 'Your institution did not send an e-mail address, which Assayer needs to know who you are. Ask your IT service desk.',
      'invalid-response': 'The answer from your institution could not be verified. Try again; if it keeps happening, tell the office administrator.',
    };
    return messages[code] ?? 'Institution sign-in did not complete. Try again or use a local account.';
  });

  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', [Validators.required]],
  });
  protected readonly submitting = signal(false);
  /** Form-level message (wrong password, rate limit, server down), read out by the live region. */
  protected readonly formError = signal('');
  protected readonly demo = computed(() => this.serverInfo.info()?.demo === true);
  protected readonly office = computed(() => this.serverInfo.info()?.office ?? null);
  protected readonly demoAccounts = DEMO_ACCOUNTS;
  protected readonly demoPassword = DEFAULT_DEMO_PASSWORD;
  protected readonly ssoHref = computed(() => {
    const target = this.safeReturnUrl();
    return '/api/auth/saml/login' + (target ? `?RelayState=${encodeURIComponent(target)}` : '');
  });

  constructor() {
    this.serverInfo.ensureLoaded();
  }

  /** Sends the local form; on success goes to the return address or the person's start page. */
  protected signInLocally(): void {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, password } = this.form.getRawValue();
    this.submitting.set(true);
    this.auth.signIn(email.trim(), password).subscribe({
      next: (me) => {
        this.submitting.set(false);
        void this.router.navigateByUrl(this.safeReturnUrl() || firstAllowedPath(me.roles) || '/not-allowed');
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.showProblem(err);
      },
    });
  }

  /** Fills the form with a demo account so a visitor can try each role. */
  protected useDemoAccount(account: DemoAccount): void {
    this.form.setValue({ email: account.email, password: this.demoPassword });
    this.formError.set('');
    this.emailInput()?.nativeElement.focus();
  }

  private showProblem(err: unknown): void {
    const problem = toApiProblem(err);
    if (problem.status === 429) {
      this.formError.set('Too many sign-in attempts from here. Wait a few minutes, then try again.');
    } else if (problem.status === 401) {
      this.formError.set('That e-mail and password do not match an active local account.');
    } else if (problem.status === 400 && Object.keys(problem.fields).length) {
      for (const [field, message] of Object.entries(problem.fields)) {
        const control = this.form.get(field);
        if (control) {
          control.setErrors({ server: message });
          control.markAsTouched();
        }
      }
      this.formError.set('Check the highlighted fields.');
    } else {
      this.formError.set(problem.message);
    }
  }

  // Only same-site paths are allowed as return addresses, so a link cannot bounce people elsewhere.
  private safeReturnUrl(): string {
    const url = this.returnUrl() ?? '';
    return url.startsWith('/') && !url.startsWith('//') && !url.startsWith('/sign-in') ? url : '';
  }
}
