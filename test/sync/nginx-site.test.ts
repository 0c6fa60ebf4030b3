// deploy/nginx-tankside.conf as a plant runs it, with Debian's nginx (the package CI installs),
// against the CouchDB stand-in: the site's server block is taken as written and changed only where
// a test must (a loopback port without TLS, a test root, the stand-in's address). Through it a
// device signs in at /db/_session (the cookie's path rewritten to /db/), pushes, and the page's
// security headers are sent. What the site must do is the issue's "same origin" design and
// deploy/README.md.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeUuid } from '../../bench/generated-log.ts';
import { makeDevice, seedChain } from './devices.ts';
import { startSite, type NginxSite } from './nginx.ts';
import { StandIn } from './stand-in.ts';

let server: StandIn;
let site: NginxSite;
let dir: string;
let origin: string;

beforeAll(async () => {
  server = await StandIn.start();
  dir = mkdtempSync(join(tmpdir(), 'tankside-nginx-root-'));
  const root = join(dir, 'dist');
  mkdirSync(root);
  writeFileSync(join(root, 'index.html'), '<!doctype html><title>test page</title>');
  site = await startSite(root, server.port);
  origin = site.origin;
}, 60_000);

afterAll(async () => {
  await site?.stop();
  await server?.stop();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('the nginx site in front of CouchDB', () => {
  it('serves the page with its security headers and any path as the app shell', async () => {
    const page = await fetch(`${origin}/`);
    expect(page.headers.get('content-security-policy')).toContain("connect-src 'self';");
    expect(page.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
    expect(page.headers.get('x-content-type-options')).toBe('nosniff');
    expect(page.headers.get('cache-control')).toBe('no-cache');
    const deep = await fetch(`${origin}/vessels/some-id`);
    expect(await deep.text()).toContain('test page');
  });

  it('proxies /db/ to CouchDB, with the session cookie set for /db/', async () => {
    const welcome = (await (await fetch(`${origin}/db/`)).json()) as { version?: string };
    expect(welcome.version).toBe('4.2.0');
    const device = await makeDevice(fakeUuid(0x9e000000, 1));
    const password = server.addAccount('device', device.id);
    const session = await fetch(`${origin}/db/_session`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: device.id, password }) });
    expect(session.status).toBe(200);
    expect(session.headers.getSetCookie().find((c) => c.startsWith('AuthSession='))).toMatch(/Path=\/db\//);

    // A whole sync through the proxy, at the address a phone uses.
    await device.enrol(`${origin}/db/`, password);
    await seedChain(device, 300, 71);
    const report = await device.syncNow();
    expect(report.push).toMatchObject({ pushed: 300, localHead: 300 });
    const direct = await server.admin<{ rows: unknown[] }>('GET', `tankside-checks/_all_docs?startkey=${encodeURIComponent(JSON.stringify(`${device.id}:`))}&endkey=${encodeURIComponent(JSON.stringify(`${device.id}:\ufff0`))}`);
    // The 300 checks and the device's key record (seq 0), written before them.
    expect(direct.body.rows).toHaveLength(301);
  });
});
