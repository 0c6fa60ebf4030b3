// What a vessel's QR label holds: a link to the app with the vessel's new check in its hash
// (…/#/check/<vessel id>). The phone's own camera opens it in the browser, where the service worker
// serves the app offline; the in-app scanner reads the id back out of it.
import { hrefFor } from '../router.ts';

/** The link a label for `vesselId` carries, on the app's own address (`base`: the page's URL). */
export function labelLink(base: string, vesselId: string): string {
  const url = new URL(base);
  url.hash = hrefFor('check', vesselId).slice(1);
  url.search = '';
  return url.toString();
}

/** The vessel id in a scanned text, if it is one of our label links (any address); otherwise undefined. */
export function vesselIdOfLabel(text: string): string | undefined {
  const m = /#\/check\/([^/?#\s]+)\s*$/.exec(text.trim());
  return m ? decodeURIComponent(m[1]!) : undefined;
}
