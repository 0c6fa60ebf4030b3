// Loads the invented demo plant (clearly labelled DEMO DATA) on request.
import { useState } from 'preact/hooks';
import { refreshVessels, useVessels } from '../state/app-state.ts';
import { loadDemoPlant } from '../state/demo-plant.ts';
import { storageMessage } from '../state/repo.ts';

export function DemoPlantButton() {
  const vessels = useVessels();
  const [message, setMessage] = useState('');
  const load = async () => {
    try {
      const n = await loadDemoPlant(vessels);
      await refreshVessels();
      setMessage(n ? `Added ${n} invented DEMO DATA vessels.` : 'The demo vessels are already in the list.');
    } catch (e) {
      setMessage(`Demo plant not loaded: ${storageMessage(e)}`);
    }
  };
  return (
    <>
      <button type="button" onClick={() => void load()}>Load demo plant</button>
      <span aria-live="polite">{message}</span>
    </>
  );
}
