/** Small dense linear algebra for the maximiser (row-major n×n Float64Array). */

/** Cholesky factor L (lower, row-major) of a symmetric matrix, or null if not positive definite. */
export function cholesky(A: ArrayLike<number>, n: number): Float64Array | null {
  const L = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = A[i * n + j] as number;
      for (let k = 0; k < j; k++) s -= (L[i * n + k] as number) * (L[j * n + k] as number);
      if (i === j) {
        if (!(s > 0) || !Number.isFinite(s)) return null;
        L[i * n + i] = Math.sqrt(s);
      } else L[i * n + j] = s / (L[j * n + j] as number);
    }
  }
  return L;
}

/** Solve (L Lᵀ) x = b given the Cholesky factor. */
export function choleskySolve(L: Float64Array, n: number, b: ArrayLike<number>): Float64Array {
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[i] as number;
    for (let k = 0; k < i; k++) s -= (L[i * n + k] as number) * (y[k] as number);
    y[i] = s / (L[i * n + i] as number);
  }
  const x = new Float64Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i] as number;
    for (let k = i + 1; k < n; k++) s -= (L[k * n + i] as number) * (x[k] as number);
    x[i] = s / (L[i * n + i] as number);
  }
  return x;
}

/** Inverse of a symmetric positive-definite matrix, or null when it is not positive definite. */
export function inverseSpd(A: ArrayLike<number>, n: number): Float64Array | null {
  const L = cholesky(A, n);
  if (!L) return null;
  const inv = new Float64Array(n * n);
  const e = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    e.fill(0);
    e[j] = 1;
    const col = choleskySolve(L, n, e);
    for (let i = 0; i < n; i++) inv[i * n + j] = col[i] as number;
  }
  return inv;
}
