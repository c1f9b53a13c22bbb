export type TradeFlagSeverity = 'info' | 'warning' | 'stop';

/** A finding with the number that triggered it, the limit it was compared with, and where that limit comes from. */
export type TradeFlag = {
  code: string;
  severity: TradeFlagSeverity;
  message: string;
  value: number | null;
  threshold: number | null;
  unit: string | null;
  source: string;
};
