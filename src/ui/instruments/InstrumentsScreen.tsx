// Instruments (under More): the register list, most pressing first, or one instrument's page.
// Composes only: the register comes from state/register-state.ts, the parts from this room.
import { InstrumentList } from './InstrumentList.tsx';
import { InstrumentPage } from './InstrumentPage.tsx';
import './instruments.css';

export function InstrumentsScreen({ param }: { param?: string | undefined }) {
  return param ? <InstrumentPage key={param} instrumentId={param} /> : <InstrumentList />;
}
