// The wide review's columns: what each shows of a record, in the person's units, and which store
// order (the whole match) it sorts by. Every column sorts the whole match: since schema v10 the
// month rows keep the key figures too (the pressure column sorts by the absolute pressure, so a
// gauge and an absolute reading of the same state sit together).
import { formatNumber } from '../state/format.ts';
import { massFromKg, pressureFromPa, temperatureFromK } from '../../core/basics.ts';
import type { CheckRecord } from '../../store/index.ts';
import type { CheckSortKey } from '../../store/desk.ts';
import type { UnitPrefs } from '../state/settings-model.ts';
import { unitLabel } from '../state/unit-labels.ts';
import { factsOf, stampText, verdictLabel } from './record-facts.ts';

export type ColumnId = 'time' | 'vessel' | 'outcome' | 'verdict' | 'temperature' | 'pressure' | 'quality' | 'liquid' | 'technician' | 'device';

export interface Column {
  id: ColumnId;
  label: string;
  /** The store's order for the whole match; absent: not sortable. */
  sort?: CheckSortKey;
  /** What the sort goes by, when it is not what the cell shows. */
  sortNote?: string;
  /** The cell's text. */
  text(r: CheckRecord, u: UnitPrefs): string;
}

const dash = '–';
const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

function temperatureText(r: CheckRecord, u: UnitPrefs): string {
  const k = r.reading.temperatureK;
  return finite(k) ? `${formatNumber(temperatureFromK(k, u.temperature), 4)} ${unitLabel(u.temperature)}` : dash;
}

function pressureText(r: CheckRecord, u: UnitPrefs): string {
  const p = r.reading.pressure as { reference?: unknown; pressurePa?: unknown } | undefined;
  if (!p || !finite(p.pressurePa)) return dash;
  // Shown in the reference it was read in: a gauge reading stays gauge.
  const ref = p.reference === 'absolute' ? 'abs' : 'gauge';
  return `${formatNumber(pressureFromPa(p.pressurePa, u.pressure), 4)} ${unitLabel(u.pressure)} ${ref}`;
}

export const COLUMNS: readonly Column[] = [
  { id: 'time', label: 'Time (zone)', sort: 'time', text: (r) => stampText(r.time) },
  { id: 'vessel', label: 'Vessel', sort: 'vessel', text: (r) => r.vessel.tag },
  { id: 'outcome', label: 'Outcome', sort: 'outcome', text: (r) => factsOf(r).outcome },
  { id: 'verdict', label: 'Verdict', sort: 'verdict', text: (r) => verdictLabel(factsOf(r).verdict, 'short') },
  { id: 'temperature', label: 'Temperature', sort: 'temperature', text: temperatureText },
  { id: 'pressure', label: 'Pressure', sort: 'pressure', sortNote: 'sorts by the absolute pressure', text: pressureText },
  { id: 'quality', label: 'Quality', sort: 'quality', text: (r) => { const q = factsOf(r).quality; return q === null ? dash : `${formatNumber(q * 100, 3)} %`; } },
  { id: 'liquid', label: 'Liquid mass', sort: 'liquid', text: (r, u) => { const m = factsOf(r).liquidMassKg; return m === null ? dash : `${formatNumber(massFromKg(m, u.mass), 4)} ${unitLabel(u.mass)}`; } },
  { id: 'technician', label: 'Technician', sort: 'technician', text: (r) => r.technician },
  { id: 'device', label: 'Device', sort: 'device', text: (r) => r.deviceId.slice(0, 8) },
];

/** The columns shown until the person picks others. */
export const DEFAULT_COLUMNS: readonly ColumnId[] = ['time', 'vessel', 'outcome', 'verdict', 'temperature', 'pressure', 'technician', 'device'];

/** The chosen ids as columns, in the table's order; an unknown id is dropped, and time always stays. */
export function chosenColumns(ids: readonly string[]): Column[] {
  return COLUMNS.filter((c) => c.id === 'time' || ids.includes(c.id));
}
