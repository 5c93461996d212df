// Screenshots of HTML pages in headless Chromium at 1280 px: for every page a full-length image, the
// page cut into 1280 x 1600 tiles (to look at), and the first screenful (1280 x 900).
// Run by make-screenshots.sh beside this file, which installs the pinned playwright-core first.
//
//   node shoot-pages.mjs --chromium /usr/lib/chromium/chromium --out DIR --suffix run a.html b.html ...
import { chromium } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const argv = process.argv.slice(2);
const opt = (name) => {
  const i = argv.indexOf(`--${name}`);
  if (i < 0 || i + 1 >= argv.length) throw new Error(`shoot-pages: missing --${name}`);
  const value = argv[i + 1];
  argv.splice(i, 2);
  return value;
};
const executablePath = opt('chromium');
const out = opt('out');
const suffix = opt('suffix');
const pages = argv;
const TILE = 1600;
mkdirSync(out, { recursive: true });

const browser = await chromium.launch({
  executablePath,
  headless: true,
  args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--no-first-run', '--disable-quic',
    '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
try {
  for (const file of pages) {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await page.goto(pathToFileURL(resolve(file)).href, { waitUntil: 'load', timeout: 60_000 });
    // pages that typeset math with MathJax 2 (nbconvert's export): wait for its queue to empty
    await page.waitForFunction(() => !window.MathJax || !window.MathJax.Hub
        || (window.MathJax.Hub.queue && window.MathJax.Hub.queue.pending === 0),
      null, { timeout: 30_000 }).catch(() => console.log(`shoot-pages: ${file}: math still typesetting after 30 s`));
    await page.evaluate(() => document.fonts.ready);
    const name = basename(file).replace(/\.html$/, '') + '-' + suffix;
    const height = await page.evaluate(() => document.documentElement.scrollHeight);
    await page.screenshot({ path: join(out, `${name}-top.png`) });
    await page.screenshot({ path: join(out, `${name}-full.png`), fullPage: true });
    let tiles = 0;
    for (let y = 0; y < height; y += TILE, tiles++) {
      await page.screenshot({
        path: join(out, `${name}-tile${String(tiles + 1).padStart(2, '0')}.png`), fullPage: true,
        clip: { x: 0, y, width: 1280, height: Math.min(TILE, height - y) },
      });
    }
    console.log(`shoot-pages: ${name}: ${height} px tall, ${tiles} tiles`);
    await page.close();
  }
} finally {
  await browser.close();
}
