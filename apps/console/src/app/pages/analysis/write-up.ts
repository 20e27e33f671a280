import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MarkdownComponent, provideMarkdown } from 'ngx-markdown';

/**
 * The engine's write-up (methods, results, table, cautions) rendered from its Markdown, with a
 * button that copies the Markdown. Loaded lazily with the markdown renderer.
 */
@Component({
  selector: 'tf-write-up',
  imports: [MatButtonModule, MatIconModule, MarkdownComponent],
  providers: [provideMarkdown()],
  templateUrl: './write-up.html',
  styleUrl: './write-up.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WriteUp {
  private readonly clipboard = inject(Clipboard);
  readonly markdown = input.required<string>();
  /** the APA-style statistics line, offered for copying on its own */
  readonly line = input<string>('');
  protected readonly copied = signal<'all' | 'line' | null>(null);

  protected copy(what: 'all' | 'line'): void {
    const ok = this.clipboard.copy(what === 'all' ? this.markdown() : this.line());
    this.copied.set(ok ? what : null);
  }
}
