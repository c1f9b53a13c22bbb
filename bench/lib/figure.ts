/** One row of the benchmark table: a measured figure beside its target. */
export interface BenchFigure {
  figure: string;
  load: string;
  /** null when the figure could not be measured (the note says why). */
  value: number | null;
  unit: string;
  target: string;
  /** null when the figure is only reported, without a target to meet. */
  met: boolean | null;
  note?: string;
}
