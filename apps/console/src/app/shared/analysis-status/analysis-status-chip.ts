import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { AnalysisStatus } from '@tallyfit/contracts';
import { ANALYSIS_STATUS_WORDS } from './analysis-status-words';

const STATUS_ICONS: Record<AnalysisStatus, string> = {
  draft: 'edit_note',
  in_review: 'hourglass_top',
  signed_off: 'verified',
  returned: 'undo',
};

/** An analysis's review state: an icon and words, so it never rests on colour alone. */
@Component({
  selector: 'tf-analysis-status-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ icon() }}</mat-icon><span>{{ words() }}</span>`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 2px 10px 2px 6px;
      border-radius: 12px;
      font: var(--mat-sys-label-medium);
      white-space: nowrap;
      background: var(--mat-sys-surface-container-high);
      color: var(--mat-sys-on-surface);
    }
    mat-icon { font-size: 18px; width: 18px; height: 18px; }
    :host(.signed_off) { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    :host(.returned) { background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container); }
    :host(.in_review) { background: var(--mat-sys-secondary-container); color: var(--mat-sys-on-secondary-container); }
  `,
  host: { '[class]': 'status()' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisStatusChip {
  readonly status = input.required<AnalysisStatus>();
  protected readonly words = computed(() => ANALYSIS_STATUS_WORDS[this.status()]);
  protected readonly icon = computed(() => STATUS_ICONS[this.status()]);
}
