// deploy/nginx-tankside.conf run by Debian's nginx (the package CI installs) on a free loopback
// port, for the tests that go through the site as a plant deploys it (test/sync/nginx-site.test.ts,
// test/e2e/sync.test.ts). The site's server block is taken as written and changed only where a
// test must: a loopback port without TLS, a test root, the stand-in's address. Stopped by its PID.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { freePort } from './stand-in.ts';

const NGINX = '/usr/sbin/nginx';
const SITE = resolve(import.meta.dirname, '../../deploy/nginx-tankside.conf');

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

export interface NginxSite {
  /** http://127.0.0.1:<port>, the app's origin. */
  origin: string;
  stop(): Promise<void>;
}

/** Starts the site serving `root` and proxying /db/ to the CouchDB (stand-in) on `couchPort`; resolves once it answers. */
export async function startSite(root: string, couchPort: number): Promise<NginxSite> {
  const dir = mkdtempSync(join(tmpdir(), 'tankside-nginx-'));
  const port = await freePort();
  const origin = `http://127.0.0.1:${port}`;
  writeFileSync(join(dir, 'site.conf'), testSite(port, root, couchPort));
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
  const nginx: ChildProcess = spawn(NGINX, ['-p', dir, '-c', join(dir, 'nginx.conf')], { stdio: 'ignore' });
  const stop = async () => {
    if (nginx.pid && nginx.exitCode === null) {
      const gone = new Promise((r) => nginx.once('exit', r));
      process.kill(nginx.pid, 'SIGTERM');
      await gone;
    }
    rmSync(dir, { recursive: true, force: true });
  };
  for (let i = 0; ; i += 1) {
    try {
      if ((await fetch(`${origin}/`)).status === 200) break;
    } catch {
      // Not listening yet.
    }
    if (i > 300) {
      await stop();
      throw new Error('nginx did not answer');
    }
    await new Promise((r) => setTimeout(r, 50)); // polling nginx's start, not the app
  }
  return { origin, stop };
}
