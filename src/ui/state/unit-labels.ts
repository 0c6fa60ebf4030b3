// Display labels for stored unit ids (records keep the id; people read the symbol).
import { LENGTH_UNITS, MASS_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, VOLUME_UNITS } from '../../core/basics.ts';

const ALL: readonly { id: string; label: string }[] = [...PRESSURE_UNITS, ...TEMPERATURE_UNITS, ...MASS_UNITS, ...VOLUME_UNITS, ...LENGTH_UNITS];

/** The symbol for a unit id ("degC" → "°C"); an unknown id is shown as stored. */
export function unitLabel(id: string): string {
  return ALL.find((u) => u.id === id)?.label ?? id;
}
