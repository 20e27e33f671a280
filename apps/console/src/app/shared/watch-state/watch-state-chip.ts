import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { WatchState } from '@tallyfit/contracts';
import { WATCH_STATE_WORDS } from './watch-words';

const STATE_ICONS: Record<WatchState, string> = {
  holding: 'verified_user',
  alarm: 'notification_important',
  paused: 'pause_circle',
};

/** A watch's state: an icon and words on the theme's colours, so it never rests on colour alone. */
@Component({
  selector: 'tf-watch-state-chip',
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
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    mat-icon { font-size: 18px; width: 18px; height: 18px; }
    :host(.alarm) { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); font-weight: 700; }
    :host(.paused) {
      background: var(--mat-sys-surface-container-highest);
      color: var(--mat-sys-on-surface-variant);
      outline: 1px dashed var(--mat-sys-outline);
    }
  `,
  host: { '[class]': 'state()', 'data-testid': 'watch-state' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchStateChip {
  readonly state = input.required<WatchState>();
  protected readonly words = computed(() => WATCH_STATE_WORDS[this.state()]);
  protected readonly icon = computed(() => STATE_ICONS[this.state()]);
}
