/**
 * Typed errors raised at the core's boundaries. Every error carries a machine-readable `code`
 * and, where it concerns input data, the place it happened (1-based row as the user counts rows
 * in the file, column name, the offending text), so the CLI, the API and the page can all say
 * what went wrong and where without guessing.
 */
export type ErrorCode =
  | 'bad-parameter'
  | 'bad-input'
  | 'bad-option'
  | 'csv-parse'
  | 'not-a-number'
  | 'too-few-values'
  /** Fewer than 2 failures and no assumed Weibull shape: the zero-failure analysis needs one (HTTP 422). */
  | 'needs-assumed-shape'
  | 'no-column'
  | 'bins-too-many'
  | 'not-computable'
  | 'cancelled';

export interface ErrorPlace {
  /** 1-based line number in the source file (the header is line 1). */
  readonly row?: number;
  /** Column header (or `#3` for a 1-based index when there is no header). */
  readonly column?: string;
  /** The offending text or value, as it appeared. */
  readonly value?: string;
}

export class PlumblineError extends Error {
  readonly code: ErrorCode;
  readonly place: ErrorPlace;
  constructor(code: ErrorCode, message: string, place: ErrorPlace = {}) {
    super(message);
    this.name = 'PlumblineError';
    this.code = code;
    this.place = place;
  }
}

/** A family's parameters are outside their bounds (or not finite). */
export class ParameterError extends PlumblineError {
  constructor(family: string, parameter: string, value: number, requirement: string) {
    super('bad-parameter', `${family}: parameter ${parameter} = ${String(value)} is invalid (${requirement}).`, {
      value: String(value),
    });
    this.name = 'ParameterError';
  }
}

/** Data or option supplied by the user is unusable. */
export class InputError extends PlumblineError {
  constructor(message: string, place: ErrorPlace = {}, code: ErrorCode = 'bad-input') {
    super(code, message, place);
    this.name = 'InputError';
  }
}

export function isPlumblineError(e: unknown): e is PlumblineError {
  return e instanceof PlumblineError;
}
