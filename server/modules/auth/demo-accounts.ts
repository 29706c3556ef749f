import type { Role } from '@/lib/schemas/groups';

/**
 * The invented people of the demo (PRODUCT.md): the Larkspur Coordination Lab at the fictional
 * North Fen Institute, and a second invented group to show that groups are kept apart.
 * Demo only: every account has the password below, which sign-up would refuse.
 */
export const DEMO_PASSWORD = 'sphereline-demo';

export interface DemoAccount {
  email: string;
  displayName: string;
  group: 'larkspur' | 'fenwick';
  role: Role;
  /** Who this person is in the story. */
  part: string;
}

export const DEMO_GROUPS = {
  larkspur: 'Larkspur Coordination Lab (North Fen Institute)',
  fenwick: 'Fenwick Photoredox Group',
} as const;

export const demoAccounts: DemoAccount[] = [
  { email: 'admin@larkspur.example.org', displayName: 'Dr. Imogen Larkspur', group: 'larkspur', role: 'admin', part: 'PI' },
  { email: 'curator@larkspur.example.org', displayName: 'Tobias Wrenfield', group: 'larkspur', role: 'curator', part: 'lab manager' },
  { email: 'contributor@larkspur.example.org', displayName: 'Priya Ashcombe', group: 'larkspur', role: 'contributor', part: 'PhD student' },
  { email: 'contributor2@larkspur.example.org', displayName: 'Mateo Brackenridge', group: 'larkspur', role: 'contributor', part: 'MSc student' },
  { email: 'viewer@larkspur.example.org', displayName: 'Dr. Signe Halloway', group: 'larkspur', role: 'viewer', part: 'visiting collaborator' },
  { email: 'fenwick-admin@fenwick.example.org', displayName: 'Dr. Rowan Fenwick', group: 'fenwick', role: 'admin', part: 'PI of another group' },
];
