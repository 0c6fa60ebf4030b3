#!/usr/bin/env node
// npm run couch:add-device -- <url> <admin-user> <admin-password> <device-id> [password]
// npm run couch:add-supervisor -- <url> <admin-user> <admin-password> <device-id> [password]
// npm run couch:revoke -- <url> <admin-user> <admin-password> <device-id>
// One CouchDB account per device, named by the device id the app shows in Settings. A device
// account writes its own records to tankside-checks; a supervisor's device account also writes
// vessel versions to tankside-plant. Prints what the device needs to enrol (server, account,
// password); a password not given is made here. Running it again for an existing account sets the
// password and roles anew (the device then enrols again with the new password).
import { adminArgs, DEVICE_ROLE, fail, randomPassword, SUPERVISOR_ROLE } from './couch-admin.mjs';

const kind = process.argv[2];
const USAGE = {
  device: 'npm run couch:add-device -- <url> <admin-user> <admin-password> <device-id> [password]',
  supervisor: 'npm run couch:add-supervisor -- <url> <admin-user> <admin-password> <device-id> [password]',
  revoke: 'npm run couch:revoke -- <url> <admin-user> <admin-password> <device-id>',
}[kind];
if (!USAGE) fail(`Unknown account kind "${kind}"; expected device, supervisor or revoke.`);
const { server, rest } = adminArgs(process.argv.slice(3), USAGE, 1);
const [deviceId, given] = rest;
if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/.test(deviceId ?? '')) {
  fail(`device-id: "${deviceId ?? ''}" is not a device id; expected the lower-case UUID shown in the app's Settings.`, USAGE);
}
if (given !== undefined && (given.length < 12 || given.length > 200)) fail(`password: ${given.length} characters; allowed 12 to 200.`, USAGE);

const path = `_users/org.couchdb.user:${deviceId}`;
const existing = await server.request('GET', path);
if (kind === 'revoke') {
  if (existing.status === 404) fail(`No account ${deviceId} on this server.`);
  await server.expect([200], 'DELETE', `${path}?rev=${encodeURIComponent(existing.body._rev)}`);
  console.log(`Account ${deviceId} deleted: the device can no longer sign in. Its records already on the server stay.`);
  process.exit(0);
}
const password = given ?? randomPassword();
const roles = kind === 'supervisor' ? [DEVICE_ROLE, SUPERVISOR_ROLE] : [DEVICE_ROLE];
const user = { _id: `org.couchdb.user:${deviceId}`, name: deviceId, type: 'user', roles, password };
if (existing.status === 200) user._rev = existing.body._rev;
await server.expect([201, 202], 'PUT', path, user);
console.log(`Account ${deviceId} ${existing.status === 200 ? 'updated' : 'created'} with roles ${roles.join(', ')}.`);
console.log('Enrolment for the device (give it to the device only; the password is not shown again):');
const role = kind === 'supervisor' ? 'supervisor' : 'technician';
console.log(JSON.stringify({ account: deviceId, password, role }, null, 2));
// With the app's address (TANKSIDE_APP_URL=https://tankside.plant.example/), also the enrolment link
// the Sync screen reads (src/ui/sync/enrolment.ts), to open on the device or show as a QR code.
const app = process.env.TANKSIDE_APP_URL;
if (app) {
  const link = new URL(app);
  link.hash = `/sync/enrol?${new URLSearchParams({ server: process.env.TANKSIDE_SYNC_SERVER ?? '/db/', account: deviceId, password, role })}`;
  console.log(`Enrolment link: ${link}`);
}
