/**
 * The product's cautions, written out here and nowhere else on the server. The footer of every report page, the CSV
 * exports, the command line and the start-up banner print the paragraph word for word; the cover lists it as the four
 * sentences the client shows (src/app/core/cautions.ts). report-cautions.spec.ts keeps them in step.
 */
export const REPORT_CAUTIONS_TEXT =
  "Results depend on the imported forces, the model's section data and the chosen parameters. They are a checking aid " +
  'for qualified engineers, not a design. Follow the governing local building code, its national annex and the engineer ' +
  'of record; verify connections, coped ends, concentrated loads, fatigue and combined actions separately.';

export const REPORT_CAUTIONS: readonly string[] = [
  "Results depend on the imported forces, the model's section data and the chosen parameters.",
  'They are a checking aid for qualified engineers, not a design.',
  'Follow the governing local building code, its national annex and the engineer of record.',
  'Verify connections, coped ends, concentrated loads, fatigue and combined actions separately.',
];
