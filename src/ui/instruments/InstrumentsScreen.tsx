// Instruments (under More): the register list, most pressing first, one instrument's page, or the
// form that adds one (#/instruments/new).
// Composes only: the register comes from state/register-state.ts, the parts from this room.
import { InstrumentList } from './InstrumentList.tsx';
import { InstrumentPage } from './InstrumentPage.tsx';
import { InstrumentForm } from './InstrumentForm.tsx';
import { hrefFor, navigate } from '../router.ts';
import './instruments.css';

/** The route parameter of the add form (an instrument's own is its UUID). */
export const NEW_INSTRUMENT = 'new';

export function InstrumentsScreen({ param }: { param?: string | undefined }) {
  if (param === NEW_INSTRUMENT) {
    return (
      <div>
        <p><a href={hrefFor('instruments')}>All instruments</a></p>
        <InstrumentForm onSaved={(saved) => navigate('instruments', saved.id)} />
      </div>
    );
  }
  return param ? <InstrumentPage key={param} instrumentId={param} /> : <InstrumentList />;
}
