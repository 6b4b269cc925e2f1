/**
 * I-section input: the geometry every check starts from, in millimetres.
 *
 * Covers doubly symmetric and mono-symmetric I-sections (each flange has its own width, thickness, root fillet,
 * toe radius and slope), centred on the web axis as IfcIShapeProfileDef and IfcAsymmetricIShapeProfileDef define them.
 * Rolled sections have quarter-circle root fillets; welded ones are plates without fillets (weld throats ignored).
 */
import { EngineInputError } from './input-error';

export type Fabrication = 'rolled' | 'welded';

export interface FlangeInput {
  width_mm: number;
  /** Nominal thickness; for a sloped flange it is measured half-way along the outstand, (b − tw)/4 from the edge. */
  thickness_mm: number;
  /** Root fillet between web and flange (0 for welded plates). */
  filletRadius_mm: number;
  /** Radius rounding the inner corner at the flange tip. */
  edgeRadius_mm?: number;
  /** Slope of the inner flange face against the horizontal, radians (tapered flanges). */
  slope_rad?: number;
}

export interface ISectionInput {
  depth_mm: number;
  webThickness_mm: number;
  topFlange: FlangeInput;
  bottomFlange: FlangeInput;
  fabrication: Fabrication;
}

/** Bad section geometry; `field` is the dotted path of the offending input (e.g. `topFlange.thickness_mm`). */
export class SectionInputError extends EngineInputError {
  constructor(field: string, message: string) {
    super(field, `${field}: ${message}`);
    this.name = 'SectionInputError';
  }
}

/** Steepest flange slope accepted: rolled tapered flanges are 8–16 %, so 45° is far outside anything real. */
const MAX_SLOPE_RAD = Math.PI / 4;

function requirePositive(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new SectionInputError(field, `must be a finite number of millimetres, got ${String(value)}`);
  }
  if (value <= 0) throw new SectionInputError(field, `must be greater than 0 mm, got ${value}`);
  return value;
}

function requireNonNegative(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new SectionInputError(field, `must be a finite number, got ${String(value)}`);
  }
  if (value < 0) throw new SectionInputError(field, `must not be negative, got ${value}`);
  return value;
}

/** Tapered-flange geometry of one flange, measured inward from its outer face (z) and out from the web axis (x). */
export interface FlangeGeometry {
  halfWidth_mm: number;
  webHalf_mm: number;
  slopeTan: number;
  /** Inner-face depth from the outer face at the web face and at the flange tip. */
  rootThickness_mm: number;
  tipThickness_mm: number;
  filletRadius_mm: number;
  edgeRadius_mm: number;
  /** Depth from the outer face where the root fillet meets the web (AISC's k for a parallel flange). */
  filletWebTangent_mm: number;
  /** Depth where the root fillet meets the inner face, and its distance from the web axis. */
  filletFaceTangent_mm: number;
  filletFaceTangentX_mm: number;
  /** Depth of the toe-radius centre (where it meets the flange edge) and where it meets the inner face. */
  edgeCentre_mm: number;
  edgeFaceTangent_mm: number;
  edgeFaceTangentX_mm: number;
}

export function flangeGeometry(flange: FlangeInput, webThickness_mm: number): FlangeGeometry {
  const halfWidth_mm = flange.width_mm / 2;
  const webHalf_mm = webThickness_mm / 2;
  const slopeTan = Math.tan(flange.slope_rad ?? 0);
  const secant = Math.sqrt(1 + slopeTan * slopeTan);
  const outstand_mm = halfWidth_mm - webHalf_mm;
  const rootThickness_mm = flange.thickness_mm + (outstand_mm / 2) * slopeTan;
  const tipThickness_mm = flange.thickness_mm - (outstand_mm / 2) * slopeTan;
  const r = flange.filletRadius_mm;
  const r2 = flange.edgeRadius_mm ?? 0;
  // Circle tangent to the web face and the inner face (inside the fillet), and circle tangent to the edge and the
  // inner face (inside the flange): centre offsets follow from the distance of a point to a sloped line.
  const filletWebTangent_mm = rootThickness_mm - r * slopeTan + r * secant;
  const edgeCentre_mm = rootThickness_mm - (outstand_mm - r2) * slopeTan - r2 * secant;
  return {
    halfWidth_mm,
    webHalf_mm,
    slopeTan,
    rootThickness_mm,
    tipThickness_mm,
    filletRadius_mm: r,
    edgeRadius_mm: r2,
    filletWebTangent_mm,
    filletFaceTangent_mm: filletWebTangent_mm - r / secant,
    filletFaceTangentX_mm: webHalf_mm + r - (r * slopeTan) / secant,
    edgeCentre_mm,
    edgeFaceTangent_mm: edgeCentre_mm + r2 / secant,
    edgeFaceTangentX_mm: halfWidth_mm - r2 + (r2 * slopeTan) / secant,
  };
}

function validateFlange(flange: FlangeInput | undefined, name: 'topFlange' | 'bottomFlange', webThickness_mm: number): FlangeGeometry {
  if (flange === null || typeof flange !== 'object') {
    throw new SectionInputError(name, 'is missing (width_mm, thickness_mm, filletRadius_mm are required)');
  }
  const width = requirePositive(flange.width_mm, `${name}.width_mm`);
  requirePositive(flange.thickness_mm, `${name}.thickness_mm`);
  requireNonNegative(flange.filletRadius_mm, `${name}.filletRadius_mm`);
  if (flange.edgeRadius_mm !== undefined) requireNonNegative(flange.edgeRadius_mm, `${name}.edgeRadius_mm`);
  if (flange.slope_rad !== undefined) {
    const slope = requireNonNegative(flange.slope_rad, `${name}.slope_rad`);
    if (slope >= MAX_SLOPE_RAD) {
      throw new SectionInputError(`${name}.slope_rad`, `must be below ${MAX_SLOPE_RAD.toFixed(3)} rad (45°), got ${slope}`);
    }
  }
  if (webThickness_mm >= width) {
    throw new SectionInputError('webThickness_mm', `(${webThickness_mm} mm) must be smaller than ${name}.width_mm (${width} mm)`);
  }
  const g = flangeGeometry(flange, webThickness_mm);
  if (g.tipThickness_mm <= 0) {
    throw new SectionInputError(`${name}.slope_rad`, 'is so steep that the flange tip has no thickness');
  }
  if (g.filletFaceTangentX_mm > g.halfWidth_mm + 1e-9) {
    throw new SectionInputError(`${name}.filletRadius_mm`, `(${g.filletRadius_mm} mm) does not fit on the flange outstand`);
  }
  if (g.edgeCentre_mm < -1e-9) {
    throw new SectionInputError(`${name}.edgeRadius_mm`, `(${g.edgeRadius_mm} mm) is larger than the flange tip thickness`);
  }
  if (g.edgeFaceTangentX_mm < g.filletFaceTangentX_mm - 1e-9) {
    throw new SectionInputError(`${name}.edgeRadius_mm`, 'overlaps the root fillet on the inner flange face');
  }
  return g;
}

/**
 * Checks that the input describes a real I-section and returns the geometry of both flanges.
 * Throws SectionInputError naming the first bad field.
 */
export function validateSection(input: ISectionInput): { top: FlangeGeometry; bottom: FlangeGeometry } {
  if (input === null || typeof input !== 'object') throw new SectionInputError('section', 'is missing');
  const depth = requirePositive(input.depth_mm, 'depth_mm');
  const tw = requirePositive(input.webThickness_mm, 'webThickness_mm');
  if (input.fabrication !== 'rolled' && input.fabrication !== 'welded') {
    throw new SectionInputError('fabrication', `must be 'rolled' or 'welded', got ${String(input.fabrication)}`);
  }
  const top = validateFlange(input.topFlange, 'topFlange', tw);
  const bottom = validateFlange(input.bottomFlange, 'bottomFlange', tw);
  for (const [flange, name] of [[input.topFlange, 'topFlange'], [input.bottomFlange, 'bottomFlange']] as const) {
    if (flange.thickness_mm >= depth / 2) {
      throw new SectionInputError(`${name}.thickness_mm`, `(${flange.thickness_mm} mm) is not less than half the depth (${depth / 2} mm)`);
    }
  }
  if (top.filletWebTangent_mm + bottom.filletWebTangent_mm > depth + 1e-9) {
    const larger = top.filletRadius_mm >= bottom.filletRadius_mm ? 'topFlange' : 'bottomFlange';
    throw new SectionInputError(`${larger}.filletRadius_mm`, 'the root fillets of the two flanges overlap on the web');
  }
  return { top, bottom };
}
