import {
  complexDetailSchema,
  complexListItemSchema,
  complexListResponseSchema,
  type ComplexDetail,
  type ComplexListItem,
} from '@/lib/schemas/library';
import { xuKrouseSwaddle1985 } from '@/tests/factories/library';

/**
 * Library answers as the server sends them, built through the shared schemas so they cannot drift
 * from the contract. People and the lab are the invented Larkspur demo; the measured value is
 * [Cr(H2O)6]3+ water exchange, 2.4e-6 s-1 at 298 K (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
 */

const T0 = '2026-01-05T10:00:00.000Z';
export const GROUP_ID = '6f0c5a52-7d55-4b6a-9a3e-2b1f3c4d5e60';

export const contributorMe = {
  user: { id: 'u-student', email: 'student@larkspur.example.org', displayName: 'Ada Fenwick' },
  memberships: [{ groupId: GROUP_ID, groupName: 'Larkspur Coordination Lab', role: 'contributor' }],
};
export const curatorMe = {
  user: { id: 'u-curator', email: 'curator@larkspur.example.org', displayName: 'Milo Reed' },
  memberships: [{ groupId: GROUP_ID, groupName: 'Larkspur Coordination Lab', role: 'curator' }],
};
export const viewerMe = {
  user: { id: 'u-viewer', email: 'visitor@larkspur.example.org', displayName: 'Noor Vale' },
  memberships: [{ groupId: GROUP_ID, groupName: 'Larkspur Coordination Lab', role: 'viewer' }],
};

export function listItem(overrides: Partial<ComplexListItem> = {}): ComplexListItem {
  return complexListItemSchema.parse({
    id: 'c-cr-aqua',
    groupId: GROUP_ID,
    formula: '[Cr(H2O)6]3+',
    name: 'hexaaquachromium(III)',
    status: 'accepted',
    version: 4,
    metal: 'Cr',
    oxidationState: 3,
    dElectrons: 3,
    spinState: null,
    verdict: 'inert',
    ligandIds: ['H2O'],
    measurementCount: 1,
    measurementKinds: ['water-exchange'],
    hasCitation: true,
    hasPendingRevision: false,
    rank: null,
    createdBy: { id: 'u-student', displayName: 'Ada Fenwick' },
    updatedAt: T0,
    ...overrides,
  });
}

export function listResponse(items: ComplexListItem[], total = items.length, page = 1, pageSize = 20, totalIsLowerBound = false) {
  return complexListResponseSchema.parse({ items, total, totalIsLowerBound, page, pageSize });
}

export function detail(overrides: Partial<ComplexDetail> = {}): ComplexDetail {
  return complexDetailSchema.parse({
    id: 'c-cr-aqua',
    groupId: GROUP_ID,
    formula: '[Cr(H2O)6]3+',
    name: 'hexaaquachromium(III)',
    notes: null,
    status: 'draft',
    metal: 'Cr',
    oxidationState: 3,
    dElectrons: 3,
    spinState: null,
    verdict: 'inert',
    ligandIds: ['H2O'],
    measurements: [
      {
        id: 'm-1',
        kind: 'water-exchange',
        value: 2.4e-6,
        unit: 's-1',
        temperatureK: 298.15,
        ionicStrengthM: null,
        medium: 'aqueous HClO4',
        method: '17O NMR',
        partnerFormula: null,
        citation: { id: 'cit-1', groupId: GROUP_ID, doi: null, ...xuKrouseSwaddle1985, title: xuKrouseSwaddle1985.title ?? null, year: 1985, volume: '24', pages: '267-270' },
        notes: null,
        createdAt: T0,
        updatedAt: T0,
      },
    ],
    version: 3,
    view: 'working',
    hasPendingRevision: false,
    accepted: null,
    acceptedAt: null,
    createdBy: { id: 'u-student', displayName: 'Ada Fenwick' },
    submittedBy: null,
    submittedAt: null,
    createdAt: T0,
    updatedAt: T0,
    myRole: 'contributor',
    permissions: { canEdit: true, canSubmit: true, canReview: false, canRetire: false },
    latestReview: null,
    ...overrides,
  });
}
