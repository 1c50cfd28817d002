import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { inject } from 'vitest';
import { launchChromium } from './chromium';

export const baseUrl = inject('baseUrl');
export const chromiumPath = inject('chromiumPath');
export const hasBrowser = chromiumPath !== '';

const screenshotDir = resolve(import.meta.dirname, 'screenshots');

export async function openBrowser(): Promise<Browser> {
  return launchChromium(chromiumPath);
}

/** Saves a full-page screenshot under tests/e2e/screenshots (kept out of git) for a person to look at. */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
}

/** Signs in through the form, the way a person does. */
export async function signInAs(page: Page, email: string, password = 'kcatalog-demo'): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}
