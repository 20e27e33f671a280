import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { SCREENSHOT_DIR } from './paths';

export const CHROMIUM_PATH = process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium';

/** Debian's Chromium, headless; the flags keep it from reaching for the network it does not have. */
export async function launchBrowser(): Promise<Browser> {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new Error(`Chromium is not installed at ${CHROMIUM_PATH}: run "apt-get install -y chromium"`);
  }
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const path = join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}
