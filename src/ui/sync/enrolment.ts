// What an administrator gives a device to enrol it, read from what the person has: the typed form,
// an enrolment link (opened from a QR code or a message), or the text `npm run couch:add-device`
// prints. Each field is checked with a message naming it and what it may be; nothing is saved
// until every field is right (the store checks again).
//
// The enrolment link is the app's own address with the enrolment in its hash, where it never
// reaches any server:  <app>#/sync/enrol?server=<s>&account=<a>&password=<p>&role=<technician|supervisor>
// (each value percent-encoded, as URLSearchParams writes it; deploy/README.md shows how to make one).

export type EnrolRole = 'technician' | 'supervisor';

export interface EnrolForm {
  server: string;
  account: string;
  password: string;
  role: EnrolRole;
}

export type FormErrors = Partial<Record<keyof EnrolForm, string>>;

/** The server most plants use: CouchDB behind the app's own origin (deploy/nginx-tankside.conf). */
export const DEFAULT_SERVER = '/db/';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
/** The store's own limits (src/store/sync-log.ts requireSyncPatch); the password's floor is deploy/couch-account.mjs's. */
const LIMITS = { server: 2000, passwordMin: 12, passwordMax: 200 } as const;

/**
 * Checks the form field by field. `origin` is the page's; `otherOrigin` the one the build lets sync
 * reach besides it ('' for none): the page's CSP refuses any other, so the form does too.
 */
export function checkEnrolment(f: EnrolForm, deviceId: string, origin: string, otherOrigin: string): { ok: EnrolForm } | { errors: FormErrors } {
  const errors: FormErrors = {};
  const server = f.server.trim();
  const allowed = [origin, ...(otherOrigin ? [otherOrigin] : [])];
  let url: URL | null = null;
  try {
    url = new URL(server, origin);
  } catch {
    url = null;
  }
  if (server === '' || server.length > LIMITS.server || url === null || (url.protocol !== 'https:' && url.protocol !== 'http:')) {
    errors.server = `Server: "${server}" is not an address; expected a path on this app's address such as ${DEFAULT_SERVER}, or a URL of ${allowed.join(' or ')} (at most ${LIMITS.server} characters).`;
  } else if (!allowed.includes(url.origin)) {
    errors.server = `Server: ${url.origin} is not an address this app may reach; allowed: ${allowed.join(' or ')} (another origin must be named when the app is built).`;
  } else if (!url.pathname.endsWith('/')) {
    errors.server = `Server: "${server}" must end with "/" (the root of the plant's CouchDB, such as ${DEFAULT_SERVER}).`;
  }
  const account = f.account.trim();
  if (!UUID.test(account)) {
    errors.account = `Account: "${account}" is not a device id; expected this device's id, ${deviceId} (a lower-case UUID).`;
  } else if (account !== deviceId) {
    errors.account = `Account: ${account} is another device's account; the server accepts this device's checks only under its own id, ${deviceId}. Ask the administrator for an account of that name.`;
  }
  if (f.password.length < LIMITS.passwordMin || f.password.length > LIMITS.passwordMax) {
    errors.password = `Password: ${f.password.length} characters; the administrator's passwords have ${LIMITS.passwordMin} to ${LIMITS.passwordMax}.`;
  }
  if (f.role !== 'technician' && f.role !== 'supervisor') errors.role = 'Role: expected technician or supervisor.';
  if (Object.keys(errors).length > 0) return { errors };
  return { ok: { server, account, password: f.password, role: f.role } };
}

/**
 * The enrolment fields in a scanned or pasted text: an enrolment link, or the JSON the account
 * script prints ({ account, password, role }, and a server when given). Fields the text does not
 * hold are left out; null when it is neither.
 */
export function enrolmentOfText(text: string): Partial<EnrolForm> | null {
  const t = text.trim();
  const at = t.indexOf('#/sync/enrol?');
  if (at !== -1) return fieldsOf(new URLSearchParams(t.slice(at + '#/sync/enrol?'.length)));
  if (t.startsWith('{')) {
    try {
      const v = JSON.parse(t) as Record<string, unknown>;
      if (typeof v !== 'object' || v === null || Array.isArray(v)) return null;
      const out: Partial<EnrolForm> = {};
      for (const k of ['server', 'account', 'password'] as const) if (typeof v[k] === 'string') out[k] = v[k];
      if (v['role'] === 'technician' || v['role'] === 'supervisor') out.role = v['role'];
      return Object.keys(out).length > 0 ? out : null;
    } catch {
      return null;
    }
  }
  return null;
}

function fieldsOf(q: URLSearchParams): Partial<EnrolForm> | null {
  const out: Partial<EnrolForm> = {};
  for (const k of ['server', 'account', 'password'] as const) {
    const v = q.get(k);
    if (v !== null) out[k] = v;
  }
  const role = q.get('role');
  if (role === 'technician' || role === 'supervisor') out.role = role;
  return Object.keys(out).length > 0 ? out : null;
}

/** The enrolment link for `f` on the app at `appUrl` (what an administrator's tools may print). */
export function enrolmentLink(appUrl: string, f: EnrolForm): string {
  const url = new URL(appUrl);
  url.hash = `/sync/enrol?${new URLSearchParams({ server: f.server, account: f.account, password: f.password, role: f.role }).toString()}`;
  return url.toString();
}
