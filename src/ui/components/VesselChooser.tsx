// Choose the vessel for a check: the list, and beside it a way that needs no scrolling through a
// plant's worth of tags — the camera scanning the vessel's QR label where the browser can read one
// (BarcodeDetector), or the tag typed otherwise.
import { useState } from 'preact/hooks';
import type { VesselRecord } from '../state/repo.ts';
import { VesselPicker } from './VesselPicker.tsx';
import { TextField } from './TextField.tsx';
import { lazyScreen } from './LazyScreen.tsx';
import { pure } from './pure.ts';

const hasDetector = () => typeof window !== 'undefined' && 'BarcodeDetector' in window;
const ScanLabel = lazyScreen('The label scanner', () => import('../labels/ScanLabel.tsx').then((m) => m.ScanLabel));

interface Props { vessels: readonly VesselRecord[]; value: string; onChange: (id: string) => void }

/** The active vessel whose tag is `typed` (case and spaces ignored), or the only one it starts. */
export function vesselByTag(vessels: readonly VesselRecord[], typed: string): VesselRecord | undefined {
  const key = typed.trim().toLowerCase();
  if (!key) return undefined;
  const active = vessels.filter((v) => !v.retired);
  return active.find((v) => v.tagKey === key) ?? (active.filter((v) => v.tagKey.startsWith(key)).length === 1 ? active.find((v) => v.tagKey.startsWith(key)) : undefined);
}

function VesselChooserView({ vessels, value, onChange }: Props) {
  const [scanning, setScanning] = useState(false);
  const [tag, setTag] = useState('');
  const [message, setMessage] = useState('');
  const typeTag = (text: string) => {
    setTag(text);
    const v = vesselByTag(vessels, text);
    if (v) { onChange(v.id); setMessage(`${v.tag} chosen.`); } else setMessage(text.trim() ? 'No single vessel tag matches yet.' : '');
  };
  return (
    <div class="vessel-chooser">
      <VesselPicker vessels={vessels} value={value} onChange={onChange} />
      {vessels.some((v) => !v.retired) ? (hasDetector() ? (
        <div class="field">
          {scanning ? <ScanLabel onVessel={(id) => { setScanning(false); onChange(id); }} onClose={() => setScanning(false)} /> : (
            <button type="button" onClick={() => setScanning(true)}>Scan the vessel's label</button>
          )}
        </div>
      ) : (
        <details class="tag-entry">
          <summary>Type the tag instead</summary>
          <TextField id="chk-tag" label="Vessel tag" value={tag} onInput={typeTag} />
          <p class="hint" aria-live="polite">{message}</p>
        </details>
      )) : null}
    </div>
  );
}

export const VesselChooser = pure(VesselChooserView);
