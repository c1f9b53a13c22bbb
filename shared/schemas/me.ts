import type { Principal } from './roles';

export type MeDto = {
  user: { id: string; name: string; email: string };
  principal: Principal | null;
  company: { id: string; name: string; phone: string; timeZone: string; underFiringTolerancePct: number | null } | null;
};
