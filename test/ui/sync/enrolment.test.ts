// Reading an enrolment: typed fields checked one by one with a message naming the field and what
// it may be; an enrolment link and the account script's printed text read into the same fields.
// The password floor of 12 characters is deploy/couch-account.mjs's; the invented ids are test data.
import { describe, expect, it } from 'vitest';
import { checkEnrolment, enrolmentLink, enrolmentOfText, type EnrolForm } from '../../../src/ui/sync/enrolment.ts';

const DEVICE = '0a1b2c3d-0000-4000-8000-00000000abcd';
const ORIGIN = 'https://tankside.plant.example';
const good: EnrolForm = { server: '/db/', account: DEVICE, password: 'abcdefghjkmn23', role: 'technician' };

describe('checkEnrolment', () => {
  it('takes a path on the app\'s own origin, or an absolute URL of it or of the origin named at build time', () => {
    expect(checkEnrolment(good, DEVICE, ORIGIN, '')).toEqual({ ok: good });
    expect(checkEnrolment({ ...good, server: `${ORIGIN}/db/` }, DEVICE, ORIGIN, '')).toMatchObject({ ok: { server: `${ORIGIN}/db/` } });
    expect(checkEnrolment({ ...good, server: 'https://couch.plant.example/' }, DEVICE, ORIGIN, 'https://couch.plant.example')).toMatchObject({ ok: {} });
  });

  it('names each wrong field and what it may be; nothing is taken', () => {
    const r = checkEnrolment({ server: 'https://elsewhere.example/db/', account: 'not-an-id', password: 'short', role: 'technician' }, DEVICE, ORIGIN, '');
    expect(r).toEqual({
      errors: {
        server: 'Server: https://elsewhere.example is not an address this app may reach; allowed: https://tankside.plant.example (another origin must be named when the app is built).',
        account: `Account: "not-an-id" is not a device id; expected this device's id, ${DEVICE} (a lower-case UUID).`,
        password: 'Password: 5 characters; the administrator\'s passwords have 12 to 200.',
      },
    });
    expect(checkEnrolment({ ...good, server: '/db' }, DEVICE, ORIGIN, '')).toMatchObject({ errors: { server: expect.stringContaining('must end with "/"') } });
    expect(checkEnrolment({ ...good, server: '' }, DEVICE, ORIGIN, '')).toMatchObject({ errors: { server: expect.stringMatching(/^Server: "" is not an address/) } });
    const other = '0a1b2c3d-0000-4000-8000-00000000ffff';
    expect(checkEnrolment({ ...good, account: other }, DEVICE, ORIGIN, '')).toMatchObject({ errors: { account: expect.stringContaining('another device\'s account') } });
  });
});

describe('enrolmentOfText', () => {
  it('reads back the link it makes, a password with & and = in it included', () => {
    const f: EnrolForm = { ...good, password: 'a&b=c%d/e?f#g h', role: 'supervisor' };
    const link = enrolmentLink(`${ORIGIN}/`, f);
    expect(link.startsWith(`${ORIGIN}/#/sync/enrol?`)).toBe(true);
    expect(enrolmentOfText(link)).toEqual(f);
  });

  it('reads the text the account script prints, and nothing else', () => {
    const printed = JSON.stringify({ account: DEVICE, password: 'abcdefghjkmn23', role: 'technician' }, null, 2);
    expect(enrolmentOfText(printed)).toEqual({ account: DEVICE, password: 'abcdefghjkmn23', role: 'technician' });
    expect(enrolmentOfText(`${ORIGIN}/#/check/${DEVICE}`)).toBeNull();
    expect(enrolmentOfText('{ not json')).toBeNull();
    expect(enrolmentOfText('[1,2]')).toBeNull();
  });
});
