import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import type { LoginRequest, LoginResponse, User } from '@tallyfit/contracts';
import { map, type Observable, tap } from 'rxjs';

interface StoredSession {
  accessToken: string;
  expiresAt: number;
  user: User;
}

const STORAGE_KEY = 'tallyfit.session';

/** The signed-in person and their bearer token, kept in this browser tab's session storage. */
@Injectable({ providedIn: 'root' })
export class AuthSession {
  private readonly http = inject(HttpClient);
  private readonly session = signal<StoredSession | null>(readStoredSession());

  readonly user = computed(() => this.session()?.user ?? null);
  readonly signedIn = computed(() => this.session() !== null);

  get accessToken(): string | null {
    const session = this.session();
    if (!session || session.expiresAt <= Date.now()) return null;
    return session.accessToken;
  }

  signIn(request: LoginRequest): Observable<User> {
    return this.http.post<LoginResponse>('/api/v1/auth/login', request).pipe(
      tap((response) => {
        const session: StoredSession = {
          accessToken: response.accessToken,
          expiresAt: Date.now() + response.expiresIn * 1000,
          user: response.user,
        };
        sessionStorage.setItem(STORAGE_KEY, JSON.stringify(session));
        this.session.set(session);
      }),
      map((response) => response.user),
    );
  }

  signOut(): void {
    sessionStorage.removeItem(STORAGE_KEY);
    this.session.set(null);
  }
}

function readStoredSession(): StoredSession | null {
  try {
    const raw = sessionStorage.getItem(STORAGE_KEY);
    const session = raw ? (JSON.parse(raw) as StoredSession) : null;
    return session && session.expiresAt > Date.now() ? session : null;
  } catch {
    return null;
  }
}
