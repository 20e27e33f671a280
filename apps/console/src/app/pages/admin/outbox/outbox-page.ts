import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { switchMap } from 'rxjs';
import { OutboxApi } from '../../../core/api/outbox-api';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../../core/load/load-state';

/** The mail Tallyfit sent while its built-in mail stand-in takes the place of a real mail server. */
@Component({
  selector: 'tf-outbox-page',
  imports: [DatePipe, DecimalPipe, MatButtonModule, MatExpansionModule, MatIconModule, MatProgressBarModule],
  templateUrl: './outbox-page.html',
  styleUrl: './outbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxPage {
  private readonly api = inject(OutboxApi);
  private readonly reloads = signal(0);
  private readonly state = toSignal(toObservable(this.reloads).pipe(switchMap(() => toLoadState(this.api.get()))), {
    initialValue: LOADING,
  });
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly outbox = computed(() => loadedValue(this.state()));

  protected reload(): void {
    this.reloads.update((count) => count + 1);
  }
}
