// The CouchDB stand-in for the sync tests: pouchdb-server 4.2.0 (a dev dependency), started here
// as a child process on a free loopback port with its own data folder (its config.json and log
// file go there too), stopped by its PID, and its folder removed afterwards. Debian has no
// couchdb package and these machines run no containers; production runs Apache CouchDB 3.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '../..');
const BIN = join(ROOT, 'node_modules/pouchdb-server/bin/pouchdb-server');
export const ADMIN = { name: 'admin', password: 'stand-in-admin-password' };

/** A free TCP port on 127.0.0.1 (asked of the system, then released for the server to take). */
export function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => (typeof address === 'object' && address ? resolvePort(address.port) : reject(new Error('no port'))));
    });
  });
}

export class StandIn {
  private child: ChildProcess | null = null;
  private constructor(readonly port: number, readonly dir: string) {}

  /** The running server's process id (the benchmarks read its CPU time). */
  get pid(): number | undefined {
    return this.child?.pid;
  }

  get url(): string {
    return `http://127.0.0.1:${this.port}/`;
  }

  /** Starts a fresh server with an administrator account, and runs `npm run couch:setup` on it. */
  static async start(options: { setup?: boolean } = {}): Promise<StandIn> {
    const server = new StandIn(await freePort(), mkdtempSync(join(tmpdir(), 'tankside-couch-')));
    await server.launch();
    const r = await fetch(`${server.url}_config/admins/${ADMIN.name}`, { method: 'PUT', body: JSON.stringify(ADMIN.password), headers: { 'content-type': 'application/json' } });
    if (r.status !== 200) throw new Error(`stand-in: creating the admin answered ${r.status}`);
    if (options.setup !== false) server.script('couch-setup.mjs');
    return server;
  }

  /**
   * Runs one of deploy/'s scripts as `node deploy/<file> [...lead] <url> <admin> <password> [...rest]`
   * against this server; returns what it printed.
   */
  script(file: string, lead: string[] = [], rest: string[] = []): string {
    const r = spawnSync(process.execPath, [join(ROOT, 'deploy', file), ...lead, this.url, ADMIN.name, ADMIN.password, ...rest], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`${file} failed (${r.status}): ${r.stderr}${r.stdout}`);
    return r.stdout;
  }

  /** Adds an account for a device (deploy/couch-account.mjs) and returns its password. */
  addAccount(kind: 'device' | 'supervisor', deviceId: string): string {
    const out = this.script('couch-account.mjs', [kind], [deviceId]);
    const json = out.slice(out.indexOf('{'), out.lastIndexOf('}') + 1);
    return (JSON.parse(json) as { password: string }).password;
  }

  /** Starts the server process on this port and folder, and waits until it answers GET /. */
  async launch(): Promise<void> {
    const child = spawn(process.execPath, [BIN, '--host', '127.0.0.1', '--port', String(this.port), '--dir', this.dir, '--config', join(this.dir, 'config.json'), '-n'], {
      cwd: this.dir,
      stdio: 'ignore',
    });
    this.child = child;
    const deadline = Date.now() + 30_000;
    for (;;) {
      if (child.exitCode !== null) throw new Error(`stand-in exited at start (${child.exitCode})`);
      try {
        const r = await fetch(this.url);
        if (r.status === 200) return;
      } catch {
        // Not listening yet.
      }
      if (Date.now() > deadline) throw new Error('stand-in did not answer within 30 s');
      await new Promise((r) => setTimeout(r, 100)); // polling the server's start, not the app
    }
  }

  /** Kills the server process (SIGKILL: no chance to flush or answer) and waits until it is gone. */
  async kill(signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
    const child = this.child;
    this.child = null;
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const gone = new Promise((r) => child.once('exit', r));
    process.kill(child.pid!, signal);
    await gone;
  }

  /** Stops the server and removes its folder. */
  async stop(): Promise<void> {
    await this.kill('SIGTERM');
    rmSync(this.dir, { recursive: true, force: true });
  }

  /** A request as the administrator (Basic); the body parsed as JSON. */
  async admin<T = unknown>(method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> {
    const headers: Record<string, string> = { authorization: `Basic ${Buffer.from(`${ADMIN.name}:${ADMIN.password}`).toString('base64')}` };
    if (body !== undefined) headers['content-type'] = 'application/json';
    const r = await fetch(new URL(path, this.url), { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    return { status: r.status, body: (await r.json()) as T };
  }
}
