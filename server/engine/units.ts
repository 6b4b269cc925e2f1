/**
 * Unit conversions at the edges of the engine. Internally everything is SI-based: mm, N, MPa (= N/mm²).
 *
 * Every factor is built from exact definitions: the international inch is 0.0254 m exactly and the foot 0.3048 m
 * (International Yard and Pound Agreement, 1959); the pound-force is 0.45359237 kg × 9.80665 m/s² =
 * 4.4482216152605 N exactly (NIST SP 811, Appendix B). Stress factors are derived from those, never rounded.
 */
import { EngineInputError } from './input-error';

export type ForceUnit = 'N' | 'kN' | 'kip' | 'lbf';
export type LengthUnit = 'mm' | 'm' | 'in' | 'ft';
export type StressUnit = 'MPa' | 'ksi' | 'psi';

export const M_PER_IN = 0.0254;
export const M_PER_FT = 0.3048;
export const N_PER_LBF = 4.4482216152605;
export const N_PER_KIP = 1000 * N_PER_LBF;
export const MM_PER_IN = 1000 * M_PER_IN;
export const MM_PER_FT = 1000 * M_PER_FT;
/** 1 ksi = 1 kip / in² expressed in N/mm². */
export const MPA_PER_KSI = N_PER_KIP / (MM_PER_IN * MM_PER_IN);
export const MPA_PER_PSI = N_PER_LBF / (MM_PER_IN * MM_PER_IN);

/** Thrown for a unit name outside the allowed list; the message lists what is allowed. */
export class UnitError extends EngineInputError {
  constructor(
    readonly quantity: 'force' | 'length' | 'stress',
    readonly unit: string,
    readonly allowed: readonly string[],
  ) {
    super(`${quantity}Unit`, `Unknown ${quantity} unit '${unit}'; allowed: ${allowed.join(', ')}`);
    this.name = 'UnitError';
  }
}

const NEWTONS_PER: Readonly<Record<ForceUnit, number>> = { N: 1, kN: 1000, kip: N_PER_KIP, lbf: N_PER_LBF };
const MILLIMETRES_PER: Readonly<Record<LengthUnit, number>> = { mm: 1, m: 1000, in: MM_PER_IN, ft: MM_PER_FT };
const MPA_PER: Readonly<Record<StressUnit, number>> = { MPa: 1, ksi: MPA_PER_KSI, psi: MPA_PER_PSI };

export const FORCE_UNITS = Object.keys(NEWTONS_PER) as ForceUnit[];
export const LENGTH_UNITS = Object.keys(MILLIMETRES_PER) as LengthUnit[];
export const STRESS_UNITS = Object.keys(MPA_PER) as StressUnit[];

function factorOf<U extends string>(table: Readonly<Record<U, number>>, quantity: UnitError['quantity'], unit: string): number {
  if (!Object.prototype.hasOwnProperty.call(table, unit)) {
    throw new UnitError(quantity, unit, Object.keys(table));
  }
  return table[unit as U];
}

/** Narrows a free string (a CSV header, a query parameter) to a force unit, or throws UnitError. */
export function parseForceUnit(unit: string): ForceUnit {
  factorOf(NEWTONS_PER, 'force', unit);
  return unit as ForceUnit;
}

export function parseLengthUnit(unit: string): LengthUnit {
  factorOf(MILLIMETRES_PER, 'length', unit);
  return unit as LengthUnit;
}

export function parseStressUnit(unit: string): StressUnit {
  factorOf(MPA_PER, 'stress', unit);
  return unit as StressUnit;
}

export function toNewtons(value: number, unit: ForceUnit): number {
  return value * factorOf(NEWTONS_PER, 'force', unit);
}

export function fromNewtons(value_N: number, unit: ForceUnit): number {
  return value_N / factorOf(NEWTONS_PER, 'force', unit);
}

export function toMillimetres(value: number, unit: LengthUnit): number {
  return value * factorOf(MILLIMETRES_PER, 'length', unit);
}

export function fromMillimetres(value_mm: number, unit: LengthUnit): number {
  return value_mm / factorOf(MILLIMETRES_PER, 'length', unit);
}

/** Converts a length raised to `power` (2 for areas, 3 for first moments, 4 for second moments) into mm^power. */
export function toMillimetresPower(value: number, unit: LengthUnit, power: number): number {
  return value * factorOf(MILLIMETRES_PER, 'length', unit) ** power;
}

export function fromMillimetresPower(value_mmPower: number, unit: LengthUnit, power: number): number {
  return value_mmPower / factorOf(MILLIMETRES_PER, 'length', unit) ** power;
}

export function toMPa(value: number, unit: StressUnit): number {
  return value * factorOf(MPA_PER, 'stress', unit);
}

export function fromMPa(value_MPa: number, unit: StressUnit): number {
  return value_MPa / factorOf(MPA_PER, 'stress', unit);
}
