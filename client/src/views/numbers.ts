/** Small wording helpers shared by the section views (display only; numbers come from the report). */
import { sig } from '../format.js';

export const pct = (c: number): string => `${sig(100 * c, 3)} %`;
export const end = (v: number | null | undefined, open: string): string => (v === null || v === undefined ? open : sig(v));
export const withU = (v: string, u: string): string => (u ? `${v} ${u}` : v);
