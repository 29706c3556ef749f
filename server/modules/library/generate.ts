import type { EntityManager } from '@mikro-orm/postgresql';
import demoLibrary from '@/data/demo-library.json';
import { deriveColumns } from './derive';

/**
 * Synthetic library entries for benchmarks (the 100 000-entry performance issue). The engine
 * classifies each distinct demo formula once; PostgreSQL then multiplies them with
 * generate_series in one INSERT … SELECT per table, so 100 000 entries take seconds, not minutes.
 * Entries are accepted (with an accepted snapshot) unless `status` says otherwise; every third one
 * gets a cited-looking water-exchange measurement so the measurement filters have work to do.
 * Synthetic rows are marked in their notes; they have no revisions.
 */
export interface GenerateOptions {
  groupId: string;
  count: number;
  createdById?: string | null;
  status?: 'accepted' | 'draft';
}

export async function generateSyntheticEntries(em: EntityManager, options: GenerateOptions): Promise<number> {
  const templates = demoLibrary.complexes.map((entry) => {
    const derived = deriveColumns(entry.formula, entry.name);
    return { formula: entry.formula, name: entry.name, ...derived };
  });
  const status = options.status ?? 'accepted';
  await em.transactional(async (tem) => {
    // Throwaway clusters commit asynchronously; VACUUM cannot mark a page all-visible until the
    // inserting commit is on disk, so this one commit waits for it (see the VACUUM below).
    await tem.execute('set local synchronous_commit = on');
    await tem.execute(
      `with t as (
         select (ordinality - 1)::int as i, value as v from jsonb_array_elements(?::jsonb) with ordinality
       ), g as (
         select n, gen_random_uuid() as id, t.v from generate_series(1, ?::int) as n join t on t.i = n % ?::int
       )
       insert into complex (id, group_id, formula, name, status, notes, metal, oxidation_state, d_electrons, spin_state, verdict,
                            ligand_ids, ligand_set_key, search_text, measurement_kinds, has_citation, version, created_by_id,
                            accepted_snapshot, accepted_version, accepted_at, created_at, updated_at)
       select g.id, ?::uuid, g.v->>'formula', (g.v->>'name') || ' (synthetic ' || g.n || ')', ?, 'Synthetic benchmark entry',
              g.v->>'metal', (g.v->>'oxidationState')::int, (g.v->>'dElectrons')::int, g.v->>'spinState', g.v->>'verdict',
              array(select jsonb_array_elements_text(g.v->'ligandIds')), g.v->>'ligandSetKey',
              (g.v->>'searchText') || ' synthetic ' || g.n,
              case when g.n % 3 = 0 then array['water-exchange'] else '{}'::text[] end, g.n % 3 = 0, 1, ?::uuid,
              case when ? = 'accepted' then jsonb_build_object(
                'formula', g.v->>'formula', 'name', (g.v->>'name') || ' (synthetic ' || g.n || ')', 'notes', 'Synthetic benchmark entry',
                'status', 'accepted', 'metal', g.v->>'metal', 'oxidationState', (g.v->>'oxidationState')::int,
                'dElectrons', (g.v->>'dElectrons')::int, 'spinState', g.v->'spinState', 'verdict', g.v->>'verdict',
                'ligandIds', g.v->'ligandIds', 'measurements',
                -- The accepted content holds the same measurement kinds as the working copy (restricted readers search it).
                case when g.n % 3 = 0 then jsonb_build_array(jsonb_build_object(
                  'id', gen_random_uuid(), 'kind', 'water-exchange', 'value', 1, 'unit', 's-1', 'temperatureK', 298.15,
                  'ionicStrengthM', null, 'medium', null, 'method', null, 'partnerFormula', null, 'citation', null,
                  'notes', 'Synthetic benchmark value', 'createdAt', now(), 'updatedAt', now()))
                else '[]'::jsonb end) end,
              case when ? = 'accepted' then 1 end, case when ? = 'accepted' then now() end, now(), now()
         from g`,
      [JSON.stringify(templates), options.count, templates.length, options.groupId, status, options.createdById ?? null, status, status, status],
    );
    await tem.execute(
      `insert into measurement (id, complex_id, kind, value, unit, temperature_k, notes, created_at, updated_at)
       select gen_random_uuid(), c.id, 'water-exchange', power(10, (random() * 20 - 10))::double precision, 's-1', 298.15,
              'Synthetic benchmark value', now(), now()
         from complex c
        where c.group_id = ?::uuid and c.notes = 'Synthetic benchmark entry' and c.has_citation
          and not exists (select 1 from measurement m where m.complex_id = c.id)`,
      [options.groupId],
    );
  });
  // VACUUM (not just ANALYZE) sets the visibility map, so searches answer from the covering index at once.
  await em.execute('vacuum analyze complex');
  await em.execute('analyze measurement');
  return options.count;
}
