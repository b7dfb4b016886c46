/** One line of the benchmark table: what was measured, the figure, the target it is held to, and whether it met it. */
export interface BenchRow {
  group: string;
  name: string;
  value: string;
  target: string;
  ok: boolean;
}
