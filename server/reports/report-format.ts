/** How the report writes numbers, dates and check parameters. */
import type { CheckParameters } from '../checks/check-parameters';
import type { Standard } from '../engine/check';
import { formatNumber } from '../engine/trace';

export { formatNumber };

/**
 * A ratio as a percentage with one decimal, rounded up: 1.0004 is 100.1 %, so a result just over capacity never
 * prints as a pass-looking 100.0 % (rounding up is the cautious side; common practice, no source).
 */
export function percentRoundedUp(ratio: number): number {
  // The small allowance keeps exact values (0.935 stored as 0.93500000000000005) from rounding up a step.
  return Math.ceil(ratio * 1000 - 1e-6) / 10;
}

/** 1.1241 → "112.5 %"; see percentRoundedUp. */
export function percentText(ratio: number): string {
  return Number.isFinite(ratio) ? `${percentRoundedUp(ratio).toFixed(1)} %` : '—';
}

/** "2026-02-03 14:00 UTC": unambiguous in every locale. */
export function dateTimeText(iso: string | undefined): string {
  if (iso === undefined) return '—';
  const time = Date.parse(iso);
  if (!Number.isFinite(time)) return iso;
  return `${new Date(time).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function dateText(iso: string | undefined): string {
  if (iso === undefined) return '';
  const time = Date.parse(iso);
  return Number.isFinite(time) ? new Date(time).toISOString().slice(0, 10) : iso;
}

export const STANDARD_LABELS: Readonly<Record<Standard, string>> = {
  'aisc360-22-lrfd': 'AISC 360-22 §G2.1, LRFD',
  'aisc360-22-asd': 'AISC 360-22 §G2.1, ASD',
  'en1993-1-1': 'EN 1993-1-1 §6.2.6 with EN 1993-1-5 §5',
};

export interface ParameterRow {
  label: string;
  value: string;
}

function stiffenerText(spacing_mm: number | null): string {
  return spacing_mm === null ? 'none (unstiffened web)' : `${formatNumber(spacing_mm)} mm clear spacing`;
}

function standardRows(parameters: CheckParameters): ParameterRow[] {
  switch (parameters.standard) {
    case 'en1993-1-1':
      return [
        { label: 'γM0', value: formatNumber(parameters.gammaM0) },
        { label: 'γM1', value: formatNumber(parameters.gammaM1) },
        { label: 'η (EN 1993-1-5 §5.1)', value: parameters.eta === null ? '1.20 up to fy = 460 MPa, 1.00 above (recommended)' : formatNumber(parameters.eta) },
        { label: 'Yield strength by thickness', value: parameters.yieldRule === 'en10025-2' ? 'EN 10025-2' : 'EN 1993-1-1 Table 3.1' },
        { label: 'End post (EN 1993-1-5 Table 5.1)', value: parameters.endPost },
      ];
    case 'aisc360-22-lrfd':
      return [{ label: 'φv', value: parameters.phiV === null ? 'by §G1/§G2.1 (1.00 or 0.90)' : `${formatNumber(parameters.phiV)} (project value)` }];
    case 'aisc360-22-asd':
      return [{ label: 'Ωv', value: parameters.omegaV === null ? 'by §G1/§G2.1 (1.50 or 1.67)' : `${formatNumber(parameters.omegaV)} (project value)` }];
  }
}

/** The parameters that entered the check, in the order an engineer reads them for the standard used. */
export function parameterRows(parameters: CheckParameters, basis?: string): ParameterRow[] {
  const overrides = Object.entries(parameters.fabricationOverrides).map(([profile, fabrication]) => `${profile}: ${fabrication}`);
  return [
    { label: 'Standard', value: STANDARD_LABELS[parameters.standard] },
    ...(basis !== undefined && basis.trim() !== '' ? [{ label: 'Basis of the factors', value: basis }] : []),
    ...standardRows(parameters),
    { label: 'Grade where the model names none', value: parameters.defaultGrade },
    { label: 'Transverse stiffeners', value: stiffenerText(parameters.stiffenerSpacing_mm) },
    { label: 'Fabrication set by the run', value: overrides.length > 0 ? overrides.join(', ') : 'none (as read from the model)' },
    { label: 'Flag as close to capacity from', value: percentText(parameters.warningRatio) },
  ];
}
