// The script sha256-browser.bench-run.ts bundles and runs in the page: the two SHA-256 functions it times.
import { sha256OfText } from '../src/store/sha256.ts';
import { nobleSha256Hex } from './sha256-candidates.ts';

export const ours = sha256OfText;
export const noble = nobleSha256Hex;
