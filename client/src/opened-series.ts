/**
 * A series handed over by the many-series page (client/batch.html): its name and values as CSV text
 * in sessionStorage under one key, taken once (removed as it is read) so a reload starts afresh.
 */
export const OPENED_SERIES_KEY = 'plumbline.openSeries';

export interface OpenedSeries {
  readonly name: string;
  readonly csv: string;
}

export function takeOpenedSeries(storage: Pick<Storage, 'getItem' | 'removeItem'> = sessionStorage): OpenedSeries | null {
  let text: string | null;
  try {
    text = storage.getItem(OPENED_SERIES_KEY);
    storage.removeItem(OPENED_SERIES_KEY);
  } catch {
    return null; // storage unavailable (private mode, blocked): nothing was handed over
  }
  if (text === null) return null;
  try {
    const v = JSON.parse(text) as Partial<OpenedSeries>;
    return typeof v.name === 'string' && typeof v.csv === 'string' && v.csv.length > 0 ? { name: v.name, csv: v.csv } : null;
  } catch {
    return null;
  }
}
