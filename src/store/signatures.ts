// Verifying the chain-head signatures signing.ts makes, for the long jobs (verifying the stored log,
// importing a backup). A valid signature on seq n vouches for the hash of seq n, and through the
// hash chain for every record before it; so one verification per device shows a chain untouched,
// and when it fails, a binary search over the signed records finds the first one no valid
// signature vouches for (a record edited and the chain re-hashed after it: every signature from
// there on fails). That costs about log2(records) verifications, not one per record.
import { StoreError } from './errors.ts';
import type { PublicJwk } from './records.ts';
import { base64url, chainHeadMessage, SIGNATURE_PARAMS, SIGNING_ALGORITHM } from './signing.ts';

const UTF8 = new TextEncoder();

/** How far a device's records are vouched for by its signatures. */
export type SignatureStatus =
  /** No signature, and none expected: records saved before the device signed, or by a version that did not. */
  | { state: 'unsigned' }
  /**
   * Every record from seq 1 to throughSeq is vouched for by a valid signature of the key with this
   * fingerprint. Records after throughSeq, when the chain goes on (headSeq), carry no signature:
   * they arrived without one (plant sync does not carry signatures yet).
   */
  | { state: 'signed'; fingerprint: string; throughSeq: number; headSeq: number }
  /**
   * The record `at` is the first no valid signature vouches for (its own fails or is missing, and no
   * later one makes up for it); records up to throughSeq (0: none) are vouched for.
   */
  | { state: 'failed'; fingerprint: string | null; throughSeq: number; at: { id: string; seq: number }; detail: string };

/**
 * RFC 7638 JWK thumbprint: SHA-256 of the key's required members (for EC: crv, kty, x, y; for RSA:
 * e, kty, n) written as JSON in that order with no whitespace, in base64url.
 */
export async function jwkThumbprint(jwk: Readonly<Record<string, string>>): Promise<string> {
  const required = jwk['kty'] === 'RSA' ? ['e', 'kty', 'n'] : ['crv', 'kty', 'x', 'y'];
  const text = `{${required.map((k) => `${JSON.stringify(k)}:${JSON.stringify(jwk[k] ?? '')}`).join(',')}}`;
  return base64url(new Uint8Array(await crypto.subtle.digest('SHA-256', UTF8.encode(text))));
}

/** A device's public key, ready to verify with. */
export interface VerifyingKey {
  key: CryptoKey;
  jwk: PublicJwk;
  fingerprint: string;
}

/** What the coverage search reads of one record. */
export interface SignedHead {
  id: string;
  seq: number;
  hash: string;
  /** '' when the record carries no signature. */
  signature: string;
}

/** The bytes of base64url text (RFC 4648 §5, padding optional); null if it is not base64url. */
export function fromBase64url(text: string): Uint8Array<ArrayBuffer> | null {
  if (!/^[A-Za-z0-9_-]*$/.test(text) || text.length % 4 === 1) return null;
  const binary = atob(text.replace(/-/g, '+').replace(/_/g, '/').padEnd(Math.ceil(text.length / 4) * 4, '='));
  const out = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i += 1) out[i] = binary.charCodeAt(i);
  return out;
}

/** A public JWK as WebCrypto verifies with it. @throws StoreError('invalid-backup') for a key WebCrypto refuses */
export async function verifyingKey(jwk: PublicJwk): Promise<VerifyingKey> {
  try {
    const key = await crypto.subtle.importKey('jwk', { ...jwk, ext: true }, SIGNING_ALGORITHM, true, ['verify']);
    return { key, jwk, fingerprint: await jwkThumbprint({ ...jwk }) };
  } catch {
    throw new StoreError('invalid-backup', 'Backup file not imported, nothing changed. publicKey: not a P-256 public key', 'publicKey');
  }
}

/** Whether `signature` (64 bytes r ‖ s, base64url) is a valid ECDSA P-256 / SHA-256 signature of `message` by `key`. */
export async function verifyP256(key: CryptoKey, message: Uint8Array<ArrayBuffer>, signature: string): Promise<boolean> {
  const bytes = fromBase64url(signature);
  if (!bytes || bytes.length !== 64) return false;
  return crypto.subtle.verify(SIGNATURE_PARAMS, key, bytes, message);
}

/** Whether a record's chain-head signature is valid for the device's key. */
export function verifyChainHead(key: CryptoKey, deviceId: string, head: SignedHead): Promise<boolean> {
  return head.signature === '' ? Promise.resolve(false) : verifyP256(key, chainHeadMessage(deviceId, head.seq, head.hash), head.signature);
}

/**
 * How far a device's chain is vouched for. `firstSigned` and `lastSigned` are the lowest and highest
 * seq that carry a signature (null: none), `headSeq` the chain's last seq; `at(seq)` gives a record
 * (undefined where none is). Signatures are assumed to hold on a run from `firstSigned` and fail
 * after it (what an edit and re-hash leaves); a search finds where, verifying about log2 of the
 * signed records. Everything below a valid signature is vouched for by it, through the hash chain,
 * which the caller verifies separately.
 */
export async function signatureCoverage(o: {
  deviceId: string;
  key: VerifyingKey | null;
  firstSigned: number | null;
  lastSigned: number | null;
  headSeq: number;
  at: (seq: number) => Promise<SignedHead | undefined>;
}): Promise<SignatureStatus> {
  const { deviceId, key, firstSigned, lastSigned, headSeq } = o;
  const short = deviceId.slice(0, 8);
  if (firstSigned === null || lastSigned === null) return { state: 'unsigned' };
  const at = async (seq: number) => (await o.at(seq)) ?? { id: '', seq, hash: '', signature: '' };
  if (key === null) {
    const first = await at(firstSigned);
    return { state: 'failed', fingerprint: null, throughSeq: 0, at: { id: first.id, seq: first.seq }, detail: `seq ${first.seq} is signed, but no public key of device ${short} is known` };
  }
  const good = async (seq: number) => {
    const head = await at(seq);
    return head.hash !== '' && (await verifyChainHead(key.key, deviceId, head));
  };
  const why = async (seq: number, before: number): Promise<string> => {
    const head = await o.at(seq);
    if (!head) return `seq ${seq} is missing`;
    if (head.signature === '') return `seq ${seq} carries no signature${before > 0 ? `, though seq ${before} before it is signed` : ''}`;
    return `seq ${seq}: its signature does not verify with device ${short}'s key (fingerprint ${key.fingerprint}): changed after it was signed, or signed by another key`;
  };
  const failedAt = async (seq: number, through: number): Promise<SignatureStatus> => {
    const head = await o.at(seq);
    return { state: 'failed', fingerprint: key.fingerprint, throughSeq: through, at: { id: head?.id ?? '', seq }, detail: await why(seq, through) };
  };
  if (await good(lastSigned)) {
    // Records after the last signature carry none: vouched for only as far as it goes, said so.
    return { state: 'signed', fingerprint: key.fingerprint, throughSeq: lastSigned, headSeq: Math.max(headSeq, lastSigned) };
  }
  if (!(await good(firstSigned))) return failedAt(firstSigned, 0);
  let lo = firstSigned; // good
  let hi = lastSigned; // not good
  while (hi - lo > 1) {
    const mid = lo + Math.floor((hi - lo) / 2);
    if (await good(mid)) lo = mid;
    else hi = mid;
  }
  return failedAt(hi, lo);
}
