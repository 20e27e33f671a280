import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule, Validators, type FormGroup, type FormControl } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { Router } from '@angular/router';
import type { CreateAnalysisRequest } from '@tallyfit/contracts';
import { AnalysesApi } from '../../core/api/analyses-api';
import { apiErrorMessage } from '../../core/api/api-error-message';

type CategoryRow = FormGroup<{
  label: FormControl<string>;
  count: FormControl<number | null>;
  share: FormControl<number | null>;
}>;

/** Shares may miss 1 by rounding; the engine renormalises within this and warns. */
const SHARE_SUM_TOLERANCE = 0.01;

/** Type the categories and their counts, say what was expected, and run the test. */
@Component({
  selector: 'tf-new-analysis-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
  ],
  templateUrl: './new-analysis-page.html',
  styleUrl: './new-analysis-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewAnalysisPage {
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly api = inject(AnalysesApi);
  private readonly router = inject(Router);

  protected readonly form = this.fb.group({
    title: ['', [Validators.required, Validators.maxLength(200)]],
    hypothesis: this.fb.control<'equal' | 'proportions'>('equal'),
    rows: this.fb.array<CategoryRow>([this.newRow('A'), this.newRow('B')]),
  });
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly usesShares = computed(() => this.value().hypothesis === 'proportions');
  protected readonly shareSum = computed(() =>
    (this.value().rows ?? []).reduce((sum, row) => sum + (Number(row.share) || 0), 0),
  );
  protected readonly sharesOk = computed(() => !this.usesShares() || Math.abs(this.shareSum() - 1) <= SHARE_SUM_TOLERANCE);

  protected get rows(): FormArray<CategoryRow> {
    return this.form.controls.rows;
  }

  protected addRow(): void {
    this.rows.push(this.newRow(''));
  }

  protected removeRow(index: number): void {
    if (this.rows.length > 2) this.rows.removeAt(index);
  }

  protected submit(): void {
    if (this.form.invalid || !this.sharesOk()) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.api.create(this.request()).subscribe({
      next: (analysis) => void this.router.navigate(['/analyses', analysis.id]),
      error: (error: unknown) => {
        this.busy.set(false);
        this.error.set(apiErrorMessage(error));
      },
    });
  }

  private request(): CreateAnalysisRequest {
    const { title, hypothesis, rows } = this.form.getRawValue();
    return {
      title: title.trim(),
      spec: {
        observed: { labels: rows.map((row) => row.label.trim()), counts: rows.map((row) => Number(row.count)) },
        hypothesis:
          hypothesis === 'equal' ? { kind: 'equal' } : { kind: 'proportions', values: rows.map((row) => Number(row.share)) },
      },
    } as CreateAnalysisRequest;
  }

  private newRow(label: string): CategoryRow {
    return this.fb.group({
      label: this.fb.control(label, [Validators.required, Validators.maxLength(100)]),
      count: this.fb.control<number | null>(null, [Validators.required, Validators.min(0), Validators.pattern(/^\d+$/)]),
      share: this.fb.control<number | null>(null, [Validators.min(0), Validators.max(1)]),
    });
  }
}
