export const MEMBER_ROLES = ['owner', 'manager', 'technician'] as const;
export type MemberRole = (typeof MEMBER_ROLES)[number];

/** Who a signed-in person is to Lifeplate: a member of a company, or a homeowner of some of its customers. */
export type Principal =
  | { kind: 'member'; userId: string; companyId: string; role: MemberRole }
  | { kind: 'homeowner'; userId: string; companyId: string; customerIds: string[] };

export const ROLE_LABELS: Record<MemberRole, string> = {
  owner: 'Owner',
  manager: 'Service manager',
  technician: 'Technician',
};
