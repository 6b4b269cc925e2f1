/**
 * Steel grades and their yield strength by element thickness.
 *
 * EN grades: minimum yield strength ReH by nominal thickness from the product standards (EN 10025-2 for S235–S355,
 * EN 10025-4 thermomechanically rolled S420M/S460M for the higher grades), or the simplified two-band values of
 * EN 1993-1-1 Table 3.1 as a project option. The band values below were written from memory of those tables, not
 * copied from a licensed copy: verify them against the edition your project uses.
 * ASTM: A992 and A572 Gr 50 Fy = 50 ksi, A36 Fy = 36 ksi (AISC Manual Table 2-4; ASTM A36 plates over 8 in take
 * 32 ksi, which is outside the rolled and welded I-sections this engine checks).
 */
import { EngineInputError } from './input-error';
import { MPA_PER_KSI } from './units';

export type GradeId = 'S235' | 'S275' | 'S355' | 'S420' | 'S460' | 'A992' | 'A36' | 'A572-50';
export type YieldRule = 'en10025-2' | 'en1993-1-1-table-3.1' | 'astm';
export type EnYieldRule = Exclude<YieldRule, 'astm'>;

export const GRADE_IDS: readonly GradeId[] = ['S235', 'S275', 'S355', 'S420', 'S460', 'A992', 'A36', 'A572-50'];

export interface YieldStrength {
  fy_MPa: number;
  rule: YieldRule;
  /** The thickness band the value came from, e.g. '16 < t ≤ 40 mm'. */
  band: string;
}

/** A grade/thickness/rule combination with no tabulated yield strength. */
export class GradeError extends EngineInputError {
  constructor(field: 'grade' | 'thickness_mm' | 'yieldRule', message: string) {
    super(field, message);
    this.name = 'GradeError';
  }
}

interface Band {
  upTo_mm: number;
  fy_MPa: number;
}

type EnGrade = Extract<GradeId, `S${string}`>;

/** ReH by nominal thickness (from memory, see the file comment): EN 10025-2 Table 7; EN 10025-4 Table 3 for M grades. */
const PRODUCT_STANDARD_BANDS: Readonly<Record<EnGrade, readonly Band[]>> = {
  S235: bands([16, 235], [40, 225], [63, 215], [80, 215], [100, 215], [150, 195], [200, 185], [250, 175]),
  S275: bands([16, 275], [40, 265], [63, 255], [80, 245], [100, 235], [150, 225], [200, 215], [250, 205]),
  S355: bands([16, 355], [40, 345], [63, 335], [80, 325], [100, 315], [150, 295], [200, 285], [250, 275]),
  S420: bands([16, 420], [40, 400], [63, 390], [80, 380], [100, 370], [120, 365]),
  S460: bands([16, 460], [40, 440], [63, 430], [80, 410], [100, 400], [120, 385]),
};

/** EN 1993-1-1:2005 Table 3.1, hot-rolled structural steel: t ≤ 40 mm and 40 < t ≤ 80 mm (from memory). */
const EUROCODE_TABLE_BANDS: Readonly<Record<EnGrade, readonly Band[]>> = {
  S235: bands([40, 235], [80, 215]),
  S275: bands([40, 275], [80, 255]),
  S355: bands([40, 355], [80, 335]),
  S420: bands([40, 420], [80, 390]),
  S460: bands([40, 460], [80, 430]),
};

const ASTM_FY_KSI: Readonly<Record<Exclude<GradeId, EnGrade>, number>> = { A992: 50, A36: 36, 'A572-50': 50 };

const PRODUCT_STANDARD_NAME: Readonly<Record<EnGrade, string>> = {
  S235: 'EN 10025-2',
  S275: 'EN 10025-2',
  S355: 'EN 10025-2',
  S420: 'EN 10025-4 (S420M)',
  S460: 'EN 10025-4 (S460M)',
};

function bands(...rows: [number, number][]): Band[] {
  return rows.map(([upTo_mm, fy_MPa]) => ({ upTo_mm, fy_MPa }));
}

function isEnGrade(grade: GradeId): grade is EnGrade {
  return grade.startsWith('S');
}

export function isGradeId(value: string): value is GradeId {
  return (GRADE_IDS as readonly string[]).includes(value);
}

/**
 * Yield strength of `grade` for an element `thickness_mm` thick (use the thicker of flange and web, or the element
 * being checked). EN grades follow `rule`; ASTM grades always use their specified minimum and report rule 'astm'.
 */
export function yieldStrength(grade: GradeId, thickness_mm: number, rule: YieldRule = 'en10025-2'): YieldStrength {
  if (!Number.isFinite(thickness_mm) || thickness_mm <= 0) {
    throw new GradeError('thickness_mm', `thickness_mm must be a positive number of millimetres, got ${thickness_mm}`);
  }
  if (!isGradeId(grade)) throw new GradeError('grade', `Unknown grade '${String(grade)}'; allowed: ${GRADE_IDS.join(', ')}`);
  if (!isEnGrade(grade)) {
    return { fy_MPa: ASTM_FY_KSI[grade] * MPA_PER_KSI, rule: 'astm', band: `Fy = ${ASTM_FY_KSI[grade]} ksi, all shape thicknesses` };
  }
  if (rule === 'astm') throw new GradeError('yieldRule', `Grade ${grade} is an EN grade; choose rule 'en10025-2' or 'en1993-1-1-table-3.1'`);
  const table = rule === 'en10025-2' ? PRODUCT_STANDARD_BANDS[grade] : EUROCODE_TABLE_BANDS[grade];
  const index = table.findIndex((b) => thickness_mm <= b.upTo_mm);
  if (index < 0) {
    const source = rule === 'en10025-2' ? PRODUCT_STANDARD_NAME[grade] : 'EN 1993-1-1 Table 3.1';
    throw new GradeError('thickness_mm', `${source} gives no yield strength for ${grade} thicker than ${table[table.length - 1].upTo_mm} mm (t = ${thickness_mm} mm)`);
  }
  const lower = index === 0 ? 0 : table[index - 1].upTo_mm;
  const band = index === 0 ? `t ≤ ${table[0].upTo_mm} mm` : `${lower} < t ≤ ${table[index].upTo_mm} mm`;
  return { fy_MPa: table[index].fy_MPa, rule, band };
}

/** Human-readable name of the rule, for traces and reports. */
export function yieldRuleLabel(grade: GradeId, rule: YieldRule): string {
  if (!isEnGrade(grade)) return 'ASTM specified minimum yield stress';
  return rule === 'en10025-2' ? `${PRODUCT_STANDARD_NAME[grade]} by nominal thickness` : 'EN 1993-1-1 Table 3.1';
}

const OLD_EN_NAMES: Readonly<Record<string, EnGrade>> = { '360': 'S235', '430': 'S275', '510': 'S355' };

/**
 * Grade from a free-text material name as authoring tools write it ('S355JR', 'S355J2+N', 'Steel S355', 'ASTM A992',
 * 'A992 Gr 50', 'A572 Grade 50', 'Gr.50', old 'Fe 510'). Returns null when no supported grade is recognisable, so the
 * caller can fall back to the project's default grade and flag the member.
 */
export function gradeFromMaterialName(name: string): GradeId | null {
  if (typeof name !== 'string') return null;
  const text = name.toUpperCase().replace(/[_./:\\,;()[\]-]+/g, ' ');
  const en = /(?:^|[^A-Z0-9])S\s?(235|275|355|420|460)(?!\d)/.exec(text);
  if (en) return `S${en[1]}` as EnGrade;
  const old = /(?:^|[^A-Z0-9])FE\s?E?\s?(360|430|510)(?!\d)/.exec(text);
  if (old) return OLD_EN_NAMES[old[1]];
  if (/(?:^|[^A-Z0-9])A\s?992(?!\d)/.test(text)) return 'A992';
  if (/(?:^|[^A-Z0-9])A\s?36(?!\d)/.test(text)) return 'A36';
  const gradeNumber = /(?:^|[^A-Z0-9])GR(?:ADE)?\s?(\d{2})(?!\d)/.exec(text);
  if (/(?:^|[^A-Z0-9])A\s?572(?!\d)/.test(text)) {
    // A572 without a grade is taken as Gr 50, the grade stocked for shapes; any other grade is not supported.
    const explicit = gradeNumber?.[1] ?? /A\s?572\s(\d{2})(?!\d)/.exec(text)?.[1];
    return explicit === undefined || explicit === '50' ? 'A572-50' : null;
  }
  if (gradeNumber?.[1] === '50') return 'A572-50';
  return null;
}
