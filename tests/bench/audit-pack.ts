import fs from 'node:fs';

/**
 * The benchmark firm's audit pack: every item (20,000) over the past year, read as a client would (a stream it
 * consumes as it arrives). Prints the time, the bytes and the server's resident memory sampled while it builds
 * (`BENCH_SERVER_PID`, from /proc): flat memory means the peak stays near the start however many items go in.
 */
const base = process.env.BENCH_URL!;
const pid = process.env.BENCH_SERVER_PID!;
const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: 'bench@bench.test', password: 'nestkeeper-demo' }),
});
const { token } = (await login.json()) as { token: string };
const headers = { authorization: `Bearer ${token}` };
const memory = () => {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (field: string) => Number(new RegExp(`${field}:\\s+(\\d+)`).exec(status)![1]);
  return { rssMb: kb('VmRSS') / 1024, peakMb: kb('VmHWM') / 1024 };
};
const mb = (n: number) => `${n.toFixed(0)} MB`;

const today = new Date().toISOString().slice(0, 10);
const from = `${Number(today.slice(0, 4)) - 1}${today.slice(4)}`;
const query = `from=${from}&to=${today}&scope=all`;
const preview = await (await fetch(`${base}/api/audit-pack/preview?${query}`, { headers })).json();
console.log(`\nAudit pack ${from} to ${today}, every item: ${JSON.stringify(preview)}`);

const before = memory();
const samples: { seconds: number; bytes: number; rssMb: number }[] = [];
const started = performance.now();
const response = await fetch(`${base}/api/audit-pack.zip?${query}`, { headers });
if (!response.ok || !response.body) throw new Error(`pack refused: ${response.status} ${await response.text()}`);
let bytes = 0;
let tail = Buffer.alloc(0);
let nextSample = 0;
for await (const chunk of response.body as unknown as AsyncIterable<Uint8Array>) {
  bytes += chunk.length;
  tail = Buffer.concat([tail, Buffer.from(chunk)]).subarray(-65_536);
  const seconds = (performance.now() - started) / 1000;
  if (seconds >= nextSample) {
    samples.push({ seconds, bytes, rssMb: memory().rssMb });
    nextSample = seconds + 5;
  }
}
const seconds = (performance.now() - started) / 1000;
const after = memory();
// A ZIP ends with its end-of-central-directory record (PK\x05\x06), or the ZIP64 one before it.
const complete = tail.includes(Buffer.from([0x50, 0x4b, 0x05, 0x06]));
console.log(
  `items ${response.headers.get('x-pack-items')}, ${mb(bytes / 1024 / 1024)} received in ${seconds.toFixed(1)} s (${(Number(response.headers.get('x-pack-items')) / seconds).toFixed(0)} items/s), ZIP complete: ${complete}`,
);
console.log(
  `server RSS before ${mb(before.rssMb)}, after ${mb(after.rssMb)}; peak RSS of the server process over its whole life ${mb(after.peakMb)} (before the pack: ${mb(before.peakMb)})`,
);
console.log('RSS while building (every ~5 s): ' + samples.map((s) => `${s.seconds.toFixed(0)} s ${mb(s.bytes / 1024 / 1024)} → ${mb(s.rssMb)}`).join(' · '));
if (!complete) process.exit(1);
