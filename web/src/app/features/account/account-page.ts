import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { BehaviorSubject, catchError, map, of, switchMap } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { AccountApi, type ActiveSession } from './account-api';
import { PasswordChange } from './password-change';
import { ReviewDigestSetting } from './review-digest-setting';
import { describeDevice, timeAgo, type DeviceIcon } from './session-words';

interface SessionView {
  id: string;
  current: boolean;
  device: string;
  icon: DeviceIcon;
  signedInAt: string;
  lastActive: string;
  address: string | null;
}

type SessionsState = { status: 'loading' } | { status: 'ready'; sessions: SessionView[] } | { status: 'failed'; message: string };

function toView(session: ActiveSession, now: Date): SessionView {
  const { name, icon } = describeDevice(session.userAgent);
  return {
    id: session.id,
    current: session.current,
    device: name,
    icon,
    signedInAt: session.createdAt,
    // The service touches a session about once a minute, so "just now" is the honest word for this one.
    lastActive: session.current ? 'just now' : timeAgo(session.lastSeenAt, now),
    address: session.address,
  };
}

@Component({
  selector: 'al-account-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, PasswordChange, ReviewDigestSetting],
  templateUrl: './account-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountPage {
  private readonly api = inject(AccountApi);
  protected readonly auth = inject(AuthStore);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  /** The id of the session being ended, or 'others'; every end button waits while one is in flight. */
  protected readonly ending = signal<string | null>(null);
  protected readonly notice = signal('');
  protected readonly failure = signal<string | null>(null);

  protected readonly state = toSignal(
    this.refresh.pipe(
      switchMap(() =>
        this.api.sessions().pipe(
          map((sessions): SessionsState => {
            const now = new Date();
            return { status: 'ready', sessions: sessions.map((session) => toView(session, now)) };
          }),
          catchError((error: unknown) =>
            of<SessionsState>({
              status: 'failed',
              message: error instanceof ApiError ? error.message : 'Your sessions could not be loaded.',
            }),
          ),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as SessionsState },
  );

  protected readonly sessions = computed(() => {
    const state = this.state();
    return state.status === 'ready' ? state.sessions : [];
  });
  protected readonly otherCount = computed(() => this.sessions().filter((session) => !session.current).length);

  protected end(session: SessionView): void {
    this.ending.set(session.id);
    this.failure.set(null);
    this.api.endSession(session.id).subscribe({
      next: () => this.ended(`The session on ${session.device} has ended. It must sign in again.`),
      error: (error: unknown) =>
        error instanceof ApiError && error.status === 404
          ? this.ended(`The session on ${session.device} had already ended.`)
          : this.failed(error),
    });
  }

  protected endOthers(): void {
    this.ending.set('others');
    this.failure.set(null);
    this.api.endOtherSessions().subscribe({
      next: ({ ended }) => this.ended(ended === 1 ? 'One other session has ended.' : `${ended} other sessions have ended.`),
      error: (error: unknown) => this.failed(error),
    });
  }

  protected passwordChanged(): void {
    this.refresh.next();
  }

  private ended(message: string): void {
    this.ending.set(null);
    this.notice.set(message);
    this.refresh.next();
  }

  private failed(error: unknown): void {
    this.ending.set(null);
    this.failure.set(error instanceof ApiError ? error.message : 'The session could not be ended. Try again.');
  }
}
