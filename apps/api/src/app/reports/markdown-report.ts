import { categoriesMarkdownTable, effectSizeText, testCells } from '@tallyfit/engine';
import { reportFacts, statisticsLines, type ReportSource } from './report-source';

/** Markdown has no escape for every character, but these would turn a title or label into markup. */
function inline(text: string): string {
  return text.replace(/([\\`*_[\]<>|#])/g, '\\$1').replace(/\r?\n/g, ' ');
}

/**
 * The analysis as one Markdown document: title and facts, the verdict, every test's statistics
 * line, the notes, then the engine's own write-up (method, result with its table, and what the
 * test does not show), and any warnings the engine gave.
 */
export function markdownReport(source: ReportSource, link?: string): string {
  const { result } = source;
  const lines: string[] = [`# ${inline(source.title)}`, ''];
  for (const [label, value] of reportFacts(source)) lines.push(`- **${label}:** ${inline(value)}`);
  if (link) lines.push(`- **In Tallyfit:** <${link}>`);
  lines.push('', '## Review', '');
  for (const line of source.reviewLines) lines.push(`- ${inline(line)}`);
  lines.push('', '## Verdict', '', result.conclusion.verdict, '');
  lines.push('## Statistics', '');
  for (const [test, line] of statisticsLines(result)) lines.push(`- ${test}: ${line}`);
  lines.push(`- Effect size: Cohen's ${effectSizeText(result)}`, '');
  lines.push('| Test | Statistic | df | p | How computed |', '| --- | ---: | ---: | ---: | --- |');
  for (const test of testCells(result)) lines.push(`| ${test.name} | ${test.statistic} | ${test.df} | ${test.p} | ${test.how} |`);
  lines.push('');
  if (source.notes?.trim()) lines.push('## Notes', '', source.notes.trim(), '');
  // The table is drawn from today's shared cells (not the stored write-up's copy) so the digits match the page.
  lines.push('## Method', '', result.report.methods, '', '## Result', '', result.report.results, '', categoriesMarkdownTable(result), '');
  lines.push('## What this does not show', '', ...result.report.cautions.map((caution) => `- ${caution}`), '');
  if (source.segments) {
    lines.push(`## Segments by ${inline(source.segments.column)}`, '', source.segments.result.report.paragraph, '', source.segments.result.report.table, '');
  }
  if (result.warnings.length) {
    lines.push('## Warnings from the engine', '');
    for (const warning of result.warnings) lines.push(`- ${warning.message}`);
    lines.push('');
  }
  return lines.join('\n');
}
