/** One line of a calculation sheet: which clause, what is computed, the formula, the numbers put in, the result. */
export interface TraceStep {
  clause: string;
  what: string;
  formula: string;
  substituted: string;
  result: number | string;
  unit: string;
}

/** Four significant figures, no exponent for everyday magnitudes: what an engineer would write on a sheet. */
export function formatNumber(value: number, significant = 4): string {
  if (!Number.isFinite(value)) return String(value);
  return String(Number(value.toPrecision(significant)));
}

export function step(clause: string, what: string, formula: string, substituted: string, result: number | string, unit = ''): TraceStep {
  return { clause, what, formula, substituted, result: typeof result === 'number' ? Number(result.toPrecision(6)) : result, unit };
}
