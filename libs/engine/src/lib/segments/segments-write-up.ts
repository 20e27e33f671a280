/**
 * The write-up of a segment analysis: a ranked Markdown table and one paragraph saying which
 * segments depart from the hypothesis after the family's adjustment, which categories drive them,
 * and which segments were too small or could not be tested.
 */
import type { MainTest } from '../result/analysis-result';
import { formatP, formatPValue, formatShare, formatStatistic, groupDigits } from '../report/format-numbers';
import type { SegmentAdjustMethod, SegmentRow, SegmentsResult } from './analyze-segments';

const adjustNames: Record<SegmentAdjustMethod, string> = {
  holm: "Holm's step-down method, which keeps the chance of any false alarm among the segments at α",
  'benjamini-hochberg': 'the Benjamini–Hochberg procedure, which keeps the expected share of false alarms among the flagged segments at α',
};

const testNames: Record<MainTest, string> = {
  pearson: "Pearson's X²",
  g: 'the G-test',
  'cressie-read': 'the Cressie–Read test',
  exact: 'the exact multinomial test',
};

const plural = (n: number, one: string, many = `${one}s`) => `${groupDigits(n)} ${n === 1 ? one : many}`;
const cell = (text: string) => text.replace(/\|/g, '\\|');

function driversText(row: SegmentRow): string {
  const more = row.drivers.filter((driver) => driver.direction === 'more').map((driver) => `“${driver.label}”`);
  const fewer = row.drivers.filter((driver) => driver.direction === 'fewer').map((driver) => `“${driver.label}”`);
  const parts = [more.length ? `more ${more.join(' and ')}` : '', fewer.length ? `fewer ${fewer.join(' and ')}` : ''].filter(Boolean);
  return parts.length ? `${parts.join(', ')} than expected` : '';
}

function table(rows: SegmentRow[]): string {
  const head = '| Rank | Segment | N | Test | Statistic | df | p | Adjusted p | w | Driven by | Note |';
  const rule = '| ---: | --- | ---: | --- | ---: | ---: | ---: | ---: | ---: | --- | --- |';
  const lines = rows.map((row) =>
    [
      row.rank ?? '—',
      cell(row.segment),
      groupDigits(row.n),
      row.test ? testNames[row.test] : '—',
      row.statistic !== undefined ? formatStatistic(row.statistic) : '—',
      row.df ?? '—',
      row.p !== undefined ? formatPValue(row.p) : '—',
      row.pAdjusted !== undefined ? formatPValue(row.pAdjusted) : '—',
      row.w !== undefined ? formatShare(row.w) : '—',
      cell(driversText(row)) || '—',
      cell(row.flag?.message ?? ''),
    ].join(' | '),
  );
  return [head, rule, ...lines.map((line) => `| ${line} |`)].join('\n');
}

function paragraph(result: Omit<SegmentsResult, 'report' | 'engineVersion'>, segmentName?: string): string {
  const by = segmentName ? ` by ${segmentName}` : '';
  const tested = result.rows.filter((row) => row.rank !== undefined);
  const significant = tested.filter((row) => row.significant);
  const sentences: string[] = [];
  sentences.push(
    `The same test was run in each of ${plural(result.familySize, 'segment')}${by}, and the ${plural(result.familySize, 'p-value')} were adjusted with ${adjustNames[result.adjust]} (α = ${result.alpha}).`,
  );
  if (significant.length === 0) {
    sentences.push('No segment departs from the hypothesis after the adjustment.');
  } else {
    const described = significant.map((row) => {
      const drivers = driversText(row);
      return `${row.segment} (${row.line}, adjusted ${formatP(row.pAdjusted!)}, w = ${formatShare(row.w!)}${drivers ? `; ${drivers}` : ''})`;
    });
    sentences.push(
      `${significant.length === 1 ? 'One segment departs' : `${plural(significant.length, 'segment')} depart`} from the hypothesis after the adjustment: ${described.join('; ')}.`,
    );
    const rest = tested.length - significant.length;
    if (rest > 0) sentences.push(`The other ${plural(rest, 'segment')} show no detectable departure.`);
  }
  const tooSmall = result.rows.filter((row) => row.flag?.code === 'too-small');
  if (tooSmall.length) {
    sentences.push(
      `${plural(tooSmall.length, 'segment')} (${tooSmall.map((row) => `${row.segment}, N = ${groupDigits(row.n)}`).join('; ')}) ${tooSmall.length === 1 ? 'was' : 'were'} too small for the chi-square approximation and ${tooSmall.length === 1 ? 'is' : 'are'} flagged in the table.`,
    );
  }
  const untested = result.rows.filter((row) => row.flag?.code === 'not-tested');
  if (untested.length) {
    sentences.push(`Not tested: ${untested.map((row) => `${row.segment} (${row.flag!.message})`).join('; ')}.`);
  }
  sentences.push('A segment with no detectable departure is not shown to match the hypothesis, and a small adjusted p in a large segment can come with a small w.');
  return sentences.join(' ');
}

export function segmentsWriteUp(result: Omit<SegmentsResult, 'report' | 'engineVersion'>, segmentName?: string): SegmentsResult['report'] {
  return { table: table(result.rows), paragraph: paragraph(result, segmentName) };
}
