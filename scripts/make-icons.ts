// Renders the app icon (an SVG of our own) to the PNG sizes an installable web app
// needs, with Debian's Chromium. Run by hand when the icon changes:
//   node --import tsx scripts/make-icons.ts
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { ROOT } from './lib/env';

/** The mark: a tyre's contact line sweeping out of a corner, on our teal. `pad` leaves the maskable safe zone. */
const icon = (pad: number) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100">
  <rect width="100" height="100" rx="${pad ? 0 : 22}" fill="#0d6b66"/>
  <g transform="translate(${pad} ${pad}) scale(${(100 - 2 * pad) / 100})">
    <path d="M24 68c10-21 24-29 52-35" fill="none" stroke="#fff" stroke-width="9.5" stroke-linecap="round"/>
    <circle cx="29" cy="71" r="8" fill="#fff"/>
  </g>
</svg>`;

const outputs = [
  { file: 'icon-192.png', size: 192, pad: 0 },
  { file: 'icon-512.png', size: 512, pad: 0 },
  { file: 'icon-maskable-512.png', size: 512, pad: 12 },
  { file: 'apple-touch-icon-180.png', size: 180, pad: 8 },
];

const profile = mkdtempSync(join(tmpdir(), 'scrubline-icons-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
const page = context.pages()[0] ?? (await context.newPage());
const dir = join(ROOT, 'public', 'icons');
mkdirSync(dir, { recursive: true });
for (const o of outputs) {
  await page.setViewportSize({ width: o.size, height: o.size });
  await page.setContent(`<html><body style="margin:0">${icon(o.pad).replace('<svg ', `<svg width="${o.size}" height="${o.size}" `)}</body></html>`);
  await page.screenshot({ path: join(dir, o.file), omitBackground: true });
  console.log(`wrote public/icons/${o.file}`);
}
await context.close();
rmSync(profile, { recursive: true, force: true });
