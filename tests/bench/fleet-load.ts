import autocannon from 'autocannon';
import { chromium } from 'playwright-core';

/**
 * Measures against a server already running with the benchmark firm
 * (scripts/bench-fleet.mjs sets it up): API latency under 20 concurrent
 * clients, then the fleet page's first render and a search in Chromium.
 */
const base = process.env.BENCH_URL!;
const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }) });
const { token } = (await login.json()) as { token: string };

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];

/** `ratePerClient` paces each of the 20 clients (requests per second); without it they fire back to back. */
async function load(name: string, pathAndQuery: string, ratePerClient?: number) {
  const times: number[] = [];
  let non2xx = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const options = { url: `${base}${pathAndQuery}`, connections: 20, duration: 15, headers: { authorization: `Bearer ${token}` }, ...(ratePerClient ? { connectionRate: ratePerClient } : {}) };
    const instance = autocannon(options, (err, r) => (err ? reject(err) : resolve(r)));
    instance.on('response', (_client, status, _bytes, ms) => {
      times.push(ms);
      if (status >= 300) non2xx += 1;
    });
  });
  times.sort((a, b) => a - b);
  console.log(
    `${name.padEnd(44)} ${String(result.requests.total).padStart(6)} req  ${(result.requests.average).toFixed(0).padStart(5)} req/s  p50 ${percentile(times, 50).toFixed(1)} ms  p95 ${percentile(times, 95).toFixed(1)} ms  p99 ${percentile(times, 99).toFixed(1)} ms${non2xx ? `  (${non2xx} non-2xx!)` : ''}`,
  );
}

console.log('\nGET /api/assets, 20 connections, 15 s each, 20,000 assets');
await load('type filter + search "0001" (narrow)', '/api/assets?type=tracker,probe&q=0001&limit=50');
await load('type filter + search "shelf" (1 in 3 rows)', '/api/assets?type=tip,smr,battery&q=shelf&limit=50');
await load('calibration overdue + search "orrin"', '/api/assets?calibration=overdue&q=orrin&sort=dueOn&limit=50');
await load('no filter, first page', '/api/assets?limit=50');
console.log('\nThe same, each of the 20 clients paced at 5 requests a second (people clicking, not a loop)');
await load('type filter + search "0001" (narrow), paced', '/api/assets?type=tracker,probe&q=0001&limit=50', 5);
await load('type filter + search "shelf", paced', '/api/assets?type=tip,smr,battery&q=shelf&limit=50', 5);

const browser = await chromium.launch({
  executablePath: '/usr/bin/chromium',
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
});
const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
await page.goto(`${base}/sign-in`);
await page.getByLabel('E-mail').fill('bench@bench.test');
await page.getByLabel('Password').fill('nestkeeper-demo');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.getByRole('heading', { level: 1, name: "Owner's overview" }).waitFor();
const firstRow = () => page.locator('.ag-row').first().waitFor({ timeout: 30_000 });
let start = Date.now();
await page.getByRole('navigation', { name: 'Main navigation' }).getByRole('link', { name: 'Fleet' }).click();
await firstRow();
const firstRender = Date.now() - start;
start = Date.now();
await page.getByLabel('Search the fleet').fill('BTRA-0001');
await page.waitForFunction(() => {
  const rows = [...document.querySelectorAll('.ag-row')];
  return rows.length > 0 && rows.every((r) => r.textContent?.includes('BTRA-0001'));
});
const searchChange = Date.now() - start;
console.log(`\nFleet page in Chromium: first rows after ${firstRender} ms (navigation from home); search "BTRA-0001" applied after ${searchChange} ms (includes the 250 ms typing debounce).`);
await browser.close();
