// Settings: technician name, preferred units, site atmosphere, storage state and the backup reminder.
import { TextField } from '../components/TextField.tsx';
import { Choice } from '../components/Choice.tsx';
import { UnitPrefsPicker } from '../components/UnitPrefsPicker.tsx';
import { AtmosphereSettings } from '../components/AtmosphereSettings.tsx';
import { BackupPanel } from '../components/BackupPanel.tsx';
import { StoragePanel } from '../components/StoragePanel.tsx';
import { updateSettings, useSettings } from '../state/app-state.ts';
import type { UnitSystem } from '../state/settings-model.ts';
import { FORMULATION_ID } from '../../core/index.ts';

const SYSTEMS = [
  { id: 'SI', label: 'SI' },
  { id: 'US', label: 'US customary' },
  { id: 'custom', label: 'Per quantity' },
] as const;

const SEPARATORS = [
  { id: '.', label: 'Point 1.5' },
  { id: ',', label: 'Comma 1,5' },
] as const;

export function SettingsScreen() {
  const s = useSettings();
  return (
    <div>
      <section class="panel" aria-labelledby="set-who">
        <h2 id="set-who">Technician</h2>
        <TextField id="set-tech" label="Your name (saved with each check)" value={s.technician}
          onInput={(technician) => void updateSettings({ technician })} />
      </section>
      <section class="panel" aria-labelledby="set-units">
        <h2 id="set-units">Units</h2>
        <Choice<UnitSystem> name="set-system" legend="Preferred units" value={s.unitSystem} options={SYSTEMS}
          onChange={(unitSystem) => void updateSettings({ unitSystem })} />
        {s.unitSystem === 'custom' ? <UnitPrefsPicker /> : null}
        <Choice name="set-decimal" legend="Decimal separator" value={s.decimalSeparator} options={SEPARATORS}
          onChange={(decimalSeparator) => void updateSettings({ decimalSeparator })} />
        <p class="hint">Either is read when it cannot be mistaken; this choice decides "1,250" and "1.250".</p>
      </section>
      <AtmosphereSettings />
      <StoragePanel />
      <BackupPanel />
      <p class="hint">App version {__APP_VERSION__}. Steam properties from {FORMULATION_ID}.</p>
    </div>
  );
}
