// The cautions from the product brief, shown in the app frame and on every project overview.
// Reports written by the server carry the same words.

export const CAUTION_SUMMARY =
  'A checking aid for qualified engineers, not a design. Defer to the governing local code and the engineer of record.';

export const CAUTIONS: readonly string[] = [
  "Results depend on the imported forces, the model's section data and the chosen parameters.",
  'They are a checking aid for qualified engineers, not a design.',
  'Follow the governing local building code, its national annex and the engineer of record.',
  'Verify connections, coped ends, concentrated loads, fatigue and combined actions separately.',
];
