import { afterEach } from 'vitest';
import { openPages, pageJournal, SCREENSHOT_DIR } from './browser';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';

/**
 * When an end-to-end test fails, says what each open phone showed: its address, what a screen reader would read
 * (trimmed), its last console lines and requests, and a screenshot under test-results/e2e. A timeout alone says
 * only what was awaited; this says why it never came.
 */
afterEach(async ({ task }) => {
  if (task.result?.state !== 'fail') return;
  let n = 0;
  for (const page of openPages()) {
    n += 1;
    const lines: string[] = [`--- phone ${n} at ${page.url()}`];
    try {
      mkdirSync(SCREENSHOT_DIR, { recursive: true });
      const file = join(SCREENSHOT_DIR, `failed-${task.name.slice(0, 40).replace(/[^a-z0-9]+/gi, '-')}-${n}.png`);
      await page.screenshot({ path: file, timeout: 5000 });
      lines.push(`screenshot: ${file}`);
      lines.push((await page.locator('body').ariaSnapshot({ timeout: 5000 })).slice(0, 2500));
    } catch (error) {
      lines.push(`(the page could not be read: ${(error as Error).message.split('\n')[0]})`);
    }
    lines.push('last console lines and requests:', ...pageJournal(page).slice(-25));
    console.error(lines.join('\n'));
  }
});
