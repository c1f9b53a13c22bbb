import { formatBtuh as formatHeatRate } from '@shared/format/quantities';

const number = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
export const formatEdr = (sqFt: number) => `${number.format(sqFt)} sq ft`;
export const formatBtuh = (btuh: number | null) => (btuh === null ? 'not on record' : formatHeatRate(btuh));
