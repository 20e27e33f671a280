import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { AuthSession } from '../core/auth/auth-session';

/** The frame around every signed-in page: the product's name, the main places, and who is signed in. */
@Component({
  selector: 'tf-app-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppShell {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  protected readonly user = this.session.user;

  protected signOut(): void {
    this.session.signOut({ revoke: true });
    void this.router.navigate(['/sign-in']);
  }
}
