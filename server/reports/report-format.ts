/** How the report writes numbers, dates and check parameters. */
import type { ResolvedCheckParams, Standard } from '../engine/check';
import { formatNumber } from '../engine/trace';
import { MPA_PER_KSI } from '../engine/units';

export { formatNumber };

/** 1.124 → "112.4 %": one decimal, so 100.04 % is not printed as a pass-looking "100 %". */
export function percentText(ratio: number): string {
  return Number.isFinite(ratio) ? `${(ratio * 100).toFixed(1)} %` : '—';
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

/** The parameters that entered the check, in the order an engineer reads them for the standard used. */
export function parameterRows(standard: Standard, params: ResolvedCheckParams, basis?: string): ParameterRow[] {
  const rows: ParameterRow[] = [{ label: 'Standard', value: STANDARD_LABELS[standard] }];
  if (basis !== undefined && basis.trim() !== '') rows.push({ label: 'Basis of the factors', value: basis });
  if (standard === 'en1993-1-1') {
    rows.push(
      { label: 'γM0', value: formatNumber(params.gammaM0) },
      { label: 'γM1', value: formatNumber(params.gammaM1) },
      { label: 'η (EN 1993-1-5 §5.1)', value: params.eta === null ? '1.20 up to fy = 460 MPa, 1.00 above (recommended)' : formatNumber(params.eta) },
      { label: 'Yield strength by thickness', value: params.yieldRule === 'en10025-2' ? 'EN 10025-2' : 'EN 1993-1-1 Table 3.1' },
      { label: 'End post', value: params.endPost },
    );
  } else {
    rows.push({ label: 'E', value: `${formatNumber(params.e_MPa / MPA_PER_KSI, 5)} ksi (${formatNumber(params.e_MPa, 6)} MPa)` });
  }
  rows.push(
    { label: 'Transverse stiffeners', value: stiffenerText(params.stiffenerSpacing_mm) },
    { label: 'Flag as close to capacity from', value: percentText(params.warningRatio) },
  );
  return rows;
}
