import { TestBed } from '@angular/core/testing';
import { analyze, categoryCells } from '@tallyfit/engine';
import { CategoriesTable } from './categories-table';

describe('CategoriesTable', () => {
  // Five equal shares, N = 500: "b" and "d" have adjusted residuals of ±2.01 (beyond ±1.96) but
  // Holm-adjusted p of 0.13, so only "a" and "e" stand out — the two the write-up names.
  const result = analyze({ observed: { labels: ['a', 'b', 'c', 'd', 'e'], counts: [140, 118, 100, 82, 60] }, hypothesis: { kind: 'equal' } });

  function render(): HTMLElement {
    TestBed.configureTestingModule({ imports: [CategoriesTable] });
    const fixture = TestBed.createComponent(CategoriesTable);
    fixture.componentRef.setInput('result', result);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('marks exactly the categories the write-up says drive the difference', () => {
    const root = render();
    const marked = [...root.querySelectorAll('tbody tr')]
      .filter((row) => /[▲▼]/.test(row.textContent ?? ''))
      .map((row) => row.querySelector('th')?.textContent?.trim());
    expect(marked).toEqual(['a', 'e']);
    expect(result.report.results).toContain('driven by "a"');
    expect(result.report.results).toContain('and "e"');
    expect(result.report.results).not.toContain('"b" (');
    expect(result.report.results).not.toContain('"d" (');
  });

  it('heads the columns in our own words', () => {
    const headers = [...render().querySelectorAll('thead th')].map((cell) => cell.textContent?.replace(/\s+/g, ' ').trim());
    expect(headers).toContain('Gap in standard errors');
    expect(headers).toContain('Gap per √expected');
    expect(headers).toContain('p (Holm)');
    expect(headers.join(' ')).not.toMatch(/residual/i);
  });

  it('prints the cells the reports print', () => {
    const firstRow = render().querySelector('tbody tr')?.textContent?.replace(/\s+/g, ' ') ?? '';
    const cells = categoryCells(result)[0];
    for (const text of [cells.observed, cells.expected, cells.share, cells.expectedShare, cells.gap, cells.p, cells.intervalLow, cells.intervalHigh]) {
      expect(firstRow).toContain(text);
    }
  });
});
