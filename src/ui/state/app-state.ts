// The app's shared state: settings (loaded once, saved on change) and the vessel list.
// Components read it through hooks and change it through these functions; only repo.ts talks
// to the store.
import * as repo from './repo.ts';
import type { VesselRecord } from './repo.ts';
import { shared, useShared } from './observable.ts';
import { DEFAULT_SETTINGS, type AppSettings } from './settings-model.ts';
import { setDecimalSeparator } from './format.ts';

const settingsState = shared<AppSettings>(DEFAULT_SETTINGS);
const vesselsState = shared<readonly VesselRecord[]>([]);
const saveErrorState = shared<string>('');
/** 'opening' until the store is open and settings and vessels are read; the shell renders before. */
const readyState = shared<'opening' | 'ready' | 'failed'>('opening');

/** Loads what every screen needs; the shell is already on screen while it runs. */
export async function loadAppState(): Promise<void> {
  const [settings, vessels] = await Promise.all([repo.loadSettings(), repo.listVessels()]);
  applySettings({ ...DEFAULT_SETTINGS, ...settings });
  vesselsState.set(vessels);
  readyState.set('ready');
}

/** Marks the store unusable (the screens then say nothing can be saved). */
export function reportStoreFailed(): void {
  readyState.set('failed');
}

/** Whether the store is open and the shared state loaded. */
export function useAppReady(): 'opening' | 'ready' | 'failed' {
  return useShared(readyState);
}

export function useSettings(): AppSettings {
  return useShared(settingsState);
}

export function useVessels(): readonly VesselRecord[] {
  return useShared(vesselsState);
}

/** The last storage error, shown at the top of the app until the next successful save. */
export function useSaveError(): string {
  return useShared(saveErrorState);
}

export function reportSaveError(message: string): void {
  saveErrorState.set(message);
}

/** Applies a change to the settings and stores it. */
export async function updateSettings(change: Partial<AppSettings>): Promise<void> {
  const next = { ...settingsState.get(), ...change };
  applySettings(next);
  try {
    await repo.saveSettings(next);
    saveErrorState.set('');
  } catch (e) {
    saveErrorState.set(`Settings not saved: ${repo.storageMessage(e)}`);
  }
}

export async function refreshVessels(): Promise<void> {
  vesselsState.set(await repo.listVessels());
}

function applySettings(s: AppSettings): void {
  setDecimalSeparator(s.decimalSeparator);
  settingsState.set(s);
}
