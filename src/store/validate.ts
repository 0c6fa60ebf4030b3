// Small field checks shared by the repositories and the backup reader. Each failure names the field
// and the valid range (RULES 6).
import { StoreError } from './errors.ts';
import { canonicalJson } from './integrity.ts';
import type { JsonObject, JsonValue } from './records.ts';

export const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
export const HEX64 = /^[0-9a-f]{64}$/;

export function invalid(field: string, message: string): StoreError {
  return new StoreError('invalid-record', `${field}: ${message}`, field);
}

/** A string of minLength to maxLength characters (UTF-16 code units), returned as given. */
export function requireText(field: string, value: unknown, minLength: number, maxLength: number): string {
  if (typeof value !== 'string') throw invalid(field, `expected text of ${minLength} to ${maxLength} characters`);
  if (value.length < minLength || value.length > maxLength) {
    throw invalid(field, `${value.length} characters; allowed ${minLength} to ${maxLength}`);
  }
  return value;
}

export function requireUuid(field: string, value: unknown): string {
  if (typeof value !== 'string' || !UUID.test(value)) throw invalid(field, 'expected a lower-case UUID');
  return value;
}

/** A plain JSON object of bounded depth: what the store keeps for specs, readings and results. */
export function requireJsonObject(field: string, value: unknown): JsonObject {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw invalid(field, 'expected an object');
  requireJson(field, value);
  return value as JsonObject;
}

const MAX_JSON_DEPTH = 16;

/** Plain JSON only: null, booleans, finite numbers, strings, arrays, plain objects; depth ≤ 16. */
export function requireJson(field: string, value: unknown, depth = 0): JsonValue {
  if (depth > MAX_JSON_DEPTH) throw invalid(field, `nested deeper than ${MAX_JSON_DEPTH} levels`);
  if (value === null || typeof value === 'boolean' || typeof value === 'string') return value;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw invalid(field, `${value} is not a finite number`);
    return value;
  }
  if (Array.isArray(value)) {
    value.forEach((item, i) => requireJson(`${field}[${i}]`, item, depth + 1));
    return value as JsonValue;
  }
  if (typeof value === 'object') {
    const proto = Object.getPrototypeOf(value);
    if (proto !== Object.prototype && proto !== null) throw invalid(field, 'expected a plain object');
    for (const [key, item] of Object.entries(value)) {
      if (FORBIDDEN_KEYS.has(key)) throw invalid(`${field}.${key}`, 'this key name is not allowed');
      if (item !== undefined) requireJson(`${field}.${key}`, item, depth + 1);
    }
    return value as JsonValue;
  }
  throw invalid(field, `a ${typeof value} cannot be stored`);
}

/** Keys that could reach an object's prototype if a consumer ever merged records naively. */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

/** A deep copy through canonical JSON: detaches the caller's objects and drops undefined keys. */
export function cloneJson<T>(value: T): T {
  return JSON.parse(canonicalJson(value)) as T;
}
