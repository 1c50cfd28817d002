import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';

/** Debian's Chromium, or the one CHROMIUM_PATH names; browser tests never download a browser. */
export function findChromium(): string | null {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(Boolean) as string[];
  return candidates.find((path) => existsSync(path)) ?? null;
}

export const chromiumMissingHint =
  'Browser tests skipped: no Chromium found. Install it with `apt-get install -y chromium` or set CHROMIUM_PATH.';

export function launchChromium(executablePath: string): Promise<Browser> {
  return chromium.launch({
    executablePath,
    headless: true,
    // Without the networking switches Chromium keeps trying to reach outside hosts, which this
    // sandbox refuses; the others keep a headless run quiet and deterministic.
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
}
