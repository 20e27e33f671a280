import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { SharesApi } from '../../core/api/shares-api';
import { readAddresses } from './share-addresses';

export interface ShareDialogData {
  analysisId: number;
  title: string;
}

/** Send the analysis's report to people by e-mail. Closes with the addresses it was sent to. */
@Component({
  selector: 'tf-share-dialog',
  imports: [FormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  templateUrl: './share-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    .field {
      width: 100%;
      margin-bottom: 12px;
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
})
export class ShareDialog {
  private readonly api = inject(SharesApi);
  private readonly dialogRef = inject<MatDialogRef<ShareDialog, string[]>>(MatDialogRef);
  protected readonly data = inject<ShareDialogData>(MAT_DIALOG_DATA);

  protected readonly to = signal('');
  protected readonly message = signal('');
  protected readonly touched = signal(false);
  protected readonly sending = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly addresses = computed(() => readAddresses(this.to()));

  protected send(): void {
    this.touched.set(true);
    const addresses = this.addresses();
    if (!addresses.ok || this.sending()) return;
    this.sending.set(true);
    this.problem.set(null);
    const message = this.message().trim();
    this.api.share(this.data.analysisId, { to: addresses.addresses, ...(message ? { message } : {}) }).subscribe({
      next: () => this.dialogRef.close(addresses.addresses),
      error: (error: unknown) => {
        this.sending.set(false);
        this.problem.set(apiErrorMessage(error));
      },
    });
  }
}
