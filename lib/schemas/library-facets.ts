import { z } from 'zod';
import { complexStatusSchema, measurementKindSchema } from './library';

/**
 * GET /api/complexes/facets — the filter options of the library as the person sees it: the values
 * present in the entries they may see (the accepted content for viewers, and for contributors on
 * entries of others; the working copy for authors and curators), each with how many entries hold
 * it. Always in one order: metals by symbol, numbers ascending, ligands by id, measurement kinds
 * and statuses in the order of their lists.
 */
const facetValue = <T extends z.ZodType>(value: T) => z.object({ value, count: z.number().int().min(0) });

export const complexFacetsQuerySchema = z.object({ groupId: z.uuid('groupId must be a group id.').optional() }).strict();
export type ComplexFacetsQuery = z.infer<typeof complexFacetsQuerySchema>;

export const complexFacetsSchema = z.object({
  metals: z.array(facetValue(z.string())),
  oxidationStates: z.array(facetValue(z.number().int())),
  dCounts: z.array(facetValue(z.number().int())),
  ligands: z.array(facetValue(z.string())),
  measurementKinds: z.array(facetValue(measurementKindSchema)),
  statuses: z.array(facetValue(complexStatusSchema)),
});
export type ComplexFacets = z.infer<typeof complexFacetsSchema>;
