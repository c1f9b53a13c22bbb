import { Card } from '@/components/ui/card';
import { Spinner } from '@/components/ui/page';
import type { DueStockRow } from '@shared/schemas/due';
import { formatCalendarDate } from '@shared/format/dates';
import { useDueStock } from '../api/get-due-stock';

function StockList({ rows, empty }: { rows: DueStockRow[]; empty: string }) {
  if (!rows.length) return <p className="text-iron-muted">{empty}</p>;
  return (
    <ul className="tabular flex flex-col gap-1">
      {rows.map((r) => (
        <li key={`${r.typeCode}|${r.specKey}`} className="flex justify-between gap-3 border-b border-plate-line py-1">
          <span>
            {r.typeLabel}
            {r.specKey ? `, ${r.specKey}` : ''}
          </span>
          <span className="font-bold">{r.count} ×</span>
        </li>
      ))}
    </ul>
  );
}

/** The due parts grouped by specification: what to have on the van or order in. */
export function StockForecast({ withinDays }: { withinDays: number }) {
  const stock = useDueStock(withinDays);
  if (stock.isPending) return <Spinner />;
  if (!stock.data) return null;
  return (
    <Card title={`Stock forecast through ${formatCalendarDate(stock.data.through)}`}>
      <div className="grid gap-4 md:grid-cols-3">
        <div>
          <h3 className="mb-1 font-semibold">Parts to replace</h3>
          <StockList rows={stock.data.replacements} empty="No replacements fall due in this window." />
        </div>
        <div>
          <h3 className="mb-1 font-semibold">Inspections</h3>
          <StockList rows={stock.data.inspections} empty="No inspections fall due in this window." />
        </div>
        <div>
          <h3 className="mb-1 font-semibold">Past median life: plan for these</h3>
          <p className="mb-1 text-sm text-iron-muted">
            Working parts that reach their typical life in this window. Age alone is not a fault: inspect them and plan the stock; replace on condition.
          </p>
          <StockList rows={stock.data.pastMedianLife} empty="No working part reaches its median life in this window." />
          <p className="mt-1 text-xs text-iron-muted">Source: {stock.data.pastMedianLifeSource}</p>
        </div>
      </div>
    </Card>
  );
}
