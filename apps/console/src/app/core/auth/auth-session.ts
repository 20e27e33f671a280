import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import type { LoginRequest, LoginResponse, User } from '@tallyfit/contracts';
import { finalize, map, type Observable, shareReplay, tap, throwError } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Sign-in and refresh answers; the refresh token is optional so an API without one still works. */
type SessionResponse = LoginResponse & { refreshToken?: string };

interface StoredSession {
  accessToken: string;
  expiresAt: number;
  refreshToken?: string;
  user: User;
}

const STORAGE_KEY = 'tallyfit.session';
/** Refresh a little before the access token runs out, so a request never leaves with a dying token. */
const EXPIRY_MARGIN_MS = 10_000;

/**
 * The signed-in person, their short-lived bearer token and the refresh token that renews it,
 * kept in this browser tab's session storage.
 */
@Injectable({ providedIn: 'root' })
export class AuthSession {
  private readonly http = inject(HttpClient);
  private readonly session = signal<StoredSession | null>(readStoredSession());
  private refreshing: Observable<string> | null = null;

  readonly user = computed(() => this.session()?.user ?? null);
  readonly role = computed(() => this.session()?.user.role ?? null);
  readonly signedIn = computed(() => this.session() !== null);

  /** The access token while it is still good, otherwise null. */
  get accessToken(): string | null {
    const session = this.session();
    if (!session || session.expiresAt - EXPIRY_MARGIN_MS <= Date.now()) return null;
    return session.accessToken;
  }

  /** True while a refresh can still renew an expired access token. */
  get canRefresh(): boolean {
    return Boolean(this.session()?.refreshToken);
  }

  signIn(request: LoginRequest): Observable<User> {
    return this.http
      .post<SessionResponse>('/api/v1/auth/login', request, { context: pageHandlesErrors() })
      .pipe(
        tap((response) => this.store(response)),
        map((response) => response.user),
      );
  }

  /**
   * Trades the refresh token for a new access token. Calls made while a refresh is in flight
   * share it, so the refresh token is used once.
   */
  refresh(): Observable<string> {
    const refreshToken = this.session()?.refreshToken;
    if (!refreshToken) return throwError(() => new Error('There is no session to renew.'));
    this.refreshing ??= this.http
      .post<SessionResponse>('/api/v1/auth/refresh', { refreshToken }, { context: pageHandlesErrors() })
      .pipe(
        tap((response) => this.store(response, refreshToken)),
        map((response) => response.accessToken),
        finalize(() => (this.refreshing = null)),
        shareReplay({ bufferSize: 1, refCount: false }),
      );
    return this.refreshing;
  }

  /** Ends the session here and, when `revoke` is set, asks the API to forget the refresh token. */
  signOut(options: { revoke?: boolean } = {}): void {
    const refreshToken = this.session()?.refreshToken;
    if (options.revoke && refreshToken) {
      // Fire and forget: the person is signed out here whatever the API answers.
      this.http
        .post('/api/v1/auth/logout', { refreshToken }, { context: pageHandlesErrors() })
        .subscribe({ error: () => undefined });
    }
    sessionStorage.removeItem(STORAGE_KEY);
    this.session.set(null);
  }

  private store(response: SessionResponse, previousRefreshToken?: string): void {
    const session: StoredSession = {
      accessToken: response.accessToken,
      expiresAt: Date.now() + response.expiresIn * 1000,
      refreshToken: response.refreshToken ?? previousRefreshToken,
      user: response.user,
    };
    sessionStorage.setItem(STORAGE_KEY, JSON.stringify(session));
    this.session.set(session);
  }
}

function readStoredSession(): StoredSession | null {
  try {
    const raw = sessionStorage.getItem(STORAGE_KEY);
    const session = raw ? (JSON.parse(raw) as StoredSession) : null;
    if (!session) return null;
    return session.refreshToken || session.expiresAt > Date.now() ? session : null;
  } catch {
    return null;
  }
}
