import { ChangeDetectionStrategy, Component, DestroyRef, inject, OnInit, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators, type FormControl, type FormGroup } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { startWith } from 'rxjs';
import type { ParsedCounts } from './pasted-counts';

type CountRow = FormGroup<{ label: FormControl<string>; count: FormControl<number | null> }>;

/** Categories typed one per row, with their observed counts. Emits the counts whenever they are complete and valid. */
@Component({
  selector: 'tf-typed-counts',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  templateUrl: './typed-counts.html',
  styleUrl: './typed-counts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TypedCounts implements OnInit {
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly destroyRef = inject(DestroyRef);

  /** the counts when every row is filled in correctly and the labels differ; null otherwise */
  readonly countsChange = output<ParsedCounts | null>();

  protected readonly rows = this.fb.array<CountRow>([this.newRow('A'), this.newRow('B')]);
  protected readonly duplicateLabel = signal<string | null>(null);

  ngOnInit(): void {
    this.rows.valueChanges.pipe(startWith(null), takeUntilDestroyed(this.destroyRef)).subscribe(() => this.countsChange.emit(this.current()));
  }

  protected addRow(): void {
    this.rows.push(this.newRow(''));
  }

  protected removeRow(index: number): void {
    if (this.rows.length > 2) this.rows.removeAt(index);
  }

  private current(): ParsedCounts | null {
    const values = this.rows.getRawValue();
    const labels = values.map((row) => row.label.trim());
    const seen = new Set<string>();
    const duplicate = labels.find((label) => label !== '' && (seen.has(label) || !seen.add(label))) ?? null;
    this.duplicateLabel.set(duplicate);
    if (this.rows.invalid || duplicate !== null) return null;
    const counts = values.map((row) => Number(row.count));
    return counts.some((count) => count > 0) ? { labels, counts } : null;
  }

  private newRow(label: string): CountRow {
    return this.fb.group({
      label: this.fb.control(label, [Validators.required, Validators.maxLength(200)]),
      count: this.fb.control<number | null>(null, [Validators.required, Validators.min(0), Validators.pattern(/^\d+$/)]),
    });
  }
}
