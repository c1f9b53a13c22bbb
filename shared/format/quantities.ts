import { COMPANY_LOCALE } from './dates';

const whole = new Intl.NumberFormat(COMPANY_LOCALE, { maximumFractionDigits: 0 });

/** "175,000 Btu/h": a heat rate to the whole Btu/h, in the company's locale, on every screen. */
export const formatBtuh = (btuh: number) => `${whole.format(Math.round(btuh))} Btu/h`;
