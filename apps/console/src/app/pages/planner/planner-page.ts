import { CountPipe } from '../../shared/words/count-words';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { EngineInputError, power, sampleSize } from '@tallyfit/engine';
import { effectFromShares } from './effect-from-shares';
import { PowerCurveChart } from './power-curve-chart';
import { powerCurve } from './power-curve';

type Goal = 'power' | 'size';
type EffectSource = 'w' | 'shares';

/** Cohen's conventional effect sizes for w (Cohen 1988, section 7.2.3). */
const CONVENTIONS = [
  { label: 'small', w: 0.1 },
  { label: 'medium', w: 0.3 },
  { label: 'large', w: 0.5 },
];

type Plan =
  | { ok: true; goal: 'power'; n: number; power: number; w: number; df: number; alpha: number }
  | { ok: true; goal: 'size'; n: number; power: number; target: number; w: number; df: number; alpha: number }
  | { ok: false; message: string };

/** Power for a given number of observations, or the number needed for a given power, computed in the browser. */
@Component({
  selector: 'tf-planner-page',
  imports: [
    CountPipe,
    DecimalPipe, FormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, PowerCurveChart],
  templateUrl: './planner-page.html',
  styleUrl: './planner-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlannerPage {
  protected readonly conventions = CONVENTIONS;
  protected readonly goal = signal<Goal>('size');
  protected readonly source = signal<EffectSource>('w');
  protected readonly w = signal<number | null>(0.3);
  protected readonly expectedShares = signal('0.25, 0.25, 0.25, 0.25');
  protected readonly detectShares = signal('0.31, 0.25, 0.25, 0.19');
  protected readonly dfTyped = signal<number | null>(3);
  protected readonly alpha = signal<number | null>(0.05);
  protected readonly n = signal<number | null>(100);
  protected readonly target = signal<number | null>(0.8);

  protected readonly fromShares = computed(() => (this.source() === 'shares' ? effectFromShares(this.expectedShares(), this.detectShares()) : null));
  protected readonly effect = computed((): { w: number; df: number } | { message: string } => {
    const shares = this.fromShares();
    if (shares) return shares.ok ? { w: shares.w, df: shares.df } : { message: shares.message };
    // An empty field reaches the engine as a value that is not a number, and the engine names it.
    return { w: this.w() ?? Number.NaN, df: this.dfTyped() ?? Number.NaN };
  });

  protected readonly plan = computed((): Plan => {
    const effect = this.effect();
    if ('message' in effect) return { ok: false, message: effect.message };
    const alpha = this.alpha() ?? Number.NaN;
    // The engine checks w, df, alpha, n and the target power, and its messages are shown as they are.
    try {
      if (this.goal() === 'power') {
        const n = this.n();
        if (n !== null && !Number.isInteger(n)) return { ok: false, message: 'The number of observations must be a whole number.' };
        const result = power({ ...effect, n: n ?? Number.NaN, alpha });
        return { ok: true, goal: 'power', n: n ?? 0, power: result.power, ...effect, alpha };
      }
      const target = this.target() ?? Number.NaN;
      const size = sampleSize({ ...effect, power: target, alpha });
      return { ok: true, goal: 'size', n: size.n, power: size.power, target, ...effect, alpha };
    } catch (error) {
      if (error instanceof EngineInputError) return { ok: false, message: error.message };
      throw error;
    }
  });

  protected readonly curve = computed(() => {
    const plan = this.plan();
    if (!plan.ok) return null;
    // Show up to the size that reaches 95% power (or twice the planned n, whichever is larger) so the curve's shape is visible.
    const reach = sampleSize({ w: plan.w, df: plan.df, power: Math.max(0.95, plan.alpha + 0.01), alpha: plan.alpha }).n;
    return { points: powerCurve(plan.w, plan.df, plan.alpha, Math.max(reach, plan.n * 2)), mark: plan.n };
  });

  protected useConvention(w: number): void {
    this.source.set('w');
    this.w.set(w);
  }
}
