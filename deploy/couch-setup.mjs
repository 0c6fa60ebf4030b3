#!/usr/bin/env node
// npm run couch:setup -- <url> <admin-user> <admin-password>
// Makes a CouchDB 3 server (or the pouchdb-server stand-in) ready for Tankside: the two databases,
// who may read them (_security), and the write rules (the design documents in deploy/design/).
// Idempotent: run it again after an upgrade of the rules; what is already right is left alone.
import { adminArgs, CHECKS_DB, designDoc, DEVICE_ROLE, PLANT_DB, SUPERVISOR_ROLE } from './couch-admin.mjs';

const USAGE = 'npm run couch:setup -- <url> <admin-user> <admin-password>   (or COUCH_ADMIN_PASSWORD in the environment)';
const { server } = adminArgs(process.argv.slice(2), USAGE);

// Reads are granted per database: every member reads every document of it (deploy/README.md says
// what a plant that must not allow that does instead). Writes are decided by the design documents.
const SECURITY = {
  admins: { names: [], roles: [] },
  members: { names: [], roles: [DEVICE_ROLE, SUPERVISOR_ROLE] },
};

const info = await server.expect([200], 'GET', '');
console.log(`Server: ${info.body.vendor?.name ?? 'unknown'} ${info.body.version ?? ''}`.trim());

for (const db of [CHECKS_DB, PLANT_DB]) {
  const created = await server.expect([201, 202, 412], 'PUT', db);
  console.log(`${db}: ${created.status === 412 ? 'already there' : 'created'}`);

  const security = await server.expect([200], 'GET', `${db}/_security`);
  if (JSON.stringify(normalised(security.body)) === JSON.stringify(SECURITY)) {
    console.log(`${db}/_security: already as wanted`);
  } else {
    await server.expect([200], 'PUT', `${db}/_security`, SECURITY);
    console.log(`${db}/_security: members are the roles ${SECURITY.members.roles.join(', ')}`);
  }

  const wanted = designDoc(db);
  const current = await server.request('GET', `${db}/${wanted._id}`);
  if (current.status === 200 && current.body.validate_doc_update === wanted.validate_doc_update && current.body.language === wanted.language) {
    console.log(`${db}/${wanted._id}: already current`);
  } else {
    const body = current.status === 200 ? { ...wanted, _rev: current.body._rev } : wanted;
    await server.expect([201, 202], 'PUT', `${db}/${wanted._id}`, body);
    console.log(`${db}/${wanted._id}: ${current.status === 200 ? 'updated' : 'written'}`);
  }
}
console.log('Done. Add accounts with npm run couch:add-device and npm run couch:add-supervisor.');

/** The _security object with both sections present (CouchDB answers {} for a new database). */
function normalised(sec) {
  const section = (s) => ({ names: s?.names ?? [], roles: s?.roles ?? [] });
  return { admins: section(sec?.admins), members: section(sec?.members) };
}
