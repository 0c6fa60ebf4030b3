// A worker that hashes texts for chain verification, so hashing one page of the log runs on a
// second core while the page reads and sorts out the next. Messages: { id, texts } in,
// { id, hashes } out (SHA-256 hex of each text's UTF-8, as sha256OfText gives it).
import { sha256OfText } from './sha256.ts';

interface Ask {
  id: number;
  texts: string[];
}

// The DOM lib types `self` as a window; in a dedicated worker it posts to the page that made it.
const scope = globalThis as unknown as { onmessage: ((e: MessageEvent<Ask>) => void) | null; postMessage(message: unknown): void };

scope.onmessage = (e) => {
  const { id, texts } = e.data;
  const hashes = new Array<string>(texts.length);
  for (let i = 0; i < texts.length; i += 1) hashes[i] = sha256OfText(texts[i]!);
  scope.postMessage({ id, hashes });
};
