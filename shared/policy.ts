import type { MemberRole, Principal } from './schemas/roles';

/** The role table from the product brief, in one place, used by the server (enforcing) and the client (hiding). */
export const PERMISSIONS = {
  'records:read': ['owner', 'manager', 'technician'],
  'records:write': ['owner', 'manager', 'technician'],
  'visits:record': ['owner', 'manager', 'technician'],
  'visits:amend-any': ['owner', 'manager'],
  'visits:amend-own': ['owner', 'manager', 'technician'],
  // The history of changes (who changed a record or a visit, what and why) is the office's to read.
  'records:history': ['owner', 'manager'],
  'catalog:manage': ['owner', 'manager'],
  'share:create': ['owner', 'manager', 'technician'],
  'share:revoke': ['owner', 'manager'],
  'reminders:send': ['owner', 'manager'],
  'team:manage': ['owner', 'manager'],
  'company:settings': ['owner'],
  // Bringing a whole customer list in at once is an office task.
  'records:import': ['owner', 'manager'],
  // Sending a life record to another company, or taking one in, is the office's decision, made with the homeowner.
  'records:transfer': ['owner', 'manager'],
  // Every round is visible to the whole team; technicians may book follow-ups for themselves only (the service checks).
  'bookings:read': ['owner', 'manager', 'technician'],
  'bookings:book': ['owner', 'manager', 'technician'],
  'bookings:manage': ['owner', 'manager'],
  // Planning the week (the week board's unbooked queue) is the office's work; technicians see their own round.
  'bookings:plan': ['owner', 'manager'],
  // The development outbox holds other people's sign-in and invitation links: whoever opens one is signed in as them.
  'dev:outbox': ['owner'],
} as const satisfies Record<string, readonly MemberRole[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(principal: Principal | null | undefined, permission: Permission): boolean {
  if (!principal || principal.kind !== 'member') return false;
  return (PERMISSIONS[permission] as readonly MemberRole[]).includes(principal.role);
}

/** Owners manage everyone; managers manage technicians and managers, never owners. */
export function canManageMemberRole(actor: Principal, targetRole: MemberRole, newRole?: MemberRole): boolean {
  if (actor.kind !== 'member') return false;
  if (actor.role === 'owner') return true;
  if (actor.role !== 'manager') return false;
  return targetRole !== 'owner' && (newRole === undefined || newRole !== 'owner');
}
