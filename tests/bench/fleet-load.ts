import { backToBack, benchScale, describeLoad, peoplePaced } from './load';
import { launchChromium } from '../support/chromium';

/**
 * Measures against a server already running with the benchmark firm
 * (scripts/bench-fleet.mjs sets it up): API latency under 20 concurrent
 * clients, then the fleet page's first render and a search in Chromium.
 */
const base = process.env.BENCH_URL!;
const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }),
});
const { token } = (await login.json()) as { token: string };

const headers = { authorization: `Bearer ${token}` };
/** Back to back (saturation), or 20 people with ~200 ms think times. */
async function load(name: string, pathAndQuery: string, paced = false) {
  const result = paced ? await peoplePaced(`${base}${pathAndQuery}`, headers) : await backToBack(`${base}${pathAndQuery}`, headers);
  console.log(`${name.padEnd(44)} ${describeLoad(result)}`);
}

console.log(`\nGET /api/assets, 20 connections, 15 s each, ${await benchScale()}`);
await load('type filter + search "0001" (narrow)', '/api/assets?type=tracker,probe&q=0001&limit=50');
await load('type filter + search "shelf" (1 in 3 rows)', '/api/assets?type=tip,smr,battery&q=shelf&limit=50');
await load('calibration overdue + search "orrin"', '/api/assets?calibration=overdue&q=orrin&sort=dueOn&limit=50');
await load('no filter, first page', '/api/assets?limit=50');
console.log('\nThe same, 20 people each thinking ~200 ms between requests (exponential think times)');
await load('type filter + search "0001" (narrow), paced', '/api/assets?type=tracker,probe&q=0001&limit=50', true);
await load('type filter + search "shelf", paced', '/api/assets?type=tip,smr,battery&q=shelf&limit=50', true);

const browser = await launchChromium();
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
await page.getByLabel('Search the fleet').fill('BTRA-00001');
await page.waitForFunction(() => {
  const rows = [...document.querySelectorAll('.ag-row')];
  return rows.length > 0 && rows.every((r) => r.textContent?.includes('BTRA-00001'));
});
const searchChange = Date.now() - start;
console.log(
  `\nFleet page in Chromium: first rows after ${firstRender} ms (navigation from home); search "BTRA-00001" applied after ${searchChange} ms (includes the 250 ms typing debounce).`,
);
await browser.close();
