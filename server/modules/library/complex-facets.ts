import type { EntityManager } from '@mikro-orm/postgresql';
import { complexStatuses, measurementKinds, type ComplexStatus, type MeasurementKind } from '@/lib/schemas/library';
import type { ComplexFacets, ComplexFacetsQuery } from '@/lib/schemas/library-facets';
import { AppError } from '@/server/http/errors';
import { searchSource } from './complex-search';
import { membershipsOf, type MembershipInfo } from './library-access';

/**
 * The filter options of what the person may see (see library-facets.ts): one pass over the same
 * source the search reads (searchSource: the accepted content for restricted readers, the working
 * copy for authors and curators), so an option is offered exactly when filtering by it can find
 * something, and never names a value that exists only in content the person may not see.
 */
export async function complexFacets(
  em: EntityManager,
  userId: string,
  query: ComplexFacetsQuery,
  options: { memberships?: readonly MembershipInfo[] } = {},
): Promise<ComplexFacets> {
  const all = options.memberships ? new Map(options.memberships.map((m) => [m.groupId, m])) : await membershipsOf(em, userId);
  let memberships = [...all.values()];
  if (query.groupId) {
    const one = all.get(query.groupId);
    if (!one) throw new AppError('NOT_FOUND', 'That group was not found.');
    memberships = [one];
  }
  const empty: ComplexFacets = { metals: [], oxidationStates: [], dCounts: [], ligands: [], measurementKinds: [], statuses: [] };
  if (memberships.length === 0) return empty;
  const source = searchSource(memberships, userId);
  const rows = await em.execute<{ facet: string; value: string; n: string | number }[]>(
    `with s as materialized (select c.metal, c.oxidation_state, c.d_electrons, c.ligand_ids, c.measurement_kinds, c.status from ${source.sql} c)
     select 'metal' as facet, s.metal as value, count(*) as n from s group by s.metal
     union all select 'oxidationState', s.oxidation_state::text, count(*) from s group by s.oxidation_state
     union all select 'dCount', s.d_electrons::text, count(*) from s group by s.d_electrons
     union all select 'ligand', l, count(*) from s cross join lateral unnest(s.ligand_ids) l group by l
     union all select 'measurementKind', k, count(*) from s cross join lateral unnest(s.measurement_kinds) k group by k
     union all select 'status', s.status, count(*) from s group by s.status`,
    source.params,
  );
  const byFacet = (facet: string) =>
    rows.filter((r) => r.facet === facet && r.value !== null).map((r) => ({ value: r.value, count: Number(r.n) }));
  // Orders are fixed here, not left to the plan: the same library gives the same lists for everyone.
  const byText = (a: { value: string }, b: { value: string }) => (a.value < b.value ? -1 : a.value > b.value ? 1 : 0);
  const numeric = (facet: string) =>
    byFacet(facet)
      .map((r) => ({ value: Number(r.value), count: r.count }))
      .sort((a, b) => a.value - b.value);
  const inListOrder = <T extends string>(facet: string, list: readonly T[]) => {
    const found = new Map(byFacet(facet).map((r) => [r.value, r.count]));
    return list.filter((value) => found.has(value)).map((value) => ({ value, count: found.get(value)! }));
  };
  return {
    metals: byFacet('metal').sort(byText),
    oxidationStates: numeric('oxidationState'),
    dCounts: numeric('dCount'),
    ligands: byFacet('ligand').sort(byText),
    measurementKinds: inListOrder<MeasurementKind>('measurementKind', measurementKinds),
    statuses: inListOrder<ComplexStatus>('status', complexStatuses),
  };
}
