// The register's writes and the place a vessel's instrument holds, for the Instruments screens
// only: apart from repo.ts so they load with those screens, not with the start-up JavaScript
// (test/size/bundle-size.mjs). Same rule as repo.ts: the screens never see IndexedDB.
import * as register from '../../store/transfer.ts';
import type { FittingRecord, InstrumentRecord, InstrumentRole, NewInstrument } from '../../store/index.ts';

/** Adds an instrument to the register; resolves once it is saved. */
export async function addInstrument(input: NewInstrument): Promise<InstrumentRecord> {
  return register.addInstrument(input);
}

/** Changes what an instrument is (its spec, unit, description); its calibrations and fittings stay. */
export async function updateInstrument(id: string, input: NewInstrument): Promise<InstrumentRecord> {
  return register.updateInstrument(id, { spec: input.spec, displayUnit: input.displayUnit, description: input.description ?? '' });
}

/** Retires an instrument: kept with its history, taken off the places it holds now. */
export async function retireInstrument(id: string): Promise<InstrumentRecord> {
  return register.retireInstrument(id);
}

/** Fits an instrument to a vessel's place from now (a swap when another holds it: a new fitting, both histories kept). */
export async function fitInstrument(vesselId: string, role: InstrumentRole, instrumentId: string | null, reason: string): Promise<FittingRecord> {
  return register.fitInstrument(vesselId, role, instrumentId, { reason });
}

/** The instrument holding a vessel's place now, or null. */
export async function placeHolder(vesselId: string, role: InstrumentRole): Promise<InstrumentRecord | null> {
  return (await register.fittedInstruments(vesselId))[role]?.instrument ?? null;
}
