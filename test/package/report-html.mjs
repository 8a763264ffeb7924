#!/usr/bin/env node
// npm run test:browser (second part) — the HTML report in a real browser. Needs `npm run build`
// first (it runs dist/cli.js).
//
// Runs the demo and the coordinates example with --format html, opens each page in headless
// Chromium from Debian's `chromium` package through playwright-core (never a downloaded
// browser; installed with apt-get when missing and we are root, as browser.mjs does), and
// checks that the page rendered: the header, the tables (traverse sheet, level book,
// coordinate list, triangle solution), the verdict, the inline sketch with its panels; that
// the page asks for nothing from the network; and that it prints to A4 as a PDF. A screenshot
// is taken as a smoke test of the layout (kept only when QUADSPREAD_KEEP_SCREENSHOT is set).
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const CHROMIUM = '/usr/bin/chromium';
const root = resolve(import.meta.dirname, '../..');
const cli = join(root, 'dist/cli.js');
const started = Date.now();

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) throw new Error(`${CHROMIUM} is missing: install Debian's chromium package`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium'], {
    stdio: 'inherit',
    env,
  });
}

let passed = 0;
let failed = 0;
function check(ok, what) {
  if (ok) passed++;
  else failed++;
  console.log(`  ${ok ? '✓' : '✗'} ${what}`);
}

const dir = mkdtempSync(join(tmpdir(), 'quadspread-html-'));
let context;
try {
  if (!existsSync(cli)) throw new Error('dist/cli.js is missing: run npm run build first');
  ensureChromium();
  const { chromium } = await import('playwright-core');
  context = await chromium.launchPersistentContext(join(dir, 'profile'), {
    executablePath: CHROMIUM,
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-sync'],
  });
  const jobs = [
    {
      args: ['demo'],
      name: 'demo',
      tables: [
        'traverse-sheet',
        'coordinates',
        'level-book-rise-fall',
        'level-book-collimation',
        'triangle',
      ],
    },
    {
      args: ['run', 'examples/coordinates.json'],
      name: 'coordinates',
      tables: ['traverse-sheet', 'adjusted-courses', 'level-book-rise-fall'],
    },
  ];
  for (const job of jobs) {
    console.log(`report-html: ${job.name}`);
    const html = execFileSync(
      process.execPath,
      [cli, ...job.args, '--format', 'html', '--date', '2026-01-31'],
      {
        cwd: root,
        encoding: 'utf8',
      },
    );
    const file = join(dir, `${job.name}.html`);
    writeFileSync(file, html);
    const page = await context.newPage();
    const requests = [];
    const errors = [];
    page.on('request', (r) => {
      if (!r.url().startsWith('file:')) requests.push(r.url());
    });
    page.on('pageerror', (e) => errors.push(String(e)));
    await page.goto(pathToFileURL(file).href);
    const facts = await page.evaluate(() => ({
      title: document.querySelector('h1')?.textContent ?? '',
      header: document.querySelector('dl.header')?.textContent ?? '',
      tables: [...document.querySelectorAll('table.sheet')].map((t) => ({
        name: t.getAttribute('data-table'),
        rows: t.querySelectorAll('tbody tr').length,
        width: t.getBoundingClientRect().width,
      })),
      verdict: document.getElementById('verdict')?.textContent ?? '',
      verdicts: [...document.querySelectorAll('table.checks td.pass, table.checks td.fail')].map(
        (td) => td.textContent,
      ),
      svgPanels: document.querySelectorAll('.sketch svg g.panel').length,
      bodyWidth: document.body.getBoundingClientRect().width,
      caution: document.querySelector('.caution')?.textContent ?? '',
      scripts: document.querySelectorAll('script').length,
    }));
    check(
      facts.title.length > 0,
      `the page has the job's title (${JSON.stringify(facts.title.slice(0, 50))}…)`,
    );
    check(
      /Date2026-01-31/.test(facts.header) &&
        /quadspread \d/.test(facts.header) &&
        /Checked by/.test(facts.header),
      'the header gives date, program version and checked by',
    );
    for (const t of job.tables) {
      const found = facts.tables.find((x) => x.name === t || x.name.startsWith(t));
      check(
        found !== undefined && found.rows > 0,
        `table ${t} rendered with ${found?.rows ?? 0} rows`,
      );
    }
    check(
      /^Checks: \d+ passed, \d+ failed \(of \d+\)\.$/.test(facts.verdict),
      `the verdict is there: ${facts.verdict}`,
    );
    check(
      facts.verdicts.length > 0 && facts.verdicts.every((v) => v === 'PASS' || v === 'FAIL'),
      `each check has its verdict (${facts.verdicts.length})`,
    );
    check(facts.svgPanels > 0, `the sketch is inline with ${facts.svgPanels} panels`);
    check(
      facts.tables.every((x) => x.width <= facts.bodyWidth + 1),
      'every table fits the page width',
    );
    check(/computational aid/.test(facts.caution), 'the caution ends the page');
    check(
      facts.scripts === 0 && requests.length === 0,
      `self-contained: no scripts, no requests (${requests.join(', ')})`,
    );
    check(errors.length === 0, `no page errors ${errors.join('; ')}`);
    const png = await page.screenshot({ fullPage: true });
    check(png.length > 10000, `a screenshot of ${png.length} bytes`);
    if (process.env.QUADSPREAD_KEEP_SCREENSHOT)
      writeFileSync(resolve(process.env.QUADSPREAD_KEEP_SCREENSHOT, `${job.name}.png`), png);
    const pdf = await page.pdf({ format: 'A4' });
    check(
      pdf.subarray(0, 5).toString() === '%PDF-' && pdf.length > 10000,
      `prints to A4 (${pdf.length} bytes of PDF)`,
    );
    await page.close();
  }
} catch (e) {
  failed++;
  console.log(String(e.stack ?? e));
} finally {
  await context?.close();
  rmSync(dir, { recursive: true, force: true });
}
console.log(
  `\nreport-html: ${passed} passed, ${failed} failed (${((Date.now() - started) / 1000).toFixed(1)} s)`,
);
process.exit(failed > 0 ? 1 : 0);
