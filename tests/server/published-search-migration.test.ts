import { randomBytes, randomUUID } from 'node:crypto';
import pg from 'pg';
import { openOrm, type Orm } from '@/server/db/orm';
import { adminQuery, requireDatabaseUrl, withDatabase } from '../setup/test-database';

/**
 * The published search columns of a database from before them: after migrating, accepted entries
 * carry their accepted snapshot's name, species, measurement kinds and search text (also when a
 * pending edit renamed the working copy), other entries carry none; later writes keep them.
 */
const name = `sphereline_pub_${randomBytes(4).toString('hex')}`;
const url = () => withDatabase(requireDatabaseUrl(), name);
let orm: Orm;
let client: pg.Client;

beforeAll(async () => {
  await adminQuery(`create database "${name}"`);
  orm = await openOrm(url());
  await orm.getMigrator().up({ to: 'Migration20270135000000_review_words' });
  client = new pg.Client({ connectionString: url() });
  await client.connect();
});
afterAll(async () => {
  await client?.end();
  await orm?.close(true);
  await adminQuery(`drop database if exists "${name}" with (force)`);
});

const snapshotOf = (formula: string, entryName: string, kinds: string[], cited: boolean) =>
  JSON.stringify({
    formula,
    name: entryName,
    notes: null,
    status: 'accepted',
    metal: 'Cr',
    oxidationState: 3,
    dElectrons: 3,
    spinState: null,
    verdict: 'inert',
    ligandIds: ['H2O'],
    measurements: kinds.map((kind) => ({ kind, citation: cited ? { id: randomUUID() } : null })),
  });

it('fills the published columns from the accepted snapshot, never from a pending edit', async () => {
  const group = randomUUID();
  await client.query(`insert into research_group (id, name, created_at) values ($1, 'Larkspur Coordination Lab', now())`, [group]);
  const insert = (id: string, formula: string, entryName: string, status: string, searchText: string, snapshot: string | null) =>
    client.query(
      `insert into complex (id, group_id, formula, name, status, metal, oxidation_state, d_electrons, verdict, ligand_ids, ligand_set_key, search_text,
         measurement_kinds, has_citation, version, accepted_snapshot, accepted_version, created_at, updated_at)
       values ($1, $2, $3, $4, $5, 'Ni', 2, 8, 'labile', '{NH3}', 'NH3:6', $6, '{ligand-exchange}', false, 3, $7, 2, now(), now())`,
      [id, group, formula, entryName, status, searchText, snapshot],
    );
  const plain = randomUUID();
  const renamed = randomUUID();
  const draft = randomUUID();
  // Working copy equal to the snapshot: its search text is kept as it is.
  await insert(plain, '[Cr(H2O)6]3+', 'hexaaquachromium(III)', 'accepted', 'cr h2o 6 3 hexaaquachromium iii cr chromium iii h2o aqua', snapshotOf('[Cr(H2O)6]3+', 'hexaaquachromium(III)', ['water-exchange'], true));
  // A pending edit renamed it (another species too): the search text comes from the engine, for the snapshot.
  await insert(renamed, '[Ni(NH3)6]2+', 'quillwort nickel batch', 'in-review', 'ni nh3 6 2 quillwort nickel batch ni nickel ii nh3 ammine', snapshotOf('[Cr(H2O)6]3+', 'hexaaquachromium(III) stock', ['water-exchange', 'activation-volume'], false));
  await insert(draft, '[Ni(NH3)6]2+', 'quillwort draft', 'draft', 'ni nh3 quillwort draft', null);

  await orm.getMigrator().up();

  const rows = new Map(
    (
      await client.query(
        `select id, published_name, published_metal, published_oxidation_state, published_d_electrons, published_verdict, published_ligand_ids,
                published_measurement_kinds, published_has_citation, published_search_text from complex`,
      )
    ).rows.map((r: { id: string; published_search_text: string | null }) => [r.id, r]),
  );
  expect(rows.get(plain)).toMatchObject({
    published_name: 'hexaaquachromium(III)',
    published_metal: 'Cr',
    published_oxidation_state: 3,
    published_d_electrons: 3,
    published_verdict: 'inert',
    published_ligand_ids: ['H2O'],
    published_measurement_kinds: ['water-exchange'],
    published_has_citation: true,
    published_search_text: 'cr h2o 6 3 hexaaquachromium iii cr chromium iii h2o aqua',
  });
  const pending = rows.get(renamed)!;
  expect(pending).toMatchObject({
    published_name: 'hexaaquachromium(III) stock',
    published_metal: 'Cr',
    published_measurement_kinds: ['activation-volume', 'water-exchange'],
    published_has_citation: false,
  });
  // The engine's words for the snapshot (element name, ligand name), none of the pending edit's.
  expect(pending.published_search_text?.split(' ')).toEqual(expect.arrayContaining(['hexaaquachromium', 'stock', 'chromium', 'aqua']));
  expect(pending.published_search_text).not.toMatch(/quillwort|nickel|ammine/);
  expect(rows.get(draft)).toMatchObject({ published_name: null, published_search_text: null, published_metal: null });

  // A later write of the working copy leaves the published columns alone; storing a snapshot moves them.
  await client.query(`update complex set name = 'quillwort nickel batch 2', search_text = 'quillwort' where id = $1`, [renamed]);
  const kept = (await client.query('select published_search_text, published_name from complex where id = $1', [renamed])).rows[0];
  expect(kept).toEqual({ published_search_text: pending.published_search_text, published_name: 'hexaaquachromium(III) stock' });
  await client.query(`update complex set accepted_snapshot = null where id = $1`, [plain]);
  const cleared = (await client.query('select published_search_text, published_name from complex where id = $1', [plain])).rows[0];
  expect(cleared).toEqual({ published_search_text: null, published_name: null });
});
