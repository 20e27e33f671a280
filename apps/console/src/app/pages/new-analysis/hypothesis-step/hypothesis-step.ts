import { CountPipe } from '../../../shared/words/count-words';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, type FormControl } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { distributionFamilies, type DistributionFamily, type Hypothesis } from '@tallyfit/engine';
import { totalOf } from '../data-step/data-choice';
import type { ParsedCounts } from '../data-step/pasted-counts';
import {
  buildHypothesis,
  FAMILY_NAMES,
  FAMILY_PARAMS,
  previewExpected,
  SHARE_SUM_TOLERANCE,
  sumOf,
  type HypothesisDraft,
  type HypothesisKind,
  type ParamName,
} from './hypothesis-draft';

/** Expected counts below this make the chi-square approximation doubtful (Cochran's rule; common practice). */
const SMALL_EXPECTED = 5;

/**
 * The second step: what the counts were expected to be. The expected counts the hypothesis
 * implies are computed by the engine in the browser and shown as the person types.
 */
@Component({
  selector: 'tf-hypothesis-step',
  imports: [
    CountPipe,
    DecimalPipe, ReactiveFormsModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MatSelectModule],
  templateUrl: './hypothesis-step.html',
  styleUrl: './hypothesis-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HypothesisStep {
  private readonly fb = inject(NonNullableFormBuilder);

  readonly observed = input<ParsedCounts | null>(null);
  readonly hypothesisChange = output<Hypothesis | null>();

  protected readonly families = distributionFamilies;
  protected readonly familyNames = FAMILY_NAMES;
  protected readonly familyParams = FAMILY_PARAMS;
  protected readonly smallExpected = SMALL_EXPECTED;
  protected readonly kinds: { value: HypothesisKind; label: string }[] = [
    { value: 'equal', label: 'Every category equally likely' },
    { value: 'proportions', label: 'A share for each category' },
    { value: 'ratio', label: 'A ratio, such as 9:3:3:1' },
    { value: 'counts', label: 'An expected count for each category' },
    { value: 'distribution', label: 'A distribution fitted to the counts' },
  ];

  protected readonly form = this.fb.group({
    kind: this.fb.control<HypothesisKind>('equal'),
    values: this.fb.array<FormControl<number | null>>([]),
    ratio: this.fb.control(''),
    family: this.fb.control<DistributionFamily>('poisson'),
    params: this.fb.group({
      lambda: this.fb.control<number | null>(null),
      p: this.fb.control<number | null>(null),
      trials: this.fb.control<number | null>(null),
      mean: this.fb.control<number | null>(null),
      sd: this.fb.control<number | null>(null),
      min: this.fb.control<number | null>(null),
      max: this.fb.control<number | null>(null),
    }),
    breaks: this.fb.control(''),
  });

  protected readonly draft = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly kind = computed(() => this.draft().kind ?? 'equal');
  protected readonly labels = computed(() => this.observed()?.labels ?? []);
  protected readonly n = computed(() => totalOf(this.observed()?.counts ?? []));
  protected readonly valuesSum = computed(() => sumOf(this.draft().values ?? []));
  protected readonly sumState = computed(() => {
    const kind = this.kind();
    const total = this.valuesSum();
    const target = kind === 'proportions' ? 1 : this.n();
    const gap = Math.abs(total - target);
    if (gap <= 1e-6 * Math.max(1, target)) return 'exact';
    return gap <= SHARE_SUM_TOLERANCE * Math.max(1, target) ? 'rounded' : 'off';
  });

  protected readonly outcome = computed(() => {
    this.draft();
    const observed = this.observed();
    if (!observed) return null;
    return buildHypothesis(this.form.getRawValue() as HypothesisDraft, observed.labels.length, this.n());
  });
  protected readonly preview = computed(() => {
    // re-read on every change of the form
    this.draft();
    const observed = this.observed();
    const outcome = this.outcome();
    return observed && outcome?.ok ? previewExpected(observed, outcome.hypothesis) : null;
  });
  protected readonly smallCells = computed(() => {
    const preview = this.preview();
    return preview?.ok ? preview.rows.filter((row) => row.expected < SMALL_EXPECTED).length : 0;
  });

  constructor() {
    // One value field per category, kept in step with the data.
    effect(() => {
      const k = this.labels().length;
      untracked(() => {
        const values = this.form.controls.values;
        while (values.length < k) values.push(this.fb.control<number | null>(null));
        while (values.length > k) values.removeAt(values.length - 1);
      });
    });
    effect(() => {
      const outcome = this.outcome();
      const preview = this.preview();
      this.hypothesisChange.emit(outcome?.ok && preview?.ok ? outcome.hypothesis : null);
    });
  }

  protected paramControl(name: ParamName): FormControl<number | null> {
    return this.form.controls.params.controls[name];
  }

  /** Fill the values with equal shares (or counts) as a starting point. */
  protected fillEvenly(): void {
    const k = this.labels().length;
    if (k === 0) return;
    const each = this.kind() === 'proportions' ? Number((1 / k).toFixed(4)) : Number((this.n() / k).toFixed(2));
    this.form.controls.values.setValue(Array.from({ length: k }, () => each));
  }
}
