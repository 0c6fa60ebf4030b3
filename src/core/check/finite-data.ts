// Results are stored in the log and exported, so they must be plain data: objects, arrays,
// strings, booleans, null and finite numbers. A NaN or Infinity that slipped through a formula
// at the edge of a range must not be saved as if it were a figure.

import { InputError } from '../errors.ts';

/** Returns data unchanged if it is plain and every number is finite; otherwise throws InputError naming the path. */
export function requireFiniteData<T>(data: T): T {
  walk(data, 'result');
  return data;
}

function walk(value: unknown, path: string): void {
  if (value === null || typeof value === 'string' || typeof value === 'boolean') return;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      throw new InputError(path, 'out-of-range', String(value), undefined,
        `${path}: the computation left the valid range of the formulation for these inputs (value ${String(value)}).`);
    }
    return;
  }
  if (Array.isArray(value)) {
    value.forEach((item, i) => walk(item, `${path}[${i}]`));
    return;
  }
  if (typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
    for (const [key, item] of Object.entries(value as Record<string, unknown>)) walk(item, `${path}.${key}`);
    return;
  }
  throw new InputError(path, 'inconsistent', typeof value, undefined, `${path}: not plain data (${typeof value}).`);
}
