// deploy/nginx-tankside.conf as a plant runs it, with Debian's nginx (the package CI installs),
// against the CouchDB stand-in: the site's server block is taken as written and changed only where
// a test must (a loopback port without TLS, a test root, the stand-in's address). Through it a
// device signs in at /db/_session (the cookie's path rewritten to /db/), pushes, and the page's
// security headers are sent. What the site must do is the issue's "same origin" design and
// deploy/README.md.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeUuid } from '../../bench/generated-log.ts';
import { makeDevice, seedChain } from './devices.ts';
import { freePort, StandIn } from './stand-in.ts';

const NGINX = '/usr/sbin/nginx';
const SITE = resolve(import.meta.dirname, '../../deploy/nginx-tankside.conf');
let server: StandIn;
let nginx: ChildProcess;
let dir: string;
let origin: string;

/** The site file with the test's port, root and upstream; everything else as shipped. */
function testSite(port: number, root: string, couchPort: number): string {
  let site = readFileSync(SITE, 'utf8');
  const swap = (from: RegExp, to: string) => {
    if (!from.test(site)) throw new Error(`the site file no longer has ${from}`);
    site = site.replace(from, to);
  };
  swap(/server 127\.0\.0\.1:5984;/, `server 127.0.0.1:${couchPort};`);
  swap(/listen 443 ssl http2;/, `listen 127.0.0.1:${port};`);
  swap(/\n\s*ssl_certificate .*\n\s*ssl_certificate_key .*\n\s*ssl_protocols .*\n/, '\n');
  swap(/root \/srv\/tankside\/dist;/, `root ${root};`);
  swap(/\nserver \{\n    listen 80;[\s\S]*$/, '\n'); // the redirect from port 80
  return site;
}

beforeAll(async () => {
  server = await StandIn.start();
  dir = mkdtempSync(join(tmpdir(), 'tankside-nginx-'));
  const root = join(dir, 'dist');
  mkdirSync(root);
  writeFileSync(join(root, 'index.html'), '<!doctype html><title>test page</title>');
  const port = await freePort();
  origin = `http://127.0.0.1:${port}`;
  writeFileSync(join(dir, 'site.conf'), testSite(port, root, server.port));
  writeFileSync(
    join(dir, 'nginx.conf'),
    [
      process.getuid?.() === 0 ? 'user root;' : '',
      'daemon off;', 'worker_processes 1;', `pid ${dir}/nginx.pid;`, `error_log ${dir}/error.log;`, 'events {}',
      'http {', '  include /etc/nginx/mime.types;', '  access_log off;',
      ...['client_body', 'proxy', 'fastcgi', 'uwsgi', 'scgi'].map((t) => `  ${t}_temp_path ${dir}/${t};`),
      `  include ${dir}/site.conf;`, '}',
    ].join('\n'),
  );
  const check = spawnSync(NGINX, ['-t', '-p', dir, '-c', join(dir, 'nginx.conf')], { encoding: 'utf8' });
  if (check.status !== 0) throw new Error(`nginx -t refused the site: ${check.stderr}`);
  nginx = spawn(NGINX, ['-p', dir, '-c', join(dir, 'nginx.conf')], { stdio: 'ignore' });
  for (let i = 0; ; i += 1) {
    try {
      if ((await fetch(`${origin}/`)).status === 200) break;
    } catch {
      // Not listening yet.
    }
    if (i > 300) throw new Error('nginx did not answer');
    await new Promise((r) => setTimeout(r, 50)); // polling nginx's start, not the app
  }
}, 60_000);

afterAll(async () => {
  if (nginx?.pid && nginx.exitCode === null) {
    const gone = new Promise((r) => nginx.once('exit', r));
    process.kill(nginx.pid, 'SIGTERM');
    await gone;
  }
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
