import type { Page } from 'playwright-core';
import type { Role } from '@tallyfit/contracts';
import { DEMO_PASSWORD } from './tallyfit-server';

/** Signs a demo person in through the console's own form and waits for the first page. */
export async function signInAs(page: Page, baseUrl: string, role: Role, path = '/studies'): Promise<void> {
  await page.goto(`${baseUrl}/sign-in?returnUrl=${encodeURIComponent(path)}`);
  await page.getByLabel('E-mail').fill(`${role}@demo.tallyfit.local`);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === path.split('?')[0]);
}
