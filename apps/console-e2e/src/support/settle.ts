import type { Page } from 'playwright-core';

/** Waits until no CSS animation or transition is running, so a screenshot shows the finished state. */
export async function settle(page: Page): Promise<void> {
  await page.waitForFunction(() => document.getAnimations().every((animation) => animation.playState !== 'running'), undefined, {
    timeout: 5_000,
  });
}
