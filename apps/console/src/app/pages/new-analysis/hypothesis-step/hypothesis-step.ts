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
import {
  distributionFamilies,
  SHARE_SUM_EXACT_TOLERANCE,
  SHARE_SUM_ROUNDING_TOLERANCE,
  type DistributionFamily,
  type Hypothesis,
} from '@tallyfit/engine';
import { totalOf } from '../data-step/data-choice';
import type { ParsedCounts } from '../data-step/pasted-counts';
import {
  buildHypothesis,
  draftFromHypothesis,
  FAMILY_NAMES,
  FAMILY_PARAMS,
  previewExpected,
  previewShares,
  STREAM_KINDS,
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
 *
 * A watch reuses the step with `streamed` set: its counts arrive later in batches, so only
 * hypotheses with shares fixed in advance are offered and the preview shows the expected shares.
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
  /** The counts arrive later, batch by batch (a watch); `observed` then holds the categories only. */
  readonly streamed = input(false);
  /** A hypothesis to start from (a watch being changed, or change and re-run), filled in once the categories are known. */
  readonly initial = input<Hypothesis | null>(null);
  private initialApplied = false;
  readonly hypothesisChange = output<Hypothesis | null>();

  protected readonly families = distributionFamilies;
  protected readonly familyNames = FAMILY_NAMES;
  protected readonly familyParams = FAMILY_PARAMS;
  protected readonly smallExpected = SMALL_EXPECTED;
  private readonly allKinds: { value: HypothesisKind; label: string }[] = [
    { value: 'equal', label: 'Every category equally likely' },
    { value: 'proportions', label: 'A share for each category' },
    { value: 'ratio', label: 'A ratio, such as 9:3:3:1' },
    { value: 'counts', label: 'An expected count for each category' },
    { value: 'distribution', label: 'A distribution fitted to the counts' },
  ];
  protected readonly kinds = computed(() =>
    this.streamed() ? this.allKinds.filter((kind) => STREAM_KINDS.includes(kind.value)) : this.allKinds,
  );

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
    if (gap <= SHARE_SUM_EXACT_TOLERANCE * Math.max(1, target)) return 'exact';
    return gap <= SHARE_SUM_ROUNDING_TOLERANCE * Math.max(1, target) ? 'rounded' : 'off';
  });

  protected readonly outcome = computed(() => {
    this.draft();
    const observed = this.observed();
    if (!observed) return null;
    return buildHypothesis(this.form.getRawValue() as HypothesisDraft, observed);
  });
  protected readonly preview = computed(() => {
    // re-read on every change of the form
    this.draft();
    const observed = this.observed();
    const outcome = this.outcome();
    if (!observed || !outcome?.ok) return null;
    return this.streamed() ? previewShares(observed.labels, outcome.hypothesis) : previewExpected(observed, outcome.hypothesis);
  });
  protected readonly smallCells = computed(() => {
    const preview = this.preview();
    // Streamed counts have no expected counts yet; each batch's own analysis checks them.
    if (this.streamed()) return 0;
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
    // A given hypothesis fills the form once, after the value fields exist (one per category), so
    // per-category values have somewhere to go; later edits of the counts do not undo the person's changes.
    effect(() => {
      const initial = this.initial();
      const k = this.labels().length;
      if (!initial || this.initialApplied || k === 0) return;
      untracked(() => {
        const draft = draftFromHypothesis(initial);
        this.form.patchValue({ ...draft, values: draft.values?.length === k ? draft.values : [] });
        this.initialApplied = true;
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
