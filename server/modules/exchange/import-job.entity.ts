import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { CsvColumn, ImportCreatedEntry, ImportDuplicate, ImportIssue, ImportState } from '@/lib/schemas/exchange';

/**
 * A CSV import (or dry run) and its progress. Kept in PostgreSQL so every server process can answer
 * the client's poll; `heartbeat_at` moves while a process works on it, so a job whose process died
 * is recognised as abandoned (see import.service.ts).
 */
export const ImportJob = defineEntity({
  name: 'ImportJob',
  tableName: 'import_job',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    groupId: p.uuid(),
    createdById: p.uuid().nullable(),
    fileName: p.string().length(200).nullable(),
    dryRun: p.boolean(),
    state: p.string().length(20).$type<ImportState>(),
    processed: p.integer(),
    total: p.integer(),
    columns: p.json<{ header: string; column: CsvColumn | null }[]>(),
    errorCount: p.integer(),
    errors: p.json<ImportIssue[]>(),
    entryCount: p.integer(),
    measurementCount: p.integer(),
    complexIds: p.json<string[]>(),
    created: p.json<ImportCreatedEntry[]>().onCreate(() => []),
    suggestedNames: p.json<{ row: number; name: string }[]>().onCreate(() => []),
    duplicates: p.json<ImportDuplicate[]>().onCreate(() => []),
    message: p.text().nullable(),
    heartbeatAt: p.datetime(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
    finishedAt: p.datetime().nullable(),
  },
});
