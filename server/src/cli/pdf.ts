// Prints report HTML to PDF in a local Chromium through playwright-core. This is the only code of
// the report that starts a program; the page is set from a string and every request it might make
// is refused, so nothing is fetched.
import { delimiter, join } from 'node:path';
import type { CliFs } from './io';

export const CHROMIUM_NAMES = ['chromium', 'chromium-browser', 'google-chrome', 'google-chrome-stable'];
export const CHROMIUM_HINT = 'install it with `apt-get install chromium` (or set RUNGS_CHROMIUM to a Chromium program)';

/** RUNGS_CHROMIUM when set (and only it), else the first Chromium on PATH; null when none. */
export function findChromium(env: Record<string, string | undefined>, fs: CliFs): string | null {
  const named = env.RUNGS_CHROMIUM;
  if (named) return fs.exists(named) ? named : null;
  for (const dir of (env.PATH ?? '').split(delimiter).filter(Boolean)) {
    for (const name of CHROMIUM_NAMES) {
      const p = join(dir, name);
      if (fs.exists(p) && !fs.isDirectory(p)) return p;
    }
  }
  return null;
}

export type Paper = 'A4' | 'Letter';

export async function printPdf(html: string, out: string, paper: Paper, executablePath: string): Promise<void> {
  // Loaded only here: `rungs report` without --pdf never needs it.
  let chromium: typeof import('playwright-core').chromium;
  try {
    ({ chromium } = await import('playwright-core'));
  } catch {
    throw new Error('the npm package playwright-core is not installed (npm install playwright-core)');
  }
  const browser = await chromium.launch({
    executablePath,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run'],
  });
  try {
    const page = await browser.newPage({ javaScriptEnabled: false });
    await page.route('**/*', (route) => route.abort());
    await page.setContent(html, { waitUntil: 'load' });
    await page.emulateMedia({ media: 'print' });
    await page.pdf({ path: out, format: paper, printBackground: true, preferCSSPageSize: false });
  } finally {
    await browser.close();
  }
}
