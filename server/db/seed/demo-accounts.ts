import type { MemberRole } from '../../../shared/schemas/roles';

export const DEMO_PASSWORD = 'lifeplate-demo';

export const DEMO_COMPANY = { name: 'Wrenfield Steam & Hydronic Service', phone: '555-0142', timeZone: 'America/New_York' };
export const OTHER_COMPANY = { name: 'Ashby Hollow Heating', phone: '555-0177', timeZone: 'America/Chicago' };

export const DEMO_MEMBERS: { email: string; name: string; role: MemberRole; company: 'demo' | 'other' }[] = [
  { email: 'owner@demo.test', name: 'Rosalind Quarry', role: 'owner', company: 'demo' },
  { email: 'manager@demo.test', name: 'Desmond Hale', role: 'manager', company: 'demo' },
  { email: 'tech@demo.test', name: 'Marta Vell', role: 'technician', company: 'demo' },
  { email: 'tech2@demo.test', name: 'Owen Brackett', role: 'technician', company: 'demo' },
  { email: 'other-manager@demo.test', name: 'Ines Corbel', role: 'manager', company: 'other' },
];

export const DEMO_HOMEOWNER = { email: 'homeowner@demo.test', name: 'Agnes Pell' };
