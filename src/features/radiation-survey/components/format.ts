const number = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
export const formatEdr = (sqFt: number) => `${number.format(sqFt)} sq ft`;
export const formatBtuh = (btuh: number | null) => (btuh === null ? 'not on record' : `${number.format(Math.round(btuh))} Btu/h`);
