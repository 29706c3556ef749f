import { randomBytes, randomUUID } from 'node:crypto';
import pg from 'pg';
import { migrate, openOrm, type Orm } from '@/server/db/orm';
import { adminQuery, requireDatabaseUrl, withDatabase } from '../setup/test-database';

/**
 * A database written with the earlier review words (submitted, approved, changes-requested,
 * rejected; approve, request-changes, reject) reads in the current words after migrating:
 * statuses, stored snapshots, review decisions and audit events alike.
 */
const name = `sphereline_words_${randomBytes(4).toString('hex')}`;
const url = () => withDatabase(requireDatabaseUrl(), name);
let orm: Orm;
let client: pg.Client;

beforeAll(async () => {
  await adminQuery(`create database "${name}"`);
  orm = await openOrm(url());
  await orm.getMigrator().up({ to: 'Migration20270130000000_change_feed' });
  client = new pg.Client({ connectionString: url() });
  await client.connect();
});
afterAll(async () => {
  await client?.end();
  await orm?.close(true);
  await adminQuery(`drop database if exists "${name}" with (force)`);
});

it('rewrites statuses, snapshots, decisions and audit events, and renames the accepted-snapshot columns', async () => {
  const group = randomUUID();
  await client.query(`insert into research_group (id, name, created_at) values ($1, 'Larkspur Coordination Lab', now())`, [group]);
  const old = ['submitted', 'approved', 'changes-requested', 'rejected', 'draft', 'retired'];
  const ids: string[] = [];
  for (const status of old) {
    const id = randomUUID();
    ids.push(id);
    const snapshot = JSON.stringify({ formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III)', status: 'approved', measurements: [] });
    await client.query(
      `insert into complex (id, group_id, formula, name, status, metal, oxidation_state, d_electrons, verdict, ligand_set_key, search_text,
         version, approved_snapshot, approved_version, created_at, updated_at)
       values ($1, $2, '[Co(NH3)6]3+', 'hexaamminecobalt(III)', $3, 'Co', 3, 6, 'inert', 'NH3*6', 'hexaamminecobalt', 2, $4, 2, now(), now())`,
      [id, group, status, snapshot],
    );
    await client.query(
      `insert into complex_revision (id, complex_id, number, kind, status, message, snapshot, created_at) values ($1, $2, 2, 'review', $3, 'x', $4, now())`,
      [randomUUID(), id, status, JSON.stringify({ status })],
    );
  }
  const decisions = ['approve', 'request-changes', 'reject'];
  for (const decision of decisions) {
    await client.query(
      `insert into complex_review (id, complex_id, revision_number, decision, comment, self_approved, created_at) values ($1, $2, 2, $3, '', false, now())`,
      [randomUUID(), ids[0], decision],
    );
  }
  await client.query(
    `insert into audit_event (id, group_id, action, subject_type, subject_id, details, created_at)
     values ($1, $2, 'library.entry.changes-requested', 'complex', $3, $4, now())`,
    [randomUUID(), group, ids[0], JSON.stringify({ from: 'submitted', to: 'changes-requested', decision: 'request-changes' })],
  );

  expect(await migrate(orm)).toContain('Migration20270135000000_review_words');

  const statuses = (await client.query(`select status from complex where id = any($1) order by array_position($1, id)`, [ids])).rows.map((r) => r.status);
  expect(statuses).toEqual(['in-review', 'accepted', 'returned', 'declined', 'draft', 'retired']);
  const snapshots = (await client.query(`select accepted_snapshot->>'status' as s, accepted_version from complex`)).rows;
  expect(new Set(snapshots.map((r) => r.s))).toEqual(new Set(['accepted']));
  expect(snapshots.every((r) => r.accepted_version === 2)).toBe(true);
  const revisionStatuses = (await client.query(`select status, snapshot->>'status' as s from complex_revision`)).rows;
  expect(revisionStatuses.every((r) => r.status === r.s)).toBe(true);
  expect(new Set(revisionStatuses.map((r) => r.status))).toEqual(new Set(['in-review', 'accepted', 'returned', 'declined', 'draft', 'retired']));
  const reviewDecisions = (await client.query(`select decision from complex_review order by decision`)).rows.map((r) => r.decision);
  expect(reviewDecisions).toEqual(['accept', 'decline', 'return']);
  const [event] = (await client.query(`select action, details from audit_event where subject_id = $1`, [ids[0]])).rows;
  expect(event.action).toBe('library.entry.returned');
  expect(event.details).toEqual({ from: 'in-review', to: 'returned', decision: 'return' });
  await expect(client.query(`update complex set status = 'approved' where id = $1`, [ids[0]])).rejects.toThrow(/complex_status_check/);
});
