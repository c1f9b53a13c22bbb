import type { Access } from '../../../server/lib/route';
import { PERMISSIONS } from '../../../shared/policy';
import type { MemberRole } from '../../../shared/schemas/roles';
import type { CallerId, RouteCase } from './cases';

type Role = MemberRole | 'homeowner' | null;

export const ROLE_OF: Record<CallerId, Role> = {
  signedOut: null,
  linkHolder: null,
  owner: 'owner',
  manager: 'manager',
  technician: 'technician',
  homeowner: 'homeowner',
  otherManager: 'manager',
  otherHomeowner: 'homeowner',
};
export const isCross = (caller: CallerId) => caller === 'otherManager' || caller === 'otherHomeowner';

/** Which callers a route's cells cover: everyone, plus link holders where a link is the key and other homeowners where homeowners get in. */
export function callersFor(route: { path: string; access: Access }): CallerId[] {
  const callers: CallerId[] = ['signedOut', 'owner', 'manager', 'technician', 'homeowner', 'otherManager'];
  if (route.path.includes(':token')) callers.push('linkHolder');
  if (route.access === 'homeowner' || route.access === 'signed-in') callers.push('otherHomeowner');
  return callers;
}

/** The route's guard alone, from its access and the role table in shared/policy.ts. */
function guardAnswer(access: Access, role: Role): 401 | 403 | 'through' {
  if (access === 'public') return 'through';
  if (role === null) return 401;
  if (access === 'signed-in') return 'through';
  if (access === 'homeowner') return role === 'homeowner' ? 'through' : 403;
  if (role === 'homeowner') return 403;
  return (PERMISSIONS[access.permission] as readonly MemberRole[]).includes(role) ? 'through' : 403;
}

export function expectedStatus(route: { path: string; access: Access }, spec: RouteCase, caller: CallerId): number {
  const guard = guardAnswer(route.access, ROLE_OF[caller]);
  if (guard !== 'through') return guard;
  const exception = spec.as?.[caller];
  if (exception !== undefined) return exception;
  if (isCross(caller)) return spec.crossTenant ?? (route.path.includes(':') ? 404 : spec.status);
  return spec.status;
}
