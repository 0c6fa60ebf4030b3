// Vessel labels: the link a QR label carries and reading the vessel back from a scanned text.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { labelLink, vesselIdOfLabel } from '../../src/ui/labels/label-link.ts';
import { parseRoute } from '../../src/ui/router.ts';
import { vesselByTag } from '../../src/ui/components/VesselChooser.tsx';
import type { VesselRecord } from '../../src/store/index.ts';

describe('label links', () => {
  it('a label opens the vessel\'s new check on the app\'s own address, whatever the page was showing', () => {
    const link = labelLink('https://plant.example/tankside/?x=1#/log/abc', '0b6f3c1e-1a2b-4c3d-8e9f-001122334455');
    expect(link).toBe('https://plant.example/tankside/#/check/0b6f3c1e-1a2b-4c3d-8e9f-001122334455');
    expect(parseRoute(new URL(link).hash)).toEqual({ screen: 'check', param: '0b6f3c1e-1a2b-4c3d-8e9f-001122334455' });
  });

  it('reads the vessel id back from any label link, and nothing from other codes', () => {
    fc.assert(fc.property(fc.uuid(), (id) => {
      expect(vesselIdOfLabel(labelLink('http://127.0.0.1:4173/', id))).toBe(id);
    }));
    expect(vesselIdOfLabel('https://example.org/somewhere')).toBeUndefined();
    expect(vesselIdOfLabel('WIFI:S:plant;;')).toBeUndefined();
  });

  it('a typed tag picks the vessel it names, or the only one it starts (case and spaces ignored)', () => {
    const v = (tag: string, retired = false) => ({ id: tag, tag, tagKey: tag.toLowerCase(), retired }) as unknown as VesselRecord;
    const list = [v('ST-01'), v('ST-02'), v('FT-02'), v('CR-09', true)];
    expect(vesselByTag(list, ' st-01 ')?.id).toBe('ST-01');
    expect(vesselByTag(list, 'FT')?.id).toBe('FT-02');
    expect(vesselByTag(list, 'ST')).toBeUndefined();
    expect(vesselByTag(list, 'CR-09')).toBeUndefined();
  });
});
