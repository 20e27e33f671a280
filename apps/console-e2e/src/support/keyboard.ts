import type { Page } from 'playwright-core';

/** What has the keyboard focus, described as a person would name it. */
export async function focusedName(page: Page): Promise<string> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return '';
    const labelled = el.getAttribute('aria-label');
    if (labelled) return labelled;
    const byId = el.getAttribute('aria-labelledby');
    if (byId) return byId.split(' ').map((id) => document.getElementById(id)?.textContent?.trim() ?? '').join(' ').trim();
    const input = el as HTMLInputElement;
    if (input.labels?.length) return Array.from(input.labels).map((label) => label.textContent?.trim()).join(' ');
    // Icon ligatures are hidden from assistive technology; leave them out of the name too.
    const copy = el.cloneNode(true) as HTMLElement;
    copy.querySelectorAll('[aria-hidden="true"]').forEach((hidden) => hidden.remove());
    return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
  });
}

/** Presses Tab until the focused control's name matches, failing after `limit` presses. */
export async function tabTo(page: Page, name: RegExp, limit = 40): Promise<string> {
  const seen: string[] = [];
  for (let presses = 0; presses < limit; presses++) {
    await page.keyboard.press('Tab');
    const focused = await focusedName(page);
    seen.push(focused);
    if (name.test(focused)) return focused;
  }
  throw new Error(`no control named ${name} within ${limit} presses of Tab; focus went through: ${seen.join(' | ')}`);
}
