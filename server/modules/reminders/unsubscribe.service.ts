import type { AppContext } from '../../context';
import { notFound } from '../../lib/http-error';
import type { UnsubscribeStatusDto } from '../../../shared/schemas/reminders';
import { remindersRepository as repo } from './reminders.repository';
import { verifyUnsubscribeToken } from './unsubscribe-token';

/** A bad token, or one for a customer who no longer exists, answers the same 404: nothing about anyone leaks. */
async function customerFor(ctx: AppContext, token: string) {
  const customerId = verifyUnsubscribeToken(ctx.config.BETTER_AUTH_SECRET, token);
  const customer = customerId ? await repo.customerForUnsubscribe(ctx.db, customerId) : null;
  if (!customer) throw notFound('Link');
  return customer;
}

export function unsubscribeService(ctx: AppContext) {
  return {
    async status(token: string): Promise<UnsubscribeStatusDto> {
      const c = await customerFor(ctx, token);
      return { companyName: c.companyName, companyPhone: c.companyPhone, optedOut: c.optedOut };
    },
    async optOut(token: string): Promise<UnsubscribeStatusDto> {
      const c = await customerFor(ctx, token);
      if (!c.optedOut) await ctx.db.transaction((tx) => repo.optOut(tx, c.companyId, c.customerId));
      return { companyName: c.companyName, companyPhone: c.companyPhone, optedOut: true };
    },
  };
}
