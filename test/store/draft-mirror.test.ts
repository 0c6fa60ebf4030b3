// The drafts' localStorage mirror (src/store/settings.ts): a write the page issued but the browser
// aborted when the page went away must not lose the entry, and a saved or discarded entry must not
// come back. Node has no localStorage, so a small stand-in with the Web Storage calls is installed.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { SPEC, failWritesOverQuota, sampleCheck, useFreshDatabase } from './fixtures.ts';
import { addVessel, appendCheck, clearDraft, closeStore, loadDraft, openStore, saveDraft } from '../../src/store/index.ts';
import type { LogBlock } from '../../src/store/log-layout.ts';

useFreshDatabase();

class MemoryStorage {
  items = new Map<string, string>();
  full = false;
  get length(): number { return this.items.size; }
  key(i: number): string | null { return [...this.items.keys()][i] ?? null; }
  getItem(k: string): string | null { return this.items.get(k) ?? null; }
  setItem(k: string, v: string): void {
    if (this.full) throw new DOMException('full', 'QuotaExceededError');
    this.items.set(k, String(v));
  }
  removeItem(k: string): void { this.items.delete(k); }
  clear(): void { this.items.clear(); }
}

let storage: MemoryStorage;
beforeEach(() => {
  storage = new MemoryStorage();
  (globalThis as { localStorage?: unknown }).localStorage = storage;
});
afterEach(() => {
  delete (globalThis as { localStorage?: unknown }).localStorage;
});

const KEY = 'tankside.draft.check';

describe('draft mirror', () => {
  it('is written before the IndexedDB write is awaited, and wins when that write never landed', async () => {
    await saveDraft('check', { pressure: '4' });
    const pending = saveDraft('check', { pressure: '400' });
    // Synchronously, before any IndexedDB work: what a page closed now leaves behind.
    expect(JSON.parse(storage.getItem(KEY)!).value).toEqual({ pressure: '400' });
    await pending;
    // The browser aborted the last IndexedDB write as the page went away: IndexedDB still holds the
    // older entry, the mirror the newer one, and the newer one is what the form gets back.
    storage.setItem(KEY, JSON.stringify({ value: { pressure: '400', gross: '612' }, savedAt: '2026-12-04T21:40:00.000Z' }));
    await closeStore();
    await openStore();
    expect((await loadDraft('check'))?.value).toEqual({ pressure: '400', gross: '612' });
  });

  it('goes with the saved check: the entry does not come back in the form', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    await saveDraft('check', { vesselId: v.id, note: 'typed' });
    await appendCheck(sampleCheck(v.id), { clearDraft: 'check' });
    expect(storage.getItem(KEY)).toBeNull();
    expect(await loadDraft('check')).toBeUndefined();
  });

  it('a save that fails keeps the entry: IndexedDB still has the draft the mirror gave up', async () => {
    const v = await addVessel({ tag: 'FT-204', spec: SPEC });
    await saveDraft('check', { vesselId: v.id, note: 'typed' });
    const restore = failWritesOverQuota((value) => Array.isArray((value as LogBlock).texts));
    try {
      await expect(appendCheck(sampleCheck(v.id), { clearDraft: 'check' })).rejects.toMatchObject({ code: 'quota-exceeded' });
    } finally {
      restore();
    }
    expect((await loadDraft('check'))?.value).toEqual({ vesselId: v.id, note: 'typed' });
  });

  it('a discarded entry stays discarded even if the IndexedDB delete was cut short', async () => {
    await saveDraft('check', { note: 'old' });
    await clearDraft('check');
    expect(await loadDraft('check')).toBeUndefined();
    // Typing again replaces the mark.
    await saveDraft('check', { note: 'new' });
    expect((await loadDraft('check'))?.value).toEqual({ note: 'new' });
    // The delete did not reach IndexedDB (simulated: the draft put back), the mark did.
    await clearDraft('check');
    storage.removeItem(KEY);
    await saveDraft('check', { note: 'stale' });
    storage.setItem(KEY, 'discarded');
    expect(await loadDraft('check')).toBeUndefined();
  });

  it('a mirror that cannot be written is removed, so IndexedDB alone decides', async () => {
    await saveDraft('check', { note: 'first' });
    storage.full = true;
    await saveDraft('check', { note: 'second' });
    expect(storage.getItem(KEY)).toBeNull();
    expect((await loadDraft('check'))?.value).toEqual({ note: 'second' });
  });
});
