import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { WORKSPACE_ROOT } from './paths';

const AXE_SCRIPT = join(WORKSPACE_ROOT, 'node_modules/axe-core/axe.min.js');

export interface AxeFinding {
  id: string;
  impact: string;
  help: string;
  targets: string[];
}

interface AxeResults {
  violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[];
}

/**
 * Runs axe-core inside the page and returns the serious and critical violations, each with the
 * elements it found, so a failing test names what to fix.
 */
export async function seriousAxeViolations(page: Page): Promise<AxeFinding[]> {
  const loaded = await page.evaluate(() => 'axe' in window);
  if (!loaded) await page.addScriptTag({ path: AXE_SCRIPT });
  const results = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (context: Document, options: object) => Promise<unknown> } }).axe;
    return axe.run(document, { resultTypes: ['violations'] });
  });
  return (results as AxeResults).violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => ({
      id: violation.id,
      impact: violation.impact ?? '',
      help: violation.help,
      targets: violation.nodes.map((node) => node.target.join(' ')),
    }));
}
