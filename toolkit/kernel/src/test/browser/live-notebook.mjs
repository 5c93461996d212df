// Opens one worked notebook in Jupyter Notebook (classic UI, Debian's jupyter-notebook) in headless
// Chromium, runs every cell from the Cell menu as a user does, and reports what the live page shows:
// tables, charts (svg with drawn paths), rendered math, and an in-place progress display.
//
// Used by LiveBrowserIT (toolkit/kernel/src/test/java/org/microtally/kernel/LiveBrowserIT.java), which
// starts the server and checks the report. The last line printed is the report: "LIVE-REPORT {json}".
//
//   node live-notebook.mjs --base http://127.0.0.1:PORT --token T --notebook 01-trap-of-bosons.ipynb \
//        --chromium /usr/lib/chromium/chromium --shots DIR --timeout 220
import { chromium } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';

const args = Object.fromEntries(process.argv.slice(2).reduce((pairs, a, i, all) => {
  if (a.startsWith('--')) pairs.push([a.slice(2), all[i + 1]]);
  return pairs;
}, []));
for (const need of ['base', 'token', 'notebook', 'chromium', 'shots']) {
  if (!args[need]) {
    console.error(`live-notebook: missing --${need}`);
    process.exit(64);
  }
}
const timeoutSeconds = Number(args.timeout ?? 220);
const started = Date.now();
const seconds = () => Math.round((Date.now() - started) / 100) / 10;
const log = (msg) => console.log(`live-notebook [${seconds()} s] ${msg}`);

let browser;
// The hard bound: whatever hangs (server, kernel, browser), the script ends and says where it was.
let stage = 'starting';
const killer = setTimeout(async () => {
  console.log('LIVE-REPORT ' + JSON.stringify({ ok: false, error: `timed out after ${timeoutSeconds} s while ${stage}` }));
  try { await browser?.close(); } catch { /* already gone */ }
  process.exit(3);
}, timeoutSeconds * 1000);

function report(result) {
  clearTimeout(killer);
  console.log('LIVE-REPORT ' + JSON.stringify(result));
}

try {
  mkdirSync(args.shots, { recursive: true });
  stage = 'launching Chromium';
  browser = await chromium.launch({
    executablePath: args.chromium,
    headless: true,
    // root in a container: no user-namespace sandbox; no GPU; a closed network, so no background
    // connections (updates, sync, field trials) that would only be refused
    args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--no-first-run', '--disable-quic',
      '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  const consoleErrors = [];
  page.on('pageerror', (e) => consoleErrors.push(String(e)));

  stage = 'opening the notebook';
  const url = `${args.base}/notebooks/${encodeURIComponent(args.notebook)}?token=${encodeURIComponent(args.token)}`;
  await page.goto(url, { waitUntil: 'load', timeout: 60_000 });
  log(`opened ${args.notebook} (${await page.title()})`);

  // What a user waits for: the kernel indicator turns idle and names our kernel.
  stage = 'waiting for the kernel to start';
  await page.waitForSelector('#kernel_indicator_icon.kernel_idle_icon', { timeout: 90_000 });
  const kernelName = (await page.textContent('.kernel_indicator_name'))?.trim() ?? '';
  log(`kernel idle: "${kernelName}"`);

  // Watch every progress display while the cells run: how many per cell at once, and what they show.
  await page.evaluate(() => {
    const seen = { states: {}, maxAtOnce: {}, samples: 0 };
    window.__liveProgress = seen;
    const cellsOf = () => Array.from(document.querySelectorAll('#notebook-container .cell'));
    const sample = () => {
      seen.samples++;
      const cells = cellsOf();
      cells.forEach((cell, index) => {
        const bars = cell.querySelectorAll(
          '.output_subarea progress, .output_subarea meter, .output_subarea [role="progressbar"],'
          + ' .output_subarea [class*="progress"]');
        // nested matches (a progress element inside a progress container) count once
        const outer = Array.from(bars).filter((b) => !Array.from(bars).some((o) => o !== b && o.contains(b)));
        if (outer.length === 0) return;
        const key = String(index + 1);
        seen.maxAtOnce[key] = Math.max(seen.maxAtOnce[key] ?? 0, outer.length);
        const states = (seen.states[key] ??= []);
        for (const b of outer) {
          const value = b.matches('progress') ? b.value : b.querySelector('progress')?.value;
          const state = `${value ?? ''}|${b.textContent.trim()}`;
          if (!states.includes(state) && states.length < 500) states.push(state);
        }
      });
    };
    new MutationObserver(sample).observe(document.getElementById('notebook-container'),
      { subtree: true, childList: true, attributes: true, characterData: true });
  });

  // As a user does: the Cell menu, then "Run All".
  stage = 'running all cells';
  await page.click('#celllink');
  await page.click('#run_all_cells > a');
  log('Cell > Run All clicked');

  // Done when no prompt shows [*] for a few polls in a row and the kernel is idle again.
  let quiet = 0;
  let sawBusy = false;
  while (quiet < 4) {
    await page.waitForTimeout(500);
    const state = await page.evaluate(() => ({
      busy: Array.from(document.querySelectorAll('.code_cell .input_prompt')).some((p) => p.textContent.includes('*')),
      idle: !!document.querySelector('#kernel_indicator_icon.kernel_idle_icon'),
    }));
    sawBusy ||= state.busy;
    quiet = sawBusy && !state.busy && state.idle ? quiet + 1 : 0;
  }
  log('all cells finished');

  stage = 'waiting for math to typeset';
  // MathJax 2 (bundled with the classic notebook) typesets asynchronously: wait for its queue.
  await page.waitForFunction(() => !window.MathJax || !window.MathJax.Hub
      || (window.MathJax.Hub.queue.pending === 0 && !document.querySelector('.MathJax_Processing')),
    null, { timeout: 30_000 });

  stage = 'reading the page';
  const found = await page.evaluate(() => {
    const visible = (el) => {
      const r = el.getBoundingClientRect();
      return r.width > 0 && r.height > 0;
    };
    const codeCells = Array.from(document.querySelectorAll('#notebook-container .code_cell'));
    const allCells = Array.from(document.querySelectorAll('#notebook-container .cell'));
    const number = (cell) => allCells.indexOf(cell) + 1;
    const executed = codeCells.filter((c) => /\[\d+\]/.test(c.querySelector('.input_prompt')?.textContent ?? ''));
    const errors = Array.from(document.querySelectorAll('.output_error')).map((e) => ({
      cell: number(e.closest('.cell')), text: e.textContent.trim().slice(0, 400),
    }));
    const tables = Array.from(document.querySelectorAll('.output_subarea table')).filter(visible).map((t) => ({
      cell: number(t.closest('.cell')),
      rows: t.querySelectorAll('tr').length,
      numericCells: Array.from(t.querySelectorAll('td')).filter((td) => /^[-+\u2212]?[0-9.,\s]+([eE\u00d7][-+\u2212]?\d+)?/.test(td.textContent.trim())).length,
    }));
    const charts = Array.from(document.querySelectorAll('.output_subarea svg')).filter(visible).map((s) => {
      const paths = Array.from(s.querySelectorAll('path, polyline, polygon, line, rect, circle'));
      const drawn = paths.filter((p) => (p.getAttribute('d') ?? p.getAttribute('points') ?? 'x').length > 10
          || p.tagName !== 'path');
      const r = s.getBoundingClientRect();
      return {
        cell: number(s.closest('.cell')), width: Math.round(r.width), height: Math.round(r.height),
        paths: s.querySelectorAll('path').length, drawn: drawn.length, texts: s.querySelectorAll('text').length,
      };
    }).filter((c) => c.width >= 200 && c.height >= 100);
    const images = Array.from(document.querySelectorAll('.output_subarea img')).filter(visible)
      .filter((i) => i.naturalWidth > 50).map((i) => ({ cell: number(i.closest('.cell')), width: i.naturalWidth }));
    const mathSelector = '.MathJax, .MathJax_Display, .MathJax_SVG, .MathJax_CHTML, mjx-container, .katex, math';
    const math = Array.from(document.querySelectorAll(mathSelector)).filter(visible)
      .filter((m) => !m.parentElement.closest(mathSelector));
    const mathIn = (sel) => math.filter((m) => m.closest(sel)).length;
    const mathErrors = Array.from(document.querySelectorAll('.MathJax_Error, merror, mjx-merror'))
      .map((e) => ({ cell: number(e.closest('.cell')), text: e.textContent.trim().slice(0, 200) }));
    // TeX a renderer left as text: a $ pair in rendered markdown that did not become math
    const rawTex = Array.from(document.querySelectorAll('.text_cell_render')).flatMap((r) => {
      const walker = document.createTreeWalker(r, NodeFilter.SHOW_TEXT);
      const out = [];
      for (let n = walker.nextNode(); n; n = walker.nextNode()) {
        if (n.parentElement.closest('code, pre, script, ' + mathSelector)) continue;
        if (/\$[^$\s][^$]*\$/.test(n.textContent) || /\\(frac|mathrm|sum|beta)\b/.test(n.textContent)) {
          out.push({ cell: number(r.closest('.cell')), text: n.textContent.trim().slice(0, 120) });
        }
      }
      return out;
    });
    return {
      codeCells: codeCells.length, executedCells: executed.length, errors, tables, charts, images,
      math: { total: math.length, inMarkdown: mathIn('.text_cell_render'), inOutputs: mathIn('.output_subarea') },
      mathErrors, rawTex,
      progress: window.__liveProgress,
    };
  });

  // the classic notebook scrolls inside #site: back to the top for the first screenful
  await page.evaluate(() => (document.getElementById('site') ?? document.scrollingElement).scrollTo(0, 0));
  await page.screenshot({ path: join(args.shots, 'live-notebook-top.png') });
  await page.screenshot({ path: join(args.shots, 'live-notebook-full.png'), fullPage: true });
  log(`screenshots in ${args.shots}`);
  report({ ok: true, seconds: seconds(), kernelName, consoleErrors, ...found });
} catch (e) {
  report({ ok: false, error: `${stage}: ${e && e.message ? e.message : e}`, seconds: seconds() });
} finally {
  try { await browser?.close(); } catch { /* already gone */ }
}
