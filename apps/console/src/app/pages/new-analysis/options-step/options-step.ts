import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { testNames } from '@tallyfit/engine';
import { optionsDraftOf } from '../prefill';
import { buildOptions, DEFAULT_OPTIONS, TEST_NAMES, type AnalysisOptions, type OptionsDraft } from './analysis-options';

/** The third step: which tests run, how the exact test runs, corrections, intervals and alpha. */
@Component({
  selector: 'tf-options-step',
  imports: [ReactiveFormsModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatSlideToggleModule],
  templateUrl: './options-step.html',
  styleUrl: './options-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OptionsStep {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly optionsChange = output<AnalysisOptions | null>();
  /** Options to start from (change and re-run). */
  readonly initial = input<AnalysisOptions | null>(null);

  protected readonly testNames = testNames;
  protected readonly testLabels = TEST_NAMES;
  protected readonly form = this.fb.group({
    automaticTests: this.fb.control(DEFAULT_OPTIONS.automaticTests),
    tests: this.fb.group({
      pearson: this.fb.control(DEFAULT_OPTIONS.tests.pearson),
      g: this.fb.control(DEFAULT_OPTIONS.tests.g),
      exact: this.fb.control(DEFAULT_OPTIONS.tests.exact),
      'cressie-read': this.fb.control(DEFAULT_OPTIONS.tests['cressie-read']),
    }),
    exactOrdering: this.fb.control(DEFAULT_OPTIONS.exactOrdering),
    exactMethod: this.fb.control(DEFAULT_OPTIONS.exactMethod),
    samples: this.fb.control<number | null>(DEFAULT_OPTIONS.samples),
    seed: this.fb.control<number | null>(DEFAULT_OPTIONS.seed),
    williams: this.fb.control(DEFAULT_OPTIONS.williams),
    adjust: this.fb.control(DEFAULT_OPTIONS.adjust),
    intervalMethod: this.fb.control(DEFAULT_OPTIONS.intervalMethod),
    intervalLevel: this.fb.control<number | null>(DEFAULT_OPTIONS.intervalLevel),
    alpha: this.fb.control<number | null>(DEFAULT_OPTIONS.alpha),
  });

  private readonly draft = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly automatic = computed(() => this.draft().automaticTests ?? true);
  protected readonly exactMayRun = computed(() => this.automatic() || (this.draft().tests?.exact ?? false));
  protected readonly gMayRun = computed(() => this.automatic() || (this.draft().tests?.g ?? false));
  protected readonly simulated = computed(() => this.draft().exactMethod === 'monte-carlo');
  protected readonly outcome = computed(() => {
    this.draft();
    return buildOptions(this.form.getRawValue() as OptionsDraft);
  });

  constructor() {
    effect(() => {
      const initial = this.initial();
      if (initial) untracked(() => this.form.patchValue(optionsDraftOf(initial)));
    });
    effect(() => {
      const outcome = this.outcome();
      this.optionsChange.emit(outcome.ok ? outcome.options : null);
    });
  }
}
