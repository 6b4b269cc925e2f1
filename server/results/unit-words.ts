/**
 * Units as analysis exports write them, in a header ('Vz [kN]', 'shear_kip', 'My (kN·m)') or in a units row under
 * the header ('m', 'kN', 'kNm'). Moments are a force unit times a length unit; their factor to N·mm is built from the
 * engine's exact force and length factors, so no new constant appears here.
 */
import { type ForceUnit, type LengthUnit, toMillimetres, toNewtons } from '../engine/units';

export const MOMENT_UNITS = ['Nmm', 'Nm', 'kNm', 'kip-in', 'kip-ft', 'lbf-in', 'lbf-ft'] as const;
export type MomentUnit = (typeof MOMENT_UNITS)[number];

const MOMENT_PARTS: Readonly<Record<MomentUnit, readonly [ForceUnit, LengthUnit]>> = {
  Nmm: ['N', 'mm'],
  Nm: ['N', 'm'],
  kNm: ['kN', 'm'],
  'kip-in': ['kip', 'in'],
  'kip-ft': ['kip', 'ft'],
  'lbf-in': ['lbf', 'in'],
  'lbf-ft': ['lbf', 'ft'],
};

export function toNewtonMillimetres(value: number, unit: MomentUnit): number {
  const [force, length] = MOMENT_PARTS[unit];
  return toNewtons(toMillimetres(value, length), force);
}

/** Unit words in their compact form: lower case, without separators ('kN·m', 'kN-m', 'kN m' are all 'knm'). */
const FORCE_WORDS: Readonly<Record<string, ForceUnit>> = { n: 'N', kn: 'kN', kip: 'kip', kips: 'kip', k: 'kip', lbf: 'lbf', lb: 'lbf', lbs: 'lbf' };
const LENGTH_WORDS: Readonly<Record<string, LengthUnit>> = { mm: 'mm', m: 'm', in: 'in', inch: 'in', ft: 'ft', feet: 'ft' };
const MOMENT_WORDS: Readonly<Record<string, MomentUnit>> = {
  nmm: 'Nmm',
  nm: 'Nm',
  knm: 'kNm',
  kipin: 'kip-in',
  kin: 'kip-in',
  kipsin: 'kip-in',
  kipft: 'kip-ft',
  kft: 'kip-ft',
  kipsft: 'kip-ft',
  lbfin: 'lbf-in',
  lbin: 'lbf-in',
  lbfft: 'lbf-ft',
  lbft: 'lbf-ft',
};

export type UnitWord = { kind: 'force'; unit: ForceUnit } | { kind: 'length'; unit: LengthUnit } | { kind: 'moment'; unit: MomentUnit };

/** The unit a word names, or undefined; brackets around it are allowed ('[kN]'). */
export function unitWord(text: string): UnitWord | undefined {
  const compact = text
    .trim()
    .replace(/^[[(]\s*|\s*[\])]$/g, '')
    .toLowerCase()
    .replace(/[\s·⋅.*_-]+/g, '');
  if (compact in FORCE_WORDS) return { kind: 'force', unit: FORCE_WORDS[compact] };
  if (compact in LENGTH_WORDS) return { kind: 'length', unit: LENGTH_WORDS[compact] };
  if (compact in MOMENT_WORDS) return { kind: 'moment', unit: MOMENT_WORDS[compact] };
  return undefined;
}
