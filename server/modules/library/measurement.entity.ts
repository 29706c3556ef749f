import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { MeasurementKind, MeasurementUnit } from '@/lib/schemas/library';
import { Citation } from './citation.entity';
import { Complex } from './complex.entity';

/**
 * One measured value of a complex, with its conditions and (usually) its citation. Part of the
 * entry's aggregate: written through `Complex.measurements` (cascade persist, orphan removal).
 */
export const Measurement = defineEntity({
  name: 'Measurement',
  tableName: 'measurement',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    complex: () => p.manyToOne(Complex),
    kind: p.string().length(30).$type<MeasurementKind>(),
    value: p.double().$type<number>(),
    unit: p.string().length(20).$type<MeasurementUnit>(),
    temperatureK: p.double().$type<number>().nullable(),
    ionicStrengthM: p.double().$type<number>().nullable(),
    medium: p.string().length(200).nullable(),
    method: p.string().length(200).nullable(),
    partnerFormula: p.string().length(300).nullable(),
    citation: () => p.manyToOne(Citation).nullable(),
    notes: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
  },
});
