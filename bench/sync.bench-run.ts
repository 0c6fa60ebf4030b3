// Plant sync rates in Node against the CouchDB stand-in (pouchdb-server 4.2.0 on LevelDB, on this
// machine's loopback), the store over fake-indexeddb, generated checks (invented bench data):
//  - two devices pushing 5,000 checks each at once (10,000), and a supervisor's pull of them at
//    three batch sizes of the changes feed;
//  - a supervisor's first pull of 100,000 (two devices' 50,000 each, pushed first; that push is
//    timed too).
// Figures are printed beside the targets (push ≥ 1,000 checks/s, pull ≥ 5,000 checks/s
// into the store, a first pull of 100,000 under 30 s), with the load average: the machine is
// shared. The targets are for Chromium with its IndexedDB; that run comes with the browser step.
// Asserts only that every check arrived, never how long it took (RULES 7).
//   npm run bench       (BENCH_SYNC_BIG=20000 for a quicker second part)
import { loadavg } from 'node:os';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeUuid } from './generated-log.ts';
import { makeDevice, seedChain, type Device } from '../test/sync/devices.ts';
import { StandIn } from '../test/sync/stand-in.ts';

const BIG = Number(process.env['BENCH_SYNC_BIG'] ?? 100_000);
let server: StandIn;
const rows: string[] = [];

beforeAll(async () => {
  server = await StandIn.start();
}, 60_000);
afterAll(async () => {
  await server?.stop();
  console.log(`\nPlant sync, Node + stand-in (load average at the end: ${loadavg().map((l) => l.toFixed(2)).join(' ')})`);
  for (const r of rows) console.log(r);
});

async function timed<T>(fn: () => Promise<T>): Promise<[T, number, number]> {
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await fn();
  const cpu = process.cpuUsage(cpu0);
  return [value, (performance.now() - t0) / 1000, (cpu.user + cpu.system) / 1e6];
}

function row(label: string, checks: number, seconds: number, cpuS: number, target: string): void {
  const line = `${label.padEnd(52)} ${checks.toLocaleString('en')} checks in ${seconds.toFixed(2)} s = ${Math.round(checks / seconds).toLocaleString('en')}/s (this process's CPU ${cpuS.toFixed(2)} s; the server is another process) [${target}]  load ${loadavg()[0]!.toFixed(2)}`;
  rows.push(line);
  console.log(line);
}

async function devices(prefix: number, count: number, perDevice: number, seed: number): Promise<Device[]> {
  const out: Device[] = [];
  for (let i = 0; i < count; i += 1) {
    const d = await makeDevice(fakeUuid(prefix, i + 1));
    await d.enrol(server.url, server.addAccount('device', d.id));
    await seedChain(d, perDevice, seed + i);
    out.push(d);
  }
  return out;
}

async function supervisor(prefix: number): Promise<Device> {
  const s = await makeDevice(fakeUuid(prefix, 1));
  await s.enrol(server.url, server.addAccount('supervisor', s.id), 'supervisor');
  return s;
}

describe('plant sync rates', () => {
  it('10,000 checks: two devices push at once, supervisors pull', async () => {
    const pair = await devices(0xbe0c0000, 2, 5000, 51);
    const [, pushS, pushCpu] = await timed(() => Promise.all(pair.map((d) => d.syncNow())));
    row('push, two devices at once', 10_000, pushS, pushCpu, 'target ≥ 1,000/s');
    for (const batch of [500, 1000, 2000]) {
      const s = await supervisor(0x5e0c0000 + batch);
      const [report, pullS, pullCpu] = await timed(() => s.syncNow({ pullBatch: batch }));
      expect(report.checks!.added).toHaveLength(10_000);
      row(`pull into the store, ${batch} changes per request`, 10_000, pullS, pullCpu, 'target ≥ 5,000/s');
    }
  }, 600_000);

  it(`a supervisor's first pull of ${BIG.toLocaleString('en')} checks`, async () => {
    const pair = await devices(0xb1900000, 2, BIG / 2, 61);
    const [, pushS, pushCpu] = await timed(() => Promise.all(pair.map((d) => d.syncNow())));
    row(`push, two devices at once (${(BIG / 2).toLocaleString('en')} each)`, BIG, pushS, pushCpu, 'target ≥ 1,000/s');
    const s = await supervisor(0x5e190000);
    const [report, pullS, pullCpu] = await timed(() => s.syncNow());
    // Every check of the 10,000 above too: a first pull takes the whole database.
    expect(report.checks!.added).toHaveLength(BIG + 10_000);
    row(`first pull of the whole database`, BIG + 10_000, pullS, pullCpu, `target: ${BIG.toLocaleString('en')} under 30 s`);
    const [chains, verifyS] = await timed(() => s.transfer.verifyStoredChains());
    expect(chains.every((c) => c.status === 'ok')).toBe(true);
    rows.push(`verifying the pulled chains afterwards: ${verifyS.toFixed(2)} s`);
  }, 1_200_000);
});
