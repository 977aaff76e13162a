// Benchmark (a script, not a test): how the storefront loads in Chromium for a first-time visitor.
// Builds the client when stale, starts the product (`npm start`'s own start-up) on free ports, then
// for /, /lots, a lot page, /subscribe and /checkout takes the median of 5 cold visits (a fresh
// browser context each: no cache, no cookies) at a phone's size, twice: throttled as a mid-range
// phone on slow 4G (4× CPU slowdown, 150 ms round trip, 1.6 Mbit/s down, 750 kbit/s up: the usual
// lab settings), and unthrottled. It prints largest and first contentful paint, cumulative layout
// shift, bytes on the wire and JavaScript bytes on the wire.
// Run: npm run bench:web   (alone on a quiet machine: CPU throttling multiplies any other load)
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Browser, CDPSession } from 'playwright-core';
import { lotListResponseSchema } from '../../shared/schemas/lots';
import { launchChromium } from '../setup/chromium';
import { freePort } from '../setup/free-port';

const visits = 5;
const phone = { width: 412, height: 823 };
const slow4g = { offline: false, latency: 150, downloadThroughput: (1.6 * 1024 * 1024) / 8, uploadThroughput: (750 * 1024) / 8 };
const cpuSlowdown = 4;

interface Visit {
  lcpMs: number;
  fcpMs: number;
  cls: number;
  bytes: number;
  jsBytes: number;
}

// Runs in the page before any of its scripts: keeps the paint and layout-shift entries as they come.
const observePaints = () => {
  const seen = { lcp: 0, fcp: 0, cls: 0 };
  (window as unknown as { __restdayPaints: typeof seen }).__restdayPaints = seen;
  new PerformanceObserver((list) => {
    for (const entry of list.getEntries()) seen.lcp = entry.startTime;
  }).observe({ type: 'largest-contentful-paint', buffered: true });
  new PerformanceObserver((list) => {
    for (const entry of list.getEntries()) if (entry.name === 'first-contentful-paint') seen.fcp = entry.startTime;
  }).observe({ type: 'paint', buffered: true });
  new PerformanceObserver((list) => {
    for (const entry of list.getEntries() as (PerformanceEntry & { value: number; hadRecentInput: boolean })[]) {
      if (!entry.hadRecentInput) seen.cls += entry.value;
    }
  }).observe({ type: 'layout-shift', buffered: true });
};

async function countBytes(cdp: CDPSession) {
  const types = new Map<string, string>();
  const totals = { bytes: 0, jsBytes: 0 };
  cdp.on('Network.responseReceived', (event) => types.set(event.requestId, event.type));
  cdp.on('Network.loadingFinished', (event) => {
    totals.bytes += event.encodedDataLength;
    if (types.get(event.requestId) === 'Script') totals.jsBytes += event.encodedDataLength;
  });
  await cdp.send('Network.enable');
  return totals;
}

async function visit(browser: Browser, url: string, throttled: boolean): Promise<Visit> {
  const context = await browser.newContext({ viewport: phone, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
  try {
    const page = await context.newPage();
    await page.addInitScript(observePaints);
    const cdp = await context.newCDPSession(page);
    const totals = await countBytes(cdp);
    if (throttled) {
      await cdp.send('Network.emulateNetworkConditions', slow4g);
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: cpuSlowdown });
    }
    await page.goto(url, { waitUntil: 'load', timeout: 60_000 });
    // A slowed CPU can leave the network quiet while it parses, so wait for a paint first, then for
    // quiet; LCP is final once the page is quiet, and a short wait lets the last entries arrive.
    await page.waitForFunction(() => (window as unknown as { __restdayPaints: { lcp: number } }).__restdayPaints.lcp > 0, undefined, { timeout: 60_000 });
    await page.waitForLoadState('networkidle', { timeout: 60_000 });
    await page.waitForTimeout(1000);
    const paints = await page.evaluate(() => (window as unknown as { __restdayPaints: { lcp: number; fcp: number; cls: number } }).__restdayPaints);
    return { lcpMs: paints.lcp, fcpMs: paints.fcp, cls: paints.cls, ...totals };
  } finally {
    await context.close();
  }
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
};

async function waitForHealth(base: string, deadline: number) {
  while (Date.now() < deadline) {
    const healthy = await fetch(`${base}/api/health`).then(
      (response) => response.ok,
      () => false,
    );
    if (healthy) return;
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  throw new Error(`${base} did not become healthy`);
}

const ports = { server: await freePort(), postgres: await freePort(), smtp: await freePort(), mailWeb: await freePort() };
const work = mkdtempSync(path.join(tmpdir(), 'restday-web-bench-'));
const base = `http://127.0.0.1:${ports.server}`;
const product = spawn(process.execPath, ['--import', 'tsx', 'dev-services/start.ts'], {
  env: {
    ...process.env,
    PORT: String(ports.server),
    PUBLIC_URL: base,
    RESTDAY_PG_PORT: String(ports.postgres),
    RESTDAY_PG_DATA: path.join(work, 'postgres'),
    SMTP_URL: `smtp://127.0.0.1:${ports.smtp}`,
    MAILDEV_WEB_PORT: String(ports.mailWeb),
    LOG_LEVEL: 'fatal',
  },
  stdio: ['ignore', 'ignore', 'inherit'],
});
const exited = new Promise((resolve) => product.once('exit', resolve));

let browser: Browser | undefined;
try {
  console.log(`Starting Restday on ${base}…`);
  await waitForHealth(base, Date.now() + 300_000);
  const lotCode = lotListResponseSchema.parse(await (await fetch(`${base}/api/lots`)).json()).items[0]?.code;
  if (!lotCode) throw new Error('The demo shop lists no lot.');
  const pages = ['/', '/lots', `/lots/${lotCode}`, '/subscribe', '/checkout'];
  browser = await launchChromium();
  for (const throttled of [true, false]) {
    const rows: Record<string, string | number>[] = [];
    for (const pagePath of pages) {
      const runs: Visit[] = [];
      for (let run = 0; run < visits; run++) runs.push(await visit(browser, `${base}${pagePath}`, throttled));
      rows.push({
        page: pagePath,
        'LCP (ms)': Math.round(median(runs.map((run) => run.lcpMs))),
        'FCP (ms)': Math.round(median(runs.map((run) => run.fcpMs))),
        CLS: Number(median(runs.map((run) => run.cls)).toFixed(3)),
        'bytes (KiB)': Number((median(runs.map((run) => run.bytes)) / 1024).toFixed(1)),
        'JS bytes (KiB)': Number((median(runs.map((run) => run.jsBytes)) / 1024).toFixed(1)),
      });
    }
    console.log(
      throttled
        ? `\nThrottled: phone ${phone.width}×${phone.height}, ${cpuSlowdown}× CPU, ${slow4g.latency} ms RTT, 1.6 Mbit/s down; median of ${visits} cold visits`
        : `\nUnthrottled: phone ${phone.width}×${phone.height}; median of ${visits} cold visits`,
    );
    console.table(rows);
  }
} finally {
  await browser?.close();
  product.kill('SIGINT');
  await exited;
  rmSync(work, { recursive: true, force: true });
}
