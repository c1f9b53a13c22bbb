import type { Principal } from '@shared/schemas/roles';
import { can, type Permission } from '@shared/policy';
import { RECORD_WORDS } from '@shared/glossary';

type NavItem = { to: string; label: string; permission?: Permission; homeowner?: boolean };

const ITEMS: NavItem[] = [
  { to: '/', label: 'Find' },
  { to: '/round', label: 'Round', permission: 'bookings:read' },
  { to: '/week', label: 'Week board', permission: 'bookings:plan' },
  { to: '/scan', label: 'Scan tag', permission: 'records:read' },
  { to: '/service-requests', label: 'Service requests', permission: 'records:read' },
  { to: '/due', label: 'Due list', permission: 'catalog:manage' },
  { to: '/customers', label: 'Customers', permission: 'records:read' },
  { to: '/catalog', label: RECORD_WORDS.catalogPage, permission: 'catalog:manage' },
  { to: '/tags', label: 'Tags', permission: 'catalog:manage' },
  { to: '/imports', label: 'Bring records in', permission: 'records:import' },
  { to: '/receive', label: 'Receive a record', permission: 'records:transfer' },
  { to: '/team', label: 'Team', permission: 'records:read' },
  { to: '/settings', label: 'Company', permission: 'company:settings' },
];

export function navFor(principal: Principal | null | undefined): NavItem[] {
  if (!principal) return [];
  if (principal.kind === 'homeowner') return [{ to: '/', label: 'My boilers' }];
  return ITEMS.filter((i) => !i.permission || can(principal, i.permission));
}
