// PLACEHOLDER until scripts/simulate-ad-tables.ts has been run: shape 1 from memory (D'Agostino &
// Stephens 1986 Table 4.21), shapes 2 and 5 from a simulation quoted in references.md, normal limit
// from Table 4.7 (25% point from the Table 4.9 formula).
export const GAMMA_AD_TABLE = {
  generatedBy: 'placeholder',
  seed: 0,
  replicates: 0,
  n: 0,
  alphas: [0.25, 0.1, 0.05, 0.025, 0.01],
  rows: [
    { shape: 1, values: [0.486, 0.657, 0.786, 0.917, 1.092] },
    { shape: 2, values: [0.478, 0.643, 0.766, 0.889, 1.051] },
    { shape: 5, values: [0.471, 0.632, 0.755, 0.874, 1.034] },
    { shape: Infinity, values: [0.468, 0.631, 0.752, 0.873, 1.035] },
  ],
} as const;
