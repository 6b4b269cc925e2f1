/**
 * The parameters of a check run, one schema per standard, each field defaulting to the recommended value so that
 * `{standard}` alone is a valid run. National annexes and project specifications differ: the engineer of record sets
 * these, and the run stores them as given.
 */
import { z } from 'zod';
import { GRADE_IDS } from '../engine/grades';

const fabrication = z.enum(['rolled', 'welded']);

const shared = {
  /** Utilisation from which a passing member is marked for attention. */
  warningRatio: z.number().gt(0).max(1).default(0.9),
  /** Clear spacing of transverse web stiffeners; null = unstiffened webs. */
  stiffenerSpacing_mm: z.number().positive().nullable().default(null),
  /** Fabrication by profile name ('IPE 300' and 'IPE300' are the same profile), overriding what the model says. */
  fabricationOverrides: z.record(z.string().trim().min(1).max(200), fabrication).default({}),
};

/** Grade for members whose material names no grade: S355 and A992 are the usual grades for rolled sections (common practice, no source). */
const enGrade = z.enum(GRADE_IDS).default('S355');
const usGrade = z.enum(GRADE_IDS).default('A992');

export const checkParametersSchema = z.discriminatedUnion('standard', [
  z.strictObject({
    standard: z.literal('en1993-1-1'),
    ...shared,
    defaultGrade: enGrade,
    /** EN 1993-1-1 §6.1 NOTE 2B recommends γM0 = γM1 = 1.00. */
    gammaM0: z.number().min(1).max(1.5).default(1),
    gammaM1: z.number().min(1).max(1.5).default(1),
    /** EN 1993-1-5 §5.1 NOTE 2: null = the recommended 1.20 up to S460 and 1.00 above. */
    eta: z.number().min(1).max(1.2).nullable().default(null),
    /** How fy follows thickness: the product standard's bands or EN 1993-1-1 Table 3.1. */
    yieldRule: z.enum(['en10025-2', 'en1993-1-1-table-3.1']).default('en10025-2'),
    /** EN 1993-1-5 Table 5.1 column. */
    endPost: z.enum(['non-rigid', 'rigid']).default('non-rigid'),
  }),
  z.strictObject({
    standard: z.literal('aisc360-22-lrfd'),
    ...shared,
    defaultGrade: usGrade,
    /** null = φv by AISC 360-22 §G1/§G2.1 (1.00 or 0.90). */
    phiV: z.number().gt(0).max(1).nullable().default(null),
  }),
  z.strictObject({
    standard: z.literal('aisc360-22-asd'),
    ...shared,
    defaultGrade: usGrade,
    /** null = Ωv by AISC 360-22 §G1/§G2.1 (1.50 or 1.67). */
    omegaV: z.number().min(1).max(3).nullable().default(null),
  }),
]);

export type CheckParameters = z.output<typeof checkParametersSchema>;
export type CheckParametersInput = z.input<typeof checkParametersSchema>;

/** The recommended parameters of a standard, as a run form shows them before the engineer changes anything. */
export function recommendedParameters(standard: CheckParameters['standard']): CheckParameters {
  return checkParametersSchema.parse({ standard });
}
