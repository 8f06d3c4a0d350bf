import { existsSync } from 'node:fs';

/** Browser tests drive Debian's Chromium; nothing is downloaded at install time. */
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** The path of the browser, or a clear instruction when it is missing (never a silent skip). */
export function chromiumPath(): string {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new Error(
      `Chromium was not found at ${CHROMIUM_PATH}. Browser tests need it: ` +
        'install it with `sudo apt-get update && sudo apt-get install -y chromium`, ' +
        'or point CHROMIUM_PATH at another Chromium binary.',
    );
  }
  return CHROMIUM_PATH;
}
