/**
 * The project's declared units (IfcProject.UnitsInContext → IfcUnitAssignment), each resolved to its factor to the
 * SI unit: SI units with their prefix (ISO 16739 IfcSIPrefix), and conversion-based units (inch, foot, degree, …)
 * through their IfcMeasureWithUnit, which may itself refer to another conversion-based unit.
 */
import { IFCCONVERSIONBASEDUNIT, IFCCONVERSIONBASEDUNITWITHOFFSET, IFCPROJECT, IFCSIUNIT, IFCUNITASSIGNMENT } from 'web-ifc';
import type { StepLines } from './step-lines';

export interface DeclaredUnit {
  /** IfcUnitEnum value, e.g. LENGTHUNIT, PLANEANGLEUNIT. */
  unitType: string;
  /** As declared: 'METRE' with prefix 'MILLI', or a conversion unit's own name such as 'INCH'. */
  name: string;
  prefix: string | null;
  /** Multiply a value in this unit by this to get the SI unit (metre, radian, …); null when not derivable. */
  scaleToSi: number | null;
}

const SI_PREFIX_EXPONENT: Readonly<Record<string, number>> = {
  EXA: 18, PETA: 15, TERA: 12, GIGA: 9, MEGA: 6, KILO: 3, HECTO: 2, DECA: 1,
  DECI: -1, CENTI: -2, MILLI: -3, MICRO: -6, NANO: -9, PICO: -12, FEMTO: -15, ATTO: -18,
};

export function siPrefixExponent(prefix: string | null): number | undefined {
  return prefix === null ? 0 : SI_PREFIX_EXPONENT[prefix];
}

/** Reads `.value` of a typed web-ifc attribute ({type, value}) or of a handle. */
function valueOf(attribute: unknown): unknown {
  return attribute !== null && typeof attribute === 'object' && 'value' in attribute ? (attribute as { value: unknown }).value : undefined;
}

const MAX_CONVERSION_DEPTH = 8;

function resolveUnit(lines: StepLines, id: number, depth: number): DeclaredUnit | undefined {
  const type = lines.typeOf(id);
  const unit = lines.named(id);
  if (!unit) return undefined;
  const unitType = String(valueOf(unit.UnitType) ?? '');
  if (type === IFCSIUNIT) {
    const prefix = (valueOf(unit.Prefix) as string | undefined) ?? null;
    const exponent = siPrefixExponent(prefix);
    return { unitType, name: String(valueOf(unit.Name) ?? ''), prefix, scaleToSi: exponent === undefined ? null : 10 ** exponent };
  }
  if (type === IFCCONVERSIONBASEDUNIT || type === IFCCONVERSIONBASEDUNITWITHOFFSET) {
    const name = String(valueOf(unit.Name) ?? '');
    const factorId = valueOf(unit.ConversionFactor);
    const factor = typeof factorId === 'number' ? lines.named(factorId) : undefined;
    const value = Number(valueOf(factor?.ValueComponent));
    const componentId = valueOf(factor?.UnitComponent);
    const component = typeof componentId === 'number' && depth < MAX_CONVERSION_DEPTH ? resolveUnit(lines, componentId, depth + 1) : undefined;
    const scale = component?.scaleToSi != null && Number.isFinite(value) && value > 0 ? value * component.scaleToSi : null;
    return { unitType, name, prefix: null, scaleToSi: scale };
  }
  // IfcContextDependentUnit and anything else: named, but with no factor to SI.
  return { unitType, name: String(valueOf(unit.Name) ?? ''), prefix: null, scaleToSi: null };
}

/** The units assigned to the project (or, without a project, by the file's first unit assignment). */
export function projectUnits(lines: StepLines): DeclaredUnit[] {
  const project = lines.idsOfType(IFCPROJECT)[0];
  const fromProject = project === undefined ? undefined : valueOf(lines.named(project)?.UnitsInContext);
  const assignment = typeof fromProject === 'number' ? fromProject : lines.idsOfType(IFCUNITASSIGNMENT)[0];
  if (assignment === undefined) return [];
  const units = lines.named(assignment)?.Units;
  if (!Array.isArray(units)) return [];
  return units
    .map((handle) => valueOf(handle))
    .filter((id): id is number => typeof id === 'number')
    .map((id) => resolveUnit(lines, id, 0))
    .filter((u): u is DeclaredUnit => u !== undefined);
}

/** Radians per unit of plane angle; radians when the model declares none (the SI unit). */
export function radiansPerAngleUnit(units: readonly DeclaredUnit[]): number {
  const unit = units.find((u) => u.unitType === 'PLANEANGLEUNIT');
  return unit?.scaleToSi != null && unit.scaleToSi > 0 ? unit.scaleToSi : 1;
}
