/**
 * P5 and P6 in Debian's Chromium (Playwright, never a downloaded browser) against the built
 * client served by Loomwright in its own process:
 * - P5: every byte the sign-in page downloads on a first visit, as sent over the wire
 *   (compressed), code and fonts apart, and which chunks it loaded;
 * - P6: time to interactive of the pin map at 1,000 and 2,000 pins — navigation start to the
 *   next paint after a click made as soon as the grid shows (Event Timing's first-input entry) —
 *   and cell edits (click, type, Enter) to their next paint, p95 of the interactions.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type Page, type Request } from '@playwright/test';
import playwrightConfig from '../../playwright.config.ts';
import { startServer } from '../lib/process.ts';
import type { BenchRow } from '../lib/report.ts';
import { alternate, num, spread, withUnit } from '../lib/stats.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const distDir = path.join(root, 'dist');

interface ProductInfo {
  port: number;
  conversionId: number;
  otherConversionId: number;
}

/** The client as it ships: built afresh unless BENCH_NO_BUILD is set and a build exists. */
function buildClient() {
  if (process.env.BENCH_NO_BUILD && existsSync(path.join(distDir, 'index.html'))) return;
  const built = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], {
    cwd: root,
    stdio: 'inherit',
  });
  if (built.status !== 0) throw new Error('vite build failed');
}

/** The browser tests' own Chromium and flags. */
function launch(): Promise<Browser> {
  return chromium.launch(playwrightConfig.use?.launchOptions);
}

const KB = 1024;

async function signInDownload(browser: Browser, url: string) {
  const context = await browser.newContext();
  const page = await context.newPage();
  const files: Array<{ url: string; font: boolean; wire: number; body: number }> = [];
  const pending: Array<Promise<void>> = [];
  const onFinished = (request: Request) => {
    pending.push(
      (async () => {
        const sizes = await request.sizes();
        const response = await request.response();
        const body = response ? (await response.body().catch(() => Buffer.alloc(0))).length : 0;
        files.push({
          url: request.url(),
          font: request.resourceType() === 'font',
          wire: sizes.responseBodySize + sizes.responseHeadersSize,
          body,
        });
      })(),
    );
  };
  page.on('requestfinished', onFinished);
  await page.goto(`${url}/sign-in`, { waitUntil: 'networkidle' });
  await page.getByRole('button', { name: 'Sign in' }).waitFor();
  // Counted: what the page asked for until the network was idle. A request finishing later was
  // read as the context closed, which failed the whole run once.
  page.off('requestfinished', onFinished);
  await Promise.all(pending);
  await context.close();
  const sum = (list: typeof files, key: 'wire' | 'body') => list.reduce((n, f) => n + f[key], 0);
  const code = files.filter((f) => !f.font);
  const fonts = files.filter((f) => f.font);
  const screens = code
    .map((f) => /\/assets\/([a-z-]+)-[\w-]+\.js$/.exec(f.url)?.[1])
    .filter((name): name is string => !!name && /pin-map|calculator|pdf|revision|feeds/.test(name));
  return {
    codeWire: sum(code, 'wire') / KB,
    codeBody: sum(code, 'body') / KB,
    fontWire: sum(fonts, 'wire') / KB,
    files: code.length,
    screens,
  };
}

interface Recorded {
  events: Array<{ name: string; start: number; duration: number; interaction: number }>;
  first: { start: number; duration: number } | null;
}
interface EventEntry {
  name: string;
  startTime: number;
  duration: number;
  interactionId?: number;
}
/** The page's globals this bench touches; the bench compiles without the DOM library. */
type PageGlobals = {
  __lw: Recorded;
  requestIdleCallback: (cb: () => void, options: { timeout: number }) => number;
  PerformanceObserver: new (cb: (list: { getEntries: () => EventEntry[] }) => void) => {
    observe: (options: object) => void;
  };
};

/** Records Event Timing entries from the start of every page of the context. */
const OBSERVE_EVENTS = () => {
  const g = globalThis as unknown as PageGlobals;
  g.__lw = { events: [], first: null };
  new g.PerformanceObserver((list) => {
    for (const e of list.getEntries()) {
      g.__lw.events.push({
        name: e.name,
        start: e.startTime,
        duration: e.duration,
        interaction: e.interactionId ?? 0,
      });
    }
  }).observe({ type: 'event', buffered: true, durationThreshold: 16 });
  new g.PerformanceObserver((list) => {
    const e = list.getEntries()[0];
    if (e && !g.__lw.first) g.__lw.first = { start: e.startTime, duration: e.duration };
  }).observe({ type: 'first-input', buffered: true });
};

const functionCells = (page: Page) => page.locator('[role="gridcell"][data-column="function"]');

/** Navigation start → the next paint after a click made as soon as the grid shows a row. */
async function timeToInteractive(page: Page, url: string): Promise<number> {
  await page.goto(url, { waitUntil: 'commit' });
  const cell = functionCells(page).first();
  await cell.waitFor();
  await cell.click();
  await page.waitForFunction(() => (globalThis as unknown as PageGlobals).__lw.first !== null);
  const first = (await page.evaluate(() => (globalThis as unknown as PageGlobals).__lw.first))!;
  return first.start + first.duration;
}

/**
 * Waits until the page has finished what its load started: nothing on the network, the faces
 * drawn (they are drawn in a transition after the first paint) and the main thread idle twice.
 */
async function settle(page: Page) {
  await page.waitForLoadState('networkidle');
  for (let i = 0; i < 2; i++) {
    await page.evaluate(
      () =>
        new Promise<void>((resolve) => {
          (globalThis as unknown as PageGlobals).requestIdleCallback(() => resolve(), {
            timeout: 2000,
          });
        }),
    );
  }
}

/**
 * Edits `count` Function cells (click, type `letter`, Enter), each saved before the next, and
 * gives each interaction's longest event. Event Timing reports only events of 16 ms or more:
 * the interactions it did not report are counted as 16 ms, never as less. Each round types its
 * own letter: typing the letter a cell already holds changes nothing and saves nothing.
 */
async function cellEdits(page: Page, count: number, letter: string): Promise<number[]> {
  await page.evaluate(() => {
    (globalThis as unknown as PageGlobals).__lw.events = [];
  });
  for (let i = 0; i < count; i++) {
    await functionCells(page).nth(i).click();
    await page.keyboard.type(letter);
    await page.keyboard.press('Enter');
    // Looked for in the saved-state line alone: a text search of the whole page (thousands of
    // cells and cavities) runs on the page's main thread and would delay the next paint it measures.
    await page
      .locator('[aria-label="Progress of the whole conversion"] [role="status"]', {
        hasText: 'All changes saved',
      })
      .waitFor();
  }
  const events = await page.evaluate(() => (globalThis as unknown as PageGlobals).__lw.events);
  const longest = new Map<number, number>();
  for (const e of events) {
    if (!e.interaction) continue;
    longest.set(e.interaction, Math.max(longest.get(e.interaction) ?? 0, e.duration));
  }
  const interactions = count * 3;
  const reported = [...longest.values()];
  return [...reported, ...Array(Math.max(0, interactions - reported.length)).fill(16)];
}

const p95 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.ceil(xs.length * 0.95) - 1]!;

export async function browserBench(rounds: number): Promise<BenchRow[]> {
  buildClient();
  const server = await startServer<ProductInfo>('product', {
    BENCH_PINS: '1000',
    BENCH_OTHER_PINS: '2000',
    BENCH_CLIENT_DIR: distDir,
  });
  const browser = await launch();
  try {
    const download = await signInDownload(browser, server.url);

    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    await context.addInitScript(OBSERVE_EVENTS);
    const signIn = await context.request.post(`${server.url}/api/auth/login`, {
      data: { email: 'builder@example.com', password: 'loomwright-demo' },
    });
    if (!signIn.ok()) throw new Error(`bench sign-in answered ${signIn.status()}`);
    const page = await context.newPage();
    const pinMap = (id: number) => `${server.url}/conversions/${id}/pins`;
    // Warm-up: the chunks into the browser's cache, the server's lists into its cache.
    await timeToInteractive(page, pinMap(server.info.conversionId));
    await timeToInteractive(page, pinMap(server.info.otherConversionId));
    const { product: tti1000, baseline: tti2000 } = await alternate(
      rounds,
      () => timeToInteractive(page, pinMap(server.info.conversionId)),
      () => timeToInteractive(page, pinMap(server.info.otherConversionId)),
    );
    const edits: number[] = [];
    const editP95: number[] = [];
    for (let r = 0; r < rounds; r++) {
      // The edits start on a settled page, as a person's first edit comes after the page has
      // loaded: loading is measured apart (time to interactive above).
      await timeToInteractive(page, pinMap(server.info.conversionId));
      await settle(page);
      const round = await cellEdits(page, 10, String.fromCharCode(0x61 + (r % 26)));
      edits.push(...round);
      editP95.push(p95(round));
    }
    await context.close();

    const t1 = spread(tti1000);
    const t2 = spread(tti2000);
    const e = spread(editP95);
    return [
      {
        id: 'P5',
        measure: 'sign-in page, first visit: HTML, JS, CSS and API as sent (compressed)',
        figure:
          `${num(download.codeWire)} KB in ${download.files} files (${num(download.codeBody)} KB uncompressed)` +
          (download.screens.length
            ? `; loads ${download.screens.join(', ')}`
            : '; no other screen'),
        goal: '≤ 150 KB',
        met: download.codeWire <= 150 && download.screens.length === 0,
      },
      {
        id: 'P5',
        measure: 'sign-in page, first visit: fonts as sent (cached for a year after)',
        figure: `${num(download.fontWire)} KB`,
        goal: '–',
        met: null,
      },
      {
        id: 'P6',
        measure: `cell edit → next paint, 1,000 pins, p95 per round of 30 interactions (Event Timing)`,
        figure: `${withUnit(e, 'ms')} (longest ${num(Math.max(...edits))} ms)`,
        goal: '< 50 ms',
        met: e.median < 50,
      },
      {
        id: 'P6',
        measure: 'pin map interactive, 1,000 pins (navigation → paint after the first click)',
        figure: withUnit(t1, 'ms'),
        goal: '< 1.5 s',
        met: t1.median < 1500,
      },
      {
        id: 'P6',
        measure: 'pin map interactive, 2,000 pins',
        figure: withUnit(t2, 'ms'),
        goal: '< 1.5 s',
        met: t2.median < 1500,
      },
    ];
  } finally {
    await browser.close();
    await server.stop();
  }
}
