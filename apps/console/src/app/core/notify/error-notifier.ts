import { inject, Injectable } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiErrorMessage } from '../api/api-error-message';

/** The one place failed calls are told to the person: a snack bar with the API's own message. */
@Injectable({ providedIn: 'root' })
export class ErrorNotifier {
  private readonly snackBar = inject(MatSnackBar);

  notify(error: unknown): void {
    this.show(apiErrorMessage(error));
  }

  show(message: string): void {
    // The snack bar announces its text through the CDK LiveAnnouncer; errors interrupt.
    this.snackBar.open(message, 'Dismiss', { duration: 8000, politeness: 'assertive' });
  }
}
