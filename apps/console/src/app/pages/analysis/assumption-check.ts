import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { AssumptionCheck, MergePlan } from '@tallyfit/engine';

export type Remedy = { kind: 'exact' } | { kind: 'merge'; plan: MergePlan };

/**
 * The assumption check in words — the smallest expected count, how many are small, Cochran's
 * rule — and, when it fails, the engine's advice as buttons that run the remedy as a new version.
 */
@Component({
  selector: 'tf-assumption-check',
  imports: [DecimalPipe, PercentPipe, MatButtonModule, MatIconModule],
  templateUrl: './assumption-check.html',
  styleUrl: './assumption-check.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssumptionCheckPanel {
  readonly check = input.required<AssumptionCheck>();
  /** whether the exact test already ran, so it is not offered again */
  readonly exactRan = input(false);
  /** the person may run analyses (remedies are new runs) */
  readonly canRun = input(false);
  readonly busy = input(false);
  readonly remedy = output<Remedy>();

  protected readonly advice = computed(() => this.check().advice.filter((item) => item.code !== 'none'));
  protected readonly mergeAdvice = computed(() => this.advice().find((item) => item.code === 'merge-categories' && item.plan));
  protected readonly exactAdvice = computed(() => this.advice().find((item) => item.code === 'use-exact'));

  protected mergeLines(plan: MergePlan): string[] {
    return plan.groups.map((group) => `${group.members.map((member) => `“${member}”`).join(' + ')} → “${group.label}”`);
  }
}
