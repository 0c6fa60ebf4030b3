// A small client of CouchDB's documented HTTP API: cookie sessions (POST /_session), JSON requests
// with retry and backoff, and the server's answers turned into SyncErrors with plain words.
// `fetch` is passed in, so the same code runs in the browser (the browser keeps the AuthSession
// cookie, HttpOnly) and in Node (which has no cookie store: the cookie is kept here).
import { cancelled, SyncError } from './errors.ts';

export type FetchLike = (input: string, init: RequestInit) => Promise<Response>;

/** How often and how patiently a request is tried again after a network failure or a 5xx answer. */
export interface RetryPolicy {
  /** Tries in all, the first included (1: no retry). */
  attempts: number;
  /** Wait before the second try, doubled before each further one. */
  firstDelayMs: number;
  /** The longest wait between two tries. */
  maxDelayMs: number;
}

/** About 30 s of patience in all: a restarting server or a phone between two access points. */
export const DEFAULT_RETRY: RetryPolicy = { attempts: 8, firstDelayMs: 250, maxDelayMs: 8000 };

export interface CouchOptions {
  /** The server's root: an absolute URL, or a path on the app's own origin such as "/db/". */
  server: string;
  account: string;
  password: string;
  fetch: FetchLike;
  retry?: RetryPolicy;
  signal?: AbortSignal | undefined;
}

/** A CouchDB answer: status and parsed JSON body. */
export interface CouchAnswer<T> {
  status: number;
  body: T;
}

/** The server's error body. */
interface CouchErrorBody {
  error?: string;
  reason?: string;
}

export class Couch {
  readonly root: URL;
  private readonly retry: RetryPolicy;
  /** The AuthSession cookie where the platform lets us see it (Node); the browser keeps its own. */
  private cookie: string | null = null;
  private signedIn = false;

  constructor(private readonly options: CouchOptions) {
    const base = (globalThis as { location?: { href: string } }).location?.href;
    const server = options.server.endsWith('/') ? options.server : `${options.server}/`;
    try {
      this.root = base === undefined ? new URL(server) : new URL(server, base);
    } catch {
      throw new SyncError('not-enrolled', `The server address "${options.server}" is not a web address; expected e.g. https://plant.example/db/ or /db/.`);
    }
    this.retry = options.retry ?? DEFAULT_RETRY;
  }

  /**
   * Signs in with the account's name and password (POST /_session), once per client: later
   * requests carry the session cookie instead of the password.
   * @throws SyncError('credentials' | 'offline' | 'server' | 'cancelled')
   */
  async signIn(): Promise<void> {
    const r = await this.send<{ ok?: boolean } & CouchErrorBody>('POST', '_session', { name: this.options.account, password: this.options.password }, false);
    if (r.status === 401 || r.status === 403) {
      throw new SyncError('credentials', `The server refused the account ${this.options.account} or its password. Ask the administrator to enrol this device again.`, r.body.reason, r.status);
    }
    if (r.status !== 200 || r.body.ok !== true) throw answerError('Signing in', r);
    this.signedIn = true;
  }

  /**
   * A JSON request under the session (signing in first, and again once if the session expired).
   * Network failures and 5xx answers are tried again with backoff; every other answer is returned.
   */
  async request<T>(method: string, path: string, body?: unknown): Promise<CouchAnswer<T>> {
    if (!this.signedIn) await this.signIn();
    let r = await this.send<T>(method, path, body, true);
    if (r.status === 401) {
      // The session cookie expired (CouchDB's default is 10 minutes without a request).
      this.signedIn = false;
      await this.signIn();
      r = await this.send<T>(method, path, body, true);
      if (r.status === 401) throw new SyncError('credentials', 'The server no longer accepts this device\'s session. Ask the administrator whether the account was revoked.', reasonOf(r.body), 401);
    }
    return r;
  }

  /** The next request signs in first (the server no longer knows this session). */
  forgetSession(): void {
    this.signedIn = false;
    this.cookie = null;
  }

  private async send<T>(method: string, path: string, body: unknown, retryServerErrors: boolean): Promise<CouchAnswer<T>> {
    const url = new URL(path, this.root).href;
    const headers: Record<string, string> = { accept: 'application/json' };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (this.cookie) headers['cookie'] = this.cookie;
    const init: RequestInit = { method, headers, credentials: 'include', cache: 'no-store' };
    if (body !== undefined) init.body = JSON.stringify(body);
    if (this.options.signal) init.signal = this.options.signal;
    let delay = this.retry.firstDelayMs;
    for (let attempt = 1; ; attempt += 1) {
      if (this.options.signal?.aborted) throw cancelled();
      let failure: SyncError;
      try {
        const response = await this.options.fetch(url, init);
        this.keepCookie(response);
        const text = await response.text();
        if (response.status < 500 || !retryServerErrors) return { status: response.status, body: parseBody<T>(text, response.status) };
        failure = answerError(`${method} ${path}`, { status: response.status, body: safeParse(text) });
      } catch (error) {
        if (error instanceof SyncError) throw error;
        if (this.options.signal?.aborted || (error as { name?: unknown }).name === 'AbortError') throw cancelled();
        failure = new SyncError('offline', `The server at ${this.root.href} could not be reached (no network, or the server is down). Checks stay on this device and go up at the next sync.`);
      }
      if (attempt >= this.retry.attempts) throw failure;
      await pause(delay, this.options.signal);
      delay = Math.min(delay * 2, this.retry.maxDelayMs);
    }
  }

  private keepCookie(response: Response): void {
    const headers = response.headers as Headers & { getSetCookie?: () => string[] };
    for (const line of headers.getSetCookie?.() ?? []) {
      const pair = line.split(';')[0]!;
      if (pair.startsWith('AuthSession=')) this.cookie = pair;
    }
  }
}

function safeParse(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

function parseBody<T>(text: string, status: number): T {
  const parsed = safeParse(text);
  if (typeof parsed !== 'object' || parsed === null) {
    throw new SyncError('server', `The server's answer (${status}) is not CouchDB's JSON; check that the address points at CouchDB (e.g. the proxy's /db/ path).`, undefined, status);
  }
  return parsed as T;
}

function reasonOf(body: unknown): string | undefined {
  const b = body as CouchErrorBody | null;
  return typeof b?.reason === 'string' ? b.reason : typeof b?.error === 'string' ? b.error : undefined;
}

/** A SyncError for an answer that was not what the step needed. */
export function answerError(what: string, r: { status: number; body: unknown }): SyncError {
  const reason = reasonOf(r.body);
  if (r.status === 401) return new SyncError('credentials', `${what}: the server asks for a valid account (401).`, reason, 401);
  if (r.status === 403) return new SyncError('refused', `${what}: the server refused (${reason ?? 'no reason given'}).`, reason, 403);
  if (r.status === 404) return new SyncError('server', `${what}: the server has no such database or document (404${reason ? `, ${reason}` : ''}). Has the administrator run couch:setup?`, reason, 404);
  return new SyncError('server', `${what}: the server answered ${r.status}${reason ? ` (${reason})` : ''}.`, reason, r.status);
}

/** Waits `ms`, or stops at once with 'cancelled' when the signal fires. */
function pause(ms: number, signal: AbortSignal | undefined): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(cancelled());
    const timer = setTimeout(() => {
      signal?.removeEventListener('abort', onAbort);
      resolve();
    }, ms);
    const onAbort = () => {
      clearTimeout(timer);
      reject(cancelled());
    };
    signal?.addEventListener('abort', onAbort, { once: true });
  });
}

/** A JSON value as a query parameter (CouchDB reads keys as JSON). */
export function jsonParam(value: unknown): string {
  return encodeURIComponent(JSON.stringify(value));
}
