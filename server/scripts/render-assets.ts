/**
 * Renders the product's own icon, favicon and splash (assets/*.svg, drawn for Holonaut) to the PNGs
 * app.json names, in Debian's Chromium: `npx tsx server/scripts/render-assets.ts`. The PNGs are
 * committed; run this again after editing an SVG.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { chromium } from 'playwright-core';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const ASSETS = path.join(ROOT, 'assets');
// the page is about:blank, which may not load file URLs: the font goes inline
const INTER_BOLD = `data:font/ttf;base64,${readFileSync(path.join(ROOT, 'node_modules/@expo-google-fonts/inter/700Bold/Inter_700Bold.ttf')).toString('base64')}`;

/** source SVG → PNG file at a square or given size (px). */
const OUTPUTS = [
  { svg: 'icon.svg', png: 'icon.png', width: 1024, height: 1024 },
  { svg: 'icon.svg', png: 'favicon.png', width: 48, height: 48 },
  { svg: 'splash.svg', png: 'splash.png', width: 1284, height: 2778 },
];

async function main(): Promise<void> {
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  try {
    for (const o of OUTPUTS) {
      const page = await browser.newPage({ viewport: { width: o.width, height: o.height } });
      const svg = readFileSync(path.join(ASSETS, o.svg), 'utf8').replace(/width="\d+" height="\d+"/, 'width="100%" height="100%"');
      await page.setContent(
        `<style>@font-face{font-family:Inter;font-weight:700;src:url(${INTER_BOLD})}html,body{margin:0;background:transparent}svg{display:block}</style>${svg}`,
      );
      await page.evaluate(() => document.fonts.ready);
      await page.screenshot({ path: path.join(ASSETS, o.png), omitBackground: true });
      await page.close();
      console.log(`assets/${o.png} ${o.width}×${o.height}`);
    }
  } finally {
    await browser.close();
  }
}

await main();
