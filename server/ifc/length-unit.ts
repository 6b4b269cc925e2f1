/**
 * The model's length unit and its factor to millimetres. A model without a usable length unit is refused: every
 * dimension of every section depends on it, so it is never guessed.
 */
import { MM_PER_FT, MM_PER_IN } from '../engine/units';
import { IfcReadError } from './ifc-read-error';
import type { DeclaredUnit } from './unit-assignment';

export interface LengthUnit {
  /** Readable name: 'millimetre', 'metre', 'inch', 'foot', or a prefixed metre such as 'centimetre'. */
  name: string;
  scaleToMm: number;
}

/** Conversion-based units whose factor in the file is a rounding of an exact definition (units.ts). */
const EXACT_MM: readonly { names: readonly string[]; name: string; mm: number }[] = [
  { names: ['INCH', 'IN', 'INCHES'], name: 'inch', mm: MM_PER_IN },
  { names: ['FOOT', 'FT', 'FEET'], name: 'foot', mm: MM_PER_FT },
];

/** Within this relative difference a file's factor is taken as the exact definition (files write 0.0254, 0.3048). */
const SNAP_TOLERANCE = 1e-6;

export function lengthUnitOf(units: readonly DeclaredUnit[]): LengthUnit {
  const unit = units.find((u) => u.unitType === 'LENGTHUNIT');
  if (!unit) {
    throw new IfcReadError(
      'no-length-unit',
      'The model declares no length unit (its IfcUnitAssignment has no LENGTHUNIT), so its dimensions cannot be read. ' +
        'Export it again with the project units included.',
    );
  }
  if (unit.scaleToSi === null || !(unit.scaleToSi > 0)) {
    throw new IfcReadError(
      'no-length-unit',
      `The model's length unit "${unit.name}" has no usable conversion to metres, so its dimensions cannot be read.`,
    );
  }
  if (unit.name === 'METRE') {
    const prefix = unit.prefix ? unit.prefix.toLowerCase() : '';
    // 10 ** (exponent + 3) keeps the factor exact (10 ** -3 * 1000 is not exactly 1).
    const exponent = Math.round(Math.log10(unit.scaleToSi));
    return { name: `${prefix}metre`, scaleToMm: 10 ** (exponent + 3) };
  }
  const scaleToMm = unit.scaleToSi * 1000;
  const known = EXACT_MM.find((k) => k.names.includes(unit.name.trim().toUpperCase()));
  if (known && Math.abs(scaleToMm - known.mm) <= SNAP_TOLERANCE * known.mm) return { name: known.name, scaleToMm: known.mm };
  return { name: unit.name.trim().toLowerCase() || 'unnamed unit', scaleToMm };
}

