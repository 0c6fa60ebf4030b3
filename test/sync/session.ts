// A device's raw session with the stand-in, for trying what the app never sends: signs in with
// POST /_session and carries the AuthSession cookie, as a hostile client with a device's
// credentials could.
export class RawSession {
  private cookie = '';
  constructor(readonly url: string) {}

  async signIn(name: string, password: string): Promise<number> {
    const r = await fetch(new URL('_session', this.url), { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name, password }) });
    const set = r.headers.getSetCookie().find((c) => c.startsWith('AuthSession='));
    if (set) this.cookie = set.split(';')[0]!;
    await r.text();
    return r.status;
  }

  async request<T = Record<string, unknown>>(method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (this.cookie) headers['cookie'] = this.cookie;
    if (body !== undefined) headers['content-type'] = 'application/json';
    const r = await fetch(new URL(path, this.url), { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    return { status: r.status, body: (await r.json()) as T };
  }
}
