import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let server: Server;
let port: number;
let assetId: string;
const tokens: Record<string, string> = {};

beforeAll(async () => {
  t = await createTestApp();
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  port = (server.address() as AddressInfo).port;
  for (const [role, email] of Object.entries({ manager: 'manager@demo.test', technician: 'tech@demo.test', billing: 'billing@demo.test' }))
    tokens[role] = await t.tokenFor(email);
  assetId = (await t.api.get('/api/assets?limit=1').set(bearer(tokens.manager))).body.items[0].id;
});
afterAll(async () => {
  server?.closeAllConnections();
  await new Promise((resolve) => server?.close(resolve));
  await t?.close();
});

const DECLARED = 30 * 1024 * 1024;
const FIRST_PART = 256 * 1024;

/**
 * Starts a 30 MB upload but sends only its first 256 KB, then waits for the
 * answer. A server that read the body before checking the caller would
 * still be waiting for the other 29.75 MB, and this would never resolve.
 */
function partialUpload(
  path: string,
  headers: Record<string, string>,
  body: Buffer,
): Promise<{ status: number; json: { error?: { code: string } }; sent: number; connection?: string }> {
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, path, method: 'POST', headers: { ...headers, 'content-length': String(DECLARED) } });
    let sent = 0;
    req.on('response', (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        resolve({ status: res.statusCode ?? 0, json: JSON.parse(Buffer.concat(chunks).toString('utf8')), sent, connection: res.headers.connection });
        req.destroy();
      });
    });
    req.on('error', reject); // after the answer, a no-op
    const first = Buffer.concat([body, Buffer.alloc(FIRST_PART - body.length, 0x41)]);
    req.write(first, () => (sent += first.length));
  });
}

const multipartHead = (field: string, fileName: string, type: string) =>
  Buffer.from(`--fuzzboundary\r\nContent-Disposition: form-data; name="${field}"; filename="${fileName}"\r\nContent-Type: ${type}\r\n\r\n`);
const multipart = { 'content-type': 'multipart/form-data; boundary=fuzzboundary' };

const uploads = [
  {
    name: 'a calibration certificate',
    path: () => `/api/assets/${assetId}/calibrations`,
    headers: multipart,
    head: () => multipartHead('certificate', 'cert.pdf', 'application/pdf'),
    lacking: 'technician',
  },
  {
    name: 'incident photos',
    path: () => '/api/incidents',
    headers: multipart,
    head: () => multipartHead('photos', 'dent.jpg', 'image/jpeg'),
    lacking: 'billing',
  },
  {
    name: 'a fleet CSV import',
    path: () => '/api/assets/import?mode=commit',
    headers: { 'content-type': 'text/csv' },
    head: () => Buffer.from('type,assetTag,serialNumber\r\n'),
    lacking: 'technician',
  },
];

describe('uploads are refused before their body is read', () => {
  it.each(uploads)('an anonymous 30 MB upload of $name gets 401 while most of it is still unsent', async (u) => {
    const res = await partialUpload(u.path(), u.headers, u.head());
    expect(res.status).toBe(401);
    expect(res.json.error?.code).toBe('unauthenticated');
    expect(res.sent).toBeLessThan(DECLARED);
    // The rest is not drained either: the connection closes.
    expect(res.connection).toBe('close');
  });

  it.each(uploads)('a role without the capability gets 403 for $name, also before the body', async (u) => {
    const res = await partialUpload(u.path(), { ...u.headers, ...bearer(tokens[u.lacking]) }, u.head());
    expect(res.status).toBe(403);
    expect(res.json.error?.code).toBe('forbidden');
  });

  it('a broken multipart body from someone who may upload is a 400, not a 500', async () => {
    const res = await t.api
      .post(`/api/assets/${assetId}/calibrations`)
      .set(bearer(tokens.manager))
      .set('content-type', 'multipart/form-data; boundary=fuzzboundary')
      .send('--fuzzboundary\r\nContent-Disposition: form-data; name="provider"\r\n\r\nLab');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('describes each upload in the OpenAPI document (multipart fields and files, CSV)', async () => {
    const doc = (await t.api.get('/api/openapi.json')).body;
    const certificate = doc.paths['/api/assets/{id}/calibrations'].post.requestBody.content['multipart/form-data'].schema;
    expect(certificate.properties.certificate).toMatchObject({ type: 'string', format: 'binary' });
    expect(certificate.properties.performedOn).toMatchObject({ type: 'string', format: 'date' });
    const photos = doc.paths['/api/incidents'].post.requestBody.content['multipart/form-data'].schema;
    expect(photos.properties.photos).toMatchObject({ type: 'array', items: { format: 'binary' } });
    expect(doc.paths['/api/assets/import'].post.requestBody.content['text/csv']).toBeDefined();
  });
});
