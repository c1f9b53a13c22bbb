import type { AppContext } from '../../context';
import type { SearchHit } from '../../../shared/schemas/records';
import { applianceLabel } from '../appliances';
import { searchAppliances } from './search.repository';

export function searchService(ctx: AppContext) {
  return {
    async search(companyId: string, text: string): Promise<SearchHit[]> {
      const rows = await searchAppliances(ctx.db, companyId, text);
      return rows.map((r) => ({
        applianceId: r.appliance_id,
        applianceLabel: applianceLabel(r) + (r.status === 'removed' ? ' (removed)' : ''),
        customerName: r.customer_name,
        street: r.street,
        town: r.town,
        serial: r.serial,
        matched: r.matched,
      }));
    },
  };
}
