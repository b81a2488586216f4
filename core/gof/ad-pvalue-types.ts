/** What a p-value method for the Anderson–Darling statistic returns. */
export interface AdPValue {
  /** The p-value, or the bound when `pValueIs` is a bound. */
  readonly pValue: number;
  readonly pValueIs: 'estimate' | 'upper-bound' | 'lower-bound';
  /** The case-modified statistic the table is entered with (A*), when the case has one. */
  readonly modifiedStatistic?: number;
  /** The A² the table is entered with when it differs from the reported A² at the MLE. */
  readonly tableStatistic?: number;
  /** Method and published source, in words. */
  readonly methodDetail: string;
}
