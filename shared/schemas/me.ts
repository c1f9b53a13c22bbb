import type { Principal } from './roles';

export type MeDto = {
  user: { id: string; name: string; email: string };
  principal: Principal | null;
  company: { id: string; name: string; phone: string; timeZone: string; underFiringTolerancePct: number | null } | null;
  /** True only beside the local SMTP fake (development and tests): the office may open the outbox page. */
  devOutbox: boolean;
};
