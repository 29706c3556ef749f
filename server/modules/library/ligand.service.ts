import { randomUUID } from 'node:crypto';
import type { InferEntity } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { ligandCatalogue } from '@/lib/chem/ligands';
import type { CreateLigandInput, LibraryLigand as LibraryLigandDto } from '@/lib/schemas/library';
import { AppError } from '@/server/http/errors';
import { LibraryLigand } from './ligand.entity';

/**
 * The ligand catalogue a group sees: the reference ligands of data/ligands.json (read-only, the
 * engine parses formulas with these) plus the group's own additions (curators). Additions are
 * catalogue records for the group's notes and filters; the formula parser does not learn them.
 */
export function referenceLigands(): LibraryLigandDto[] {
  return ligandCatalogue.map((ligand) => ({
    id: ligand.id,
    name: ligand.name,
    abbreviation: ligand.id,
    charge: ligand.charge,
    denticity: ligand.denticity,
    donorAtoms: [...ligand.donorAtoms],
    origin: 'reference' as const,
    groupId: null,
    source: ligand.source,
  }));
}

function toDto(row: InferEntity<typeof LibraryLigand>): LibraryLigandDto {
  return {
    id: row.id,
    name: row.name,
    abbreviation: row.abbreviation,
    charge: row.charge,
    denticity: row.denticity,
    donorAtoms: row.donorAtoms,
    origin: 'group',
    groupId: row.groupId,
    source: row.source,
  };
}

export async function listLigands(em: EntityManager, groupId: string | null): Promise<LibraryLigandDto[]> {
  const own = groupId ? await em.find(LibraryLigand, { groupId }, { orderBy: { abbreviation: 'asc' } }) : [];
  return [...referenceLigands(), ...own.map(toDto)];
}

export async function addLigand(em: EntityManager, groupId: string, actorId: string, input: CreateLigandInput): Promise<LibraryLigandDto> {
  const taken = (id: string) => id.toLowerCase() === input.abbreviation.toLowerCase();
  const reference = ligandCatalogue.find((l) => taken(l.id) || l.aliases.some(taken));
  if (reference) {
    throw new AppError('CONFLICT', `"${input.abbreviation}" is already in the reference catalogue (${reference.name}).`);
  }
  const rows = await em.execute<{ id: string }[]>(
    `insert into library_ligand (id, group_id, abbreviation, name, charge, denticity, donor_atoms, source, created_by_id, created_at)
     values (?, ?, ?, ?, ?, ?, ?::jsonb, ?, ?, now())
     on conflict (group_id, lower(abbreviation)) do nothing returning id`,
    [randomUUID(), groupId, input.abbreviation, input.name, input.charge, input.denticity, JSON.stringify(input.donorAtoms), input.source, actorId],
  );
  const id = rows[0]?.id;
  if (!id) throw new AppError('CONFLICT', `This group's catalogue already has a ligand "${input.abbreviation}".`);
  return toDto(await em.findOneOrFail(LibraryLigand, { id }));
}
