import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import fc from 'fast-check';
import { SPEC, sampleCheck, useFreshDatabase, loose } from './fixtures.ts';
import { addVessel, appendCheck, type CheckRecord } from '../../src/store/index.ts';
import { exportCsv } from '../../src/store/transfer.ts';
import { csvCell, csvFromChecks, CSV_BOM, CSV_COLUMNS, roundedAsShown } from '../../src/store/csv.ts';
import { formatToBand, setDecimalSeparator } from '../../src/ui/state/format.ts';
import { editStored } from './log-access.ts';

useFreshDatabase();

/** A result shaped like the check engine's CheckResult (invented test numbers). */
function result(i: number) {
  return {
    reading: { absolutePressurePa: 501325 + i, gaugePressurePa: 400000 + i, atmospherePa: 101325, netMassKg: 1250.5 },
    saturation: { saturationPressurePa: 500120.25, pressureDeviationPa: -1204.75 + i, pressureBand: { plusMinus: 9000 }, verdict: { verdict: 'consistent' } },
    inventory: { regime: 'two-phase', quality: 1.25e-7 * (i + 1), liquidMassKg: 1249.875, vaporMassKg: 0.625, liquidLevel: { levelM: 0.8125 } },
  };
}

// papaparse would turn ISO 8601 text into a Date (losing the offset); the time column stays text.
const parse = (text: string) =>
  Papa.parse<Record<string, unknown>>(text, { header: true, dynamicTyping: (f) => f !== 'time (ISO 8601)', skipEmptyLines: true });

describe('CSV export', () => {
  it('one row per check, SI units in the header, ISO 8601 times, numbers that parse back as numbers (papaparse)', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const saved: CheckRecord[] = [];
    for (let i = 0; i < 3; i += 1) {
      saved.push(
        await appendCheck(
          sampleCheck(v.id, {
            takenAt: new Date(Date.parse('2026-12-01T06:00:00Z') + i * 3_600_000),
            reading: loose.reading({ temperatureK: 424.95 + i, pressure: { reference: 'gauge', pressurePa: 400000 + i }, weight: { kind: 'gross', grossKg: 2450 } }),
            result: loose.result(result(i)),
          }),
        ),
      );
    }
    const text = await exportCsv();
    const parsed = parse(text);
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual(CSV_COLUMNS.map((c) => c.header));
    for (const h of ['temperature (K)', 'absolute pressure (Pa)', 'liquid mass (kg)', 'quality (kg/kg)', 'liquid level (m)']) {
      expect(parsed.meta.fields).toContain(h);
    }
    expect(parsed.data).toHaveLength(3);
    parsed.data.forEach((row, i) => {
      const r = saved[i]!;
      expect(row['time (ISO 8601)']).toBe(r.time);
      expect(Date.parse(String(row['time (ISO 8601)']))).toBe(r.timeMs);
      expect(row['temperature (K)']).toBe(424.95 + i);
      expect(row['pressure as entered (Pa)']).toBe(400000 + i);
      expect(row['pressure deviation from saturation (Pa)']).toBe(-1204.75 + i);
      expect(row['quality (kg/kg)']).toBe(1.25e-7 * (i + 1));
      expect(row['liquid level (m)']).toBe(0.8125);
      expect(row['verdict']).toBe('consistent');
      expect(row['highest signal word (standing note left out)']).toBe('CAUTION');
      expect(row['seq']).toBe(i + 1);
      // Fields come out in key order: the store keeps records in canonical form.
      expect(row['inputs as typed']).toBe('grossWeight=2450 kg; pressure=4,0 bar gauge; temperature=151,8 degC');
    });
  });

  it('neutralises text that a spreadsheet would run as a formula; quotes commas, quotes and line breaks', async () => {
    const v = await addVessel({ tag: '=FT', spec: SPEC });
    const notes = ['=HYPERLINK("http://x","y")', '+1', '-2+3', '@SUM(A1)', '\tTAB', '\rCR', 'plain, with "quotes"\nand a line', '2+2'];
    for (const note of notes) await appendCheck(sampleCheck(v.id, { note, technician: '-Ana' }));
    const parsed = parse(await exportCsv({ vesselId: v.id }));
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((r) => r['note']).sort()).toEqual(
      ["'=HYPERLINK(\"http://x\",\"y\")", "'+1", "'-2+3", "'@SUM(A1)", "'\tTAB", "'\rCR", 'plain, with "quotes"\nand a line', '2+2'].sort(),
    );
    for (const row of parsed.data) {
      expect(row['vessel tag']).toBe("'=FT");
      expect(row['technician']).toBe("'-Ana");
    }
  });

  it('no text cell a reader sees can start a formula; every number reads back exactly (property)', () => {
    // papaparse converts numbers only below 2^53 in magnitude; larger ones stay text by its design.
    const number = fc.double({ noNaN: true, min: -(2 ** 53) + 1, max: 2 ** 53 - 1 });
    fc.assert(
      fc.property(fc.oneof(fc.string(), number), (value) => {
        const cell = csvCell(value);
        const back = (Papa.parse<unknown[]>(`${cell}\r\n`, { dynamicTyping: true }).data[0] ?? [])[0];
        if (typeof value === 'number') {
          expect(back).toBe(Object.is(value, -0) ? 0 : value);
        } else if (value !== '') {
          expect(String(back ?? '')).not.toMatch(/^[=+\-@\t\r]/);
        }
      }),
    );
  });

  it('lists one vessel only, oldest first, with progress and cancel', async () => {
    const a = await addVessel({ tag: 'A', spec: SPEC });
    const b = await addVessel({ tag: 'B', spec: SPEC });
    await appendCheck(sampleCheck(a.id, { takenAt: new Date('2026-12-01T08:00:00Z') }));
    await appendCheck(sampleCheck(b.id, { takenAt: new Date('2026-12-01T07:00:00Z') }));
    await appendCheck(sampleCheck(a.id, { takenAt: new Date('2026-12-01T06:00:00Z') }));
    const seen: [number, number][] = [];
    const rows = parse(await exportCsv({ vesselId: a.id, onProgress: (d, t) => seen.push([d, t]) })).data;
    expect(rows.map((r) => Date.parse(String(r['time (ISO 8601)'])))).toEqual([Date.parse('2026-12-01T06:00:00Z'), Date.parse('2026-12-01T08:00:00Z')]);
    expect(seen.at(-1)).toEqual([2, 2]);
    expect(parse(await exportCsv()).data.map((r) => r['vessel tag'])).toEqual(['A', 'B', 'A']);
    const controller = new AbortController();
    controller.abort();
    await expect(exportCsv({ signal: controller.signal })).rejects.toMatchObject({ code: 'cancelled' });
    expect(csvFromChecks([])).toBe(CSV_BOM + CSV_COLUMNS.map((c) => csvCell(c.header)).join(',') + '\r\n');
  });

  it("exports a filter's selection only, oldest first (issue 14): outcome, technician, period, vessel", async () => {
    const a = await addVessel({ tag: 'A', spec: SPEC });
    const b = await addVessel({ tag: 'B', spec: SPEC });
    const warn = [{ signal: 'WARNING' as const, message: 'A finding made up for the test.', rule: 'test-finding' }];
    for (let i = 0; i < 30; i += 1) {
      await appendCheck(sampleCheck(i % 2 ? a.id : b.id, {
        takenAt: new Date(Date.UTC(2026, 9 + (i % 3), 1 + i)), technician: i % 5 ? 'R. Okafor' : 'M. Lind', cautions: i % 4 ? [] : warn,
      }));
    }
    const read = async (o: Parameters<typeof exportCsv>[0]) => parse(await exportCsv(o)).data;
    const warned = await read({ filter: { outcome: 'WARNING' } });
    expect(warned).toHaveLength(8);
    expect(warned.every((r) => r['outcome (worst signal word among the findings; none when none)'] === 'WARNING')).toBe(true);
    const times = warned.map((r) => Date.parse(String(r['time (ISO 8601)'])));
    expect(times).toEqual([...times].sort((x, y) => x - y));
    expect(await read({ filter: { technician: 'lind' } })).toHaveLength(6);
    const novemberOfA = await read({ vesselId: a.id, filter: { from: new Date(Date.UTC(2026, 10, 1)), to: new Date(Date.UTC(2026, 10, 30, 23, 59)) } });
    expect(novemberOfA.length).toBeGreaterThan(0);
    expect(novemberOfA.every((r) => r['vessel tag'] === 'A' && String(r['time (ISO 8601)']).startsWith('2026-11'))).toBe(true);
    await expect(exportCsv({ filter: { outcome: 'SEVERE' as never } })).rejects.toMatchObject({ code: 'invalid-record', field: 'outcome' });
  });
});

describe('CSV highest signal word', () => {
  const col = CSV_COLUMNS.find((c) => c.header.startsWith('highest signal word'))!;
  const withCautions = (cautions: CheckRecord['cautions']) => ({ cautions }) as unknown as CheckRecord;
  it('leaves out the standing note every result carries, so a row with nothing else raised is empty', () => {
    expect(col.cell(withCautions([{ signal: 'NOTICE', message: 'Advisory figures only.', rule: 'standing-note' }]))).toBeNull();
  });
  it('gives the most severe word among the raised cautions (ISO 3864 / ANSI Z535 order)', () => {
    expect(col.cell(withCautions([
      { signal: 'NOTICE', message: 'a', rule: 'atmosphere-assumed' },
      { signal: 'WARNING', message: 'b', rule: 'flash-on-release' },
      { signal: 'NOTICE', message: 'c', rule: 'standing-note' },
    ]))).toBe('WARNING');
  });
});

describe('CSV of a hand-edited store', () => {
  it('a stored record the month buckets do not list still goes out, in its place by time', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const t0 = Date.parse('2026-11-30T06:00:00Z');
    const saved: CheckRecord[] = [];
    for (let i = 0; i < 5; i += 1) saved.push(await appendCheck(sampleCheck(v.id, { takenAt: new Date(t0 + i * 60_000), result: loose.result(result(i)) })));
    const stranger = '99999999-0000-4000-8000-000000000099';
    await editStored(saved[2]!.id, (r) => ({ ...r, id: stranger }));
    const ids = parse(await exportCsv()).data.map((r) => r['check id']);
    expect(ids).toEqual(saved.map((r, i) => (i === 2 ? stranger : r.id)));
  });

  it('a record deleted from its block (its month row left behind) is simply absent', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    const t0 = Date.parse('2026-11-30T06:00:00Z');
    const saved: CheckRecord[] = [];
    for (let i = 0; i < 5; i += 1) saved.push(await appendCheck(sampleCheck(v.id, { takenAt: new Date(t0 + i * 60_000), result: loose.result(result(i)) })));
    await editStored(saved[1]!.id, () => null);
    expect(parse(await exportCsv()).data.map((r) => r['check id'])).toEqual(saved.filter((_, i) => i !== 1).map((r) => r.id));
  });
});

describe('the CSV\'s rounded columns', () => {
  it('round each figure exactly as the screen does (the store keeps its own copy of the rule)', () => {
    setDecimalSeparator('.');
    fc.assert(fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-6, max: 1e5, noNaN: true }), (v, band) => {
      expect(roundedAsShown(v, band)).toBe(Number(formatToBand(v, band).replace('\u2212', '-')));
    }));
  });

  it('a spreadsheet-grade parser (papaparse) reads the degree sign in the header and the numbers back', () => {
    const record = {
      id: 'c1', vesselId: 'v1', deviceId: 'd1', seq: 1, time: '2026-12-01T10:00:00+00:00', timeMs: 0, technician: 'R. Okafor', note: 'invented test data',
      corrects: null, reason: null, appVersion: '0', formulationId: 'IAPWS-IF97', hash: 'h', prevHash: 'p',
      vessel: { tag: 'FT-204', description: '', spec: { instruments: { weightToleranceKg: 2 } } }, inputs: {},
      reading: { temperatureK: 396.54999999999995, pressure: { reference: 'gauge', pressurePa: 120_000 } },
      result: {
        reading: { absolutePressurePa: 221_325.000000001, gaugePressurePa: 120_000.000000001, atmospherePa: 101_325, netMassKg: 500 },
        saturation: {
          saturationPressurePa: 219_004.123, pressureDeviationPa: 2_320.877, saturationSlopePaPerK: 5_000,
          pressureBand: { plusMinus: 4_100, contributions: { pressureGauge: 4_000, atmosphere: 0, temperatureSensor: 900 } },
        },
        inventory: { regime: 'two-phase', quality: 0.0123456, liquidMassKg: 493.8271, vaporMassKg: 6.1729 },
        inventoryBands: { quality: { plusMinus: 0.00123 }, liquidMassKg: { plusMinus: 2.4 } },
      },
      cautions: [],
    } as unknown as CheckRecord;
    const text = csvFromChecks([record]);
    const row = Papa.parse<Record<string, unknown>>(text, { header: true, dynamicTyping: true, skipEmptyLines: true }).data[0]!;
    // 396.55 K − 273.15 = 123.4 °C; the thermometer's ±0.18 K (900 Pa over 5000 Pa/K) is shown to hundredths, 123.40.
    expect(row['temperature (°C, as shown)']).toBe(123.4);
    expect(row['temperature (K)']).toBe(396.54999999999995);
    expect(row['absolute pressure (kPa, as shown)']).toBe(221); // ±4 kPa: whole kPa
    expect(row['pressure deviation from saturation (kPa, as shown)']).toBe(2); // ±4.1 kPa
    expect(row['quality (%, as shown)']).toBe(1.23);
    expect(row['liquid mass (kg, as shown)']).toBe(493.8);
    expect(row['vapour mass (kg)']).toBe(6.1729);
    // The columns added beside the SI ones: gauge ±4 kPa → whole kPa; atmosphere with no band of its
    // own and no barometer limit → 4 significant digits; net ±2 kg (the vessel's scale) → 0.1 kg;
    // vapour mass on the liquid mass's ±2.4 kg → 0.1 kg.
    expect(row['gauge pressure (kPa, as shown)']).toBe(120);
    expect(row['atmosphere (kPa, as shown)']).toBe(101.3);
    expect(row['net mass (kg, as shown)']).toBe(500);
    expect(row['vapour mass (kg, as shown)']).toBe(6.2);
  });
});

