/**
 * Maps between a parameter's natural range and the whole real line, so that the maximiser can
 * search an unconstrained space: log for a positive parameter, log(a - x) for one below a bound,
 * logit for an interval. Callers choose one transform per parameter.
 */
export interface Transform {
  /** Natural value → unconstrained value. */
  toFree(theta: number): number;
  /** Unconstrained value → natural value. */
  fromFree(z: number): number;
  readonly name: string;
}

export const IDENTITY: Transform = Object.freeze({
  name: 'identity',
  toFree: (t: number) => t,
  fromFree: (z: number) => z,
});

/**
 * For a location-like parameter: z = (θ - center)/spread, with `spread` the data's own scale (e.g.
 * a fitted scale parameter). The free coordinate then has typical size 1 whatever the units, so the
 * maximiser's steps, numerical derivatives and stopping tests (all relative to max(|z|, 1)) are
 * scale-free (the "typical size" scaling of Dennis & Schnabel 1983, Numerical Methods for
 * Unconstrained Optimization, §7.1 [from memory]).
 */
export function affine(center: number, spread: number): Transform {
  if (!(spread > 0 && Number.isFinite(spread)) || !Number.isFinite(center)) throw new RangeError(`affine: need a finite center and a positive finite spread, got ${center}, ${spread}`);
  return {
    name: `(θ - ${center})/${spread}`,
    toFree: (t: number) => (t - center) / spread,
    fromFree: (z: number) => center + z * spread,
  };
}

/** For a parameter > 0: z = ln θ. */
export const LOG: Transform = Object.freeze({
  name: 'log',
  toFree: (t: number) => Math.log(t),
  fromFree: (z: number) => Math.exp(z),
});

/** For a parameter > a: z = ln(θ - a). */
export function above(a: number): Transform {
  return {
    name: `log(θ - ${a})`,
    toFree: (t: number) => Math.log(t - a),
    fromFree: (z: number) => a + Math.exp(z),
  };
}

/** For a parameter < b: z = ln(b - θ). */
export function below(b: number): Transform {
  return {
    name: `log(${b} - θ)`,
    toFree: (t: number) => Math.log(b - t),
    fromFree: (z: number) => b - Math.exp(z),
  };
}

/** For a parameter in (a, b): z = logit((θ - a)/(b - a)). */
export function between(a: number, b: number): Transform {
  const w = b - a;
  return {
    name: `logit on (${a}, ${b})`,
    toFree: (t: number) => {
      const u = (t - a) / w;
      return Math.log(u) - Math.log1p(-u);
    },
    fromFree: (z: number) => (z >= 0 ? a + w / (1 + Math.exp(-z)) : a + (w * Math.exp(z)) / (1 + Math.exp(z))),
  };
}

export function toFreeVector(theta: ArrayLike<number>, tr: readonly Transform[] | undefined): Float64Array {
  const z = new Float64Array(theta.length);
  for (let i = 0; i < theta.length; i++) z[i] = tr?.[i] ? tr[i]!.toFree(theta[i] as number) : (theta[i] as number);
  return z;
}

export function fromFreeVector(z: ArrayLike<number>, tr: readonly Transform[] | undefined): Float64Array {
  const t = new Float64Array(z.length);
  for (let i = 0; i < z.length; i++) t[i] = tr?.[i] ? tr[i]!.fromFree(z[i] as number) : (z[i] as number);
  return t;
}
