/** Options common to every evidence chart. */
export interface ChartOptions {
  /** Drawing size in px (the SVG also gets a viewBox, so it scales with its box). */
  readonly width: number;
  readonly height: number;
  /** Units of the measured values, shown on every axis in data units ('' for none). */
  readonly units: string;
  /** What was measured, e.g. "Life" or "Diameter"; defaults to "Value". */
  readonly quantity?: string;
}

export const DEFAULT_OPTIONS: ChartOptions = { width: 640, height: 400, units: '' };
