// The check the browser benchmarks save (invented data): a real Reading and a stored result holding
// only the figures they need. Apart from test/store/fixtures.ts, which brings fake-indexeddb along
// and so cannot run in a page.
import type { Reading } from '../src/core/index.ts';
import type { NewCheck } from '../src/store/index.ts';
import { partialNewResult } from './generated-log.ts';

export function benchCheck(vesselId: string, overrides: Partial<NewCheck> = {}): NewCheck {
  const reading: Reading = { time: '2026-03-14T09:30:00+01:00', temperatureK: 424.95, pressure: { reference: 'gauge', pressurePa: 400_000 }, weight: { kind: 'not-weighed' } };
  return {
    vesselId,
    technician: 'Bench',
    inputs: { temperature: { text: '151,8', unit: 'degC' }, pressure: { text: '400', unit: 'kPa', reference: 'gauge' } },
    reading,
    result: partialNewResult({ saturation: { verdict: { verdict: 'consistent' } } }),
    cautions: [{ signal: 'NOTICE', message: 'Does not replace the inspection regime or local codes.', rule: 'standing-note' }],
    appVersion: 'bench',
    formulationId: 'IAPWS-IF97 (R7-97(2012))',
    ...overrides,
  };
}
