/** Design codes a project is checked against; later features read these exact strings. */
export const DESIGN_STANDARDS = ['aisc360-22-lrfd', 'aisc360-22-asd', 'en1993-1-1'] as const;
export type DesignStandard = (typeof DESIGN_STANDARDS)[number];

export type StandardFamily = 'aisc' | 'en';

export function standardFamily(standard: DesignStandard): StandardFamily {
  return standard === 'en1993-1-1' ? 'en' : 'aisc';
}
