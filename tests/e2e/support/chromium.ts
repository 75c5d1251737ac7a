import { chromium, type Browser, type Page } from 'playwright-core';

/** Launch flags of the ground rules for Debian's Chromium in a sandbox-less container. */
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Starts Debian's /usr/bin/chromium through playwright-core. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS, headless: true });
}

/** What went wrong on a page: uncaught exceptions and console errors, collected from the start. */
export interface PageProblems {
  readonly exceptions: string[];
  readonly consoleErrors: string[];
}

/** Collects uncaught exceptions (`pageerror`) and console errors of a page. */
export function watchProblems(page: Page): PageProblems {
  const problems: PageProblems = { exceptions: [], consoleErrors: [] };
  page.on('pageerror', (error) => problems.exceptions.push(String(error?.stack ?? error)));
  page.on('console', (message) => {
    if (message.type() === 'error') problems.consoleErrors.push(message.text());
  });
  return problems;
}
