// Shared by the plant's administration scripts (couch-setup.mjs, couch-account.mjs): argument
// reading and a small client of CouchDB's HTTP API with the administrator's Basic credentials
// (these scripts run once, from an administrator's shell; the app itself uses cookie sessions).
import { readFileSync } from 'node:fs';

export const CHECKS_DB = 'tankside-checks';
export const PLANT_DB = 'tankside-plant';
export const DEVICE_ROLE = 'tankside-device';
export const SUPERVISOR_ROLE = 'tankside-supervisor';

/** The design document of a database, as kept in deploy/design/<db>.json. */
export function designDoc(db) {
  return JSON.parse(readFileSync(new URL(`./design/${db}.json`, import.meta.url), 'utf8'));
}

/** Stops with a message naming what is wrong and how the command is called. */
export function fail(message, usage) {
  console.error(`${message}${usage ? `\nUsage: ${usage}` : ''}`);
  process.exit(1);
}

/**
 * `<url> <admin-user> <admin-password>` from the command line; the password may instead come from
 * the environment (COUCH_ADMIN_PASSWORD), which keeps it out of the process list.
 */
export function adminArgs(argv, usage, extra = 0) {
  const [url, user, ...rest] = argv;
  const password = process.env.COUCH_ADMIN_PASSWORD ?? rest.shift();
  if (!url || !user || !password || rest.length < extra) fail('Missing arguments.', usage);
  let base;
  try {
    base = new URL(url.endsWith('/') ? url : `${url}/`);
  } catch {
    fail(`url: "${url}" is not a URL; expected e.g. http://127.0.0.1:5984/`, usage);
  }
  if (base.protocol !== 'http:' && base.protocol !== 'https:') fail(`url: expected http:// or https://, got ${base.protocol}`, usage);
  return { server: new Couch(base, user, password), rest };
}

export class Couch {
  constructor(base, user, password) {
    this.base = base;
    this.auth = `Basic ${Buffer.from(`${user}:${password}`).toString('base64')}`;
  }

  /** One request; resolves { status, body } (body parsed as JSON when it is JSON). */
  async request(method, path, body) {
    const headers = { authorization: this.auth, accept: 'application/json' };
    if (body !== undefined) headers['content-type'] = 'application/json';
    let response;
    try {
      response = await fetch(new URL(path, this.base), { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    } catch (error) {
      fail(`Cannot reach ${this.base.href}: ${error.cause?.code ?? error.message}. Is CouchDB running there?`);
    }
    const text = await response.text();
    let parsed = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      // Left as text (an error page from a proxy, say).
    }
    return { status: response.status, body: parsed };
  }

  /** As request, stopping with the server's reason unless the status is one of `ok`. */
  async expect(ok, method, path, body) {
    const r = await this.request(method, path, body);
    if (!ok.includes(r.status)) {
      const reason = typeof r.body === 'object' && r.body ? `${r.body.error}: ${r.body.reason}` : String(r.body).slice(0, 200);
      fail(`${method} ${path} answered ${r.status} (${reason}).`);
    }
    return r;
  }
}

/** A password of 24 random letters and digits (about 143 bits). */
export function randomPassword() {
  const alphabet = 'abcdefghijkmnpqrstuvwxyzABCDEFGHJKLMNPQRSTUVWXYZ23456789';
  const bytes = crypto.getRandomValues(new Uint8Array(24));
  return Array.from(bytes, (b) => alphabet[b % alphabet.length]).join('');
}
