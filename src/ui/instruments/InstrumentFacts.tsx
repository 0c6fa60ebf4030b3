// What an instrument is: kind, range, class, indicator, display unit, and where its entry came from.
import type { InstrumentHistory } from '../../store/index.ts';
import { rangeText, toleranceText } from '../state/instrument-view.ts';
import { unitLabel } from '../state/unit-labels.ts';
import { KIND_WORDS } from './InstrumentList.tsx';
import { Figures } from '../components/Figures.tsx';

export function InstrumentFacts({ history }: { history: InstrumentHistory }) {
  const i = history.instrument;
  const rows: [string, string][] = [
    ['Kind', KIND_WORDS[i.spec.kind] ?? i.spec.kind],
    ['Range', rangeText(i.spec, i.displayUnit)],
    ['Class or tolerance', toleranceText(i.spec, i.displayUnit)],
  ];
  if (i.spec.indicatorTolerance) rows.push(['Indicator', toleranceText({ ...i.spec, tolerance: i.spec.indicatorTolerance }, i.displayUnit)]);
  rows.push(['Reads in', unitLabel(i.displayUnit)]);
  if (i.description) rows.push(['Description', i.description]);
  if (i.origin.kind === 'from-vessel') rows.push(['Entry made from', `vessel ${i.origin.vesselTag}: ${i.origin.note}`]);
  return <Figures figures={rows.map(([label, value]) => ({ label, value }))} />;
}
