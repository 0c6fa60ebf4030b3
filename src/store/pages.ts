// Reading a whole object store fast, for the exports.
//
// In Chromium, reading records along an index costs about twice the CPU of reading them in the
// store's own (primary key) order: each index entry leads to a second lookup of its record
// (bench/idb-read.bench-run.ts prints both). An export writes every record once, as text, and
// holds all of that text until it is joined anyway; so it can read in primary key order, keep
// each record's text beside its sort key, and sort the texts at the end, instead of walking an
// index. Only the texts and their keys are held, never the records.

/** Records per getAll when reading a whole store in primary key order. */
export const STORE_PAGE = 5000;

/** The pages of a store's records in primary key order, each page requested as the previous one arrives. */
export async function* storePages<T>(
  store: { getAll(range?: IDBKeyRange, count?: number): Promise<T[]> },
  keyOf: (record: T) => IDBValidKey,
  size: number = STORE_PAGE,
): AsyncGenerator<T[], void, undefined> {
  let next = store.getAll(undefined, size);
  for (;;) {
    const page = await next;
    if (page.length === 0) return;
    // Asked for before this page is used (the transaction is active now, and stays the same snapshot).
    if (page.length === size) {
      next = store.getAll(IDBKeyRange.lowerBound(keyOf(page[page.length - 1]!), true), size);
      next.catch(() => {}); // observed on the next turn, or abandoned if the consumer stops
    } else {
      next = Promise.resolve([]);
    }
    yield page;
  }
}

/** A piece of output text with the index key it sorts by: `[a, b]` as IndexedDB orders keys. */
export interface KeyedText {
  a: IDBValidKey;
  b: IDBValidKey;
  text: string;
}

/**
 * Whether [a, b] is a valid IndexedDB key: a record whose index key is not valid is not in that
 * index, so an export that walked the index would leave it out; so does one that sorts.
 * Strings and finite-or-infinite numbers (the stored shapes) are checked without a call.
 */
export function isIndexKey(a: unknown, b: unknown): boolean {
  if ((typeof a === 'string' || (typeof a === 'number' && !Number.isNaN(a))) &&
    (typeof b === 'string' || (typeof b === 'number' && !Number.isNaN(b)))) return true;
  try {
    indexedDB.cmp([a as IDBValidKey, b as IDBValidKey], 0);
    return true;
  } catch {
    return false;
  }
}

/** IndexedDB's order of [a, b] keys: numbers before strings, strings by UTF-16 code units. */
function compareKeyed(x: KeyedText, y: KeyedText): number {
  const c = compareKey(x.a, y.a);
  return c !== 0 ? c : compareKey(x.b, y.b);
}

function compareKey(x: IDBValidKey, y: IDBValidKey): number {
  if (typeof x === typeof y && (typeof x === 'string' || typeof x === 'number')) return x < y ? -1 : x > y ? 1 : 0;
  return indexedDB.cmp(x, y); // other key types (dates, arrays, binary) only in a hand-edited database
}

/** The texts in index-key order (sorted in place). */
export function sortKeyed<T extends KeyedText>(items: T[]): T[] {
  return items.sort(compareKeyed);
}
