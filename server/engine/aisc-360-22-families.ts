/**
 * Shear strength of every section family on both axes by ANSI/AISC 360-22 Chapter G (LRFD and ASD), without
 * tension-field action (§G2.2 post-buckling strength is not counted). Clauses as recalled from the published
 * specification (from memory); verify against the edition in force.
 *
 *   G2.1  I-shapes (aisc-360-22.ts) and channels, load ∥ web: Vn = 0.6·Fy·Aw·Cv1, Aw = d·tw, kv = 5.34 unstiffened
 *   G2.2  Cv2: 1.0 for h/tw ≤ 1.10√(kv·E/Fy); 1.10√(kv·E/Fy)/(h/tw) up to 1.37√(kv·E/Fy); 1.51·kv·E/((h/tw)²·Fy) beyond
 *   G3    tees (Aw = d·tw, h/tw = d/tw) and single angles (Aw = b·t, h/tw = b/t, b the leg along the shear):
 *         Vn = 0.6·Fy·Aw·Cv2, kv = 1.2
 *   G4    rectangular HSS and boxes: Vn = 0.6·Fy·Aw·Cv2, Aw = 2·h·t, kv = 5; h the flat width (clear distance between
 *         the flanges less the inside corner radius on each side; outside dimension − 3t when the radius is not known;
 *         clear distance between flanges for a welded box)
 *   G5    round HSS: Vn = Fcr·Ag/2, Fcr = max(1.60·E/(√(Lv/D)·(D/t)^(5/4)), 0.78·E/(D/t)^(3/2)) ≤ 0.6·Fy
 *   G6    weak-axis shear of I-shapes, channels and tees: Vn = Σ 0.6·Fy·bf·tf·Cv2 over the flanges, kv = 1.2,
 *         h/tw = bf/(2tf) for I-shapes and tees, bf/tf for channels
 *   φv = 0.90, Ωv = 1.67 throughout, except G2.1(a) rolled I-shapes (1.00 / 1.50, in aisc-360-22.ts).
 */
import { aiscShearCapacity, type AiscMethod, type AiscShearParams, webBucklingCoefficientKv, webShearCoefficientCv1 } from './aisc-360-22';
import { type Fabrication, flangeGeometry, SectionInputError } from './section';
import { type BoxDimensions, SECTION_FAMILY_LABELS, type SectionDimensions } from './section-family';
import { sectionProperties } from './section-properties';
import type { ShearAxis, ShearRule } from './shear-axis';
import { formatNumber as f, step, type TraceStep } from './trace';

export interface AiscFamilyShear {
  axis: ShearAxis;
  method: AiscMethod;
  /** The section of Chapter G used: 'G2.1', 'G3', 'G4', 'G5', 'G6'. */
  section: string;
  aw_mm2: number;
  vn_N: number;
  resistanceFactor: number;
  available_N: number;
  webBucklingGoverns: boolean;
  /** Transverse stiffener spacing was given: G2.2 tension-field action could add strength, not counted here. */
  tensionFieldNotCounted: boolean;
  /** I-shapes: h/tw above the proportioning limit for unstiffened webs (aisc-360-22.ts). */
  beyondProportionLimit: boolean;
  trace: TraceStep[];
}

export interface AiscFamilyParams extends AiscShearParams {
  /** G5: distance from the maximum to the zero shear force along the member; null when not known. */
  shearLength_mm: number | null;
}

const PHI = 0.9;
const OMEGA = 1.67;

/** Web shear strength coefficient Cv2 of §G2.2 (Eq. G2-9 to G2-11). */
export function webShearCoefficientCv2(hOverTw: number, kv: number, e_MPa: number, fy_MPa: number): number {
  const root = Math.sqrt((kv * e_MPa) / fy_MPa);
  if (hOverTw <= 1.1 * root) return 1;
  if (hOverTw <= 1.37 * root) return (1.1 * root) / hOverTw;
  return (1.51 * kv * e_MPa) / (hOverTw * hOverTw * fy_MPa);
}

function cv2Step(clause: string, hOverTw: number, kv: number, e: number, fy: number): { cv2: number; trace: TraceStep } {
  const root = Math.sqrt((kv * e) / fy);
  const cv2 = webShearCoefficientCv2(hOverTw, kv, e, fy);
  const rule = hOverTw <= 1.1 * root ? 'h/tw ≤ 1.10·√(kv·E/Fy) → Cv2 = 1.0' : hOverTw <= 1.37 * root ? 'Cv2 = 1.10·√(kv·E/Fy)/(h/tw) (G2-10)' : 'Cv2 = 1.51·kv·E/((h/tw)²·Fy) (G2-11)';
  return { cv2, trace: step(`AISC 360-22 §G2.2 (via ${clause})`, 'Web shear strength coefficient', rule, `h/tw = ${f(hOverTw)}, kv = ${f(kv)}, √(kv·E/Fy) = ${f(root)}`, cv2) };
}

function available(axis: ShearAxis, section: string, method: AiscMethod, aw: number, vn: number, buckling: boolean, stiffened: boolean, trace: TraceStep[]): AiscFamilyShear {
  const clause = `AISC 360-22 §${section}`;
  const factor = method === 'lrfd' ? PHI : 1 / OMEGA;
  const avail = vn * factor;
  trace.push(
    method === 'lrfd'
      ? step(clause, 'Design shear strength (LRFD)', 'φv·Vn, φv = 0.90', `0.90 × ${f(vn / 1000)} kN`, avail / 1000, 'kN')
      : step(clause, 'Allowable shear strength (ASD)', 'Vn/Ωv, Ωv = 1.67', `${f(vn / 1000)} kN / 1.67`, avail / 1000, 'kN'),
  );
  return { axis, method, section, aw_mm2: aw, vn_N: vn, resistanceFactor: factor, available_N: avail, webBucklingGoverns: buckling, tensionFieldNotCounted: stiffened, beyondProportionLimit: false, trace };
}

/** One plate element (or several alike) by 0.6·Fy·Aw·Cv2: G3, G4 and G6 differ only in Aw, h/tw and kv. */
function plateElements(
  axis: ShearAxis,
  section: string,
  what: string,
  elements: { count: number; b_mm: number; t_mm: number; slenderness: number; slendernessFormula: string }[],
  kv: number,
  fy: number,
  method: AiscMethod,
  e: number,
): AiscFamilyShear {
  const clause = `AISC 360-22 §${section}`;
  const trace: TraceStep[] = [];
  let vn = 0;
  let aw = 0;
  let buckling = false;
  for (const el of elements) {
    const a = el.count * el.b_mm * el.t_mm;
    trace.push(step(clause, `Shear area, ${what}`, el.count > 1 ? `Aw = ${el.count}·b·t` : 'Aw = b·t', `${el.count > 1 ? `${el.count} × ` : ''}${f(el.b_mm)} mm × ${f(el.t_mm)} mm`, a, 'mm²'));
    trace.push(step(clause, 'Slenderness for Cv2', el.slendernessFormula, `kv = ${f(kv)}`, el.slenderness));
    const { cv2, trace: cvStep } = cv2Step(section, el.slenderness, kv, e, fy);
    trace.push(cvStep);
    const part = 0.6 * fy * a * cv2;
    trace.push(step(clause, 'Nominal shear strength', 'Vn = 0.6·Fy·Aw·Cv2', `0.6 × ${f(fy)} MPa × ${f(a)} mm² × ${f(cv2)}`, part / 1000, 'kN'));
    vn += part;
    aw += a;
    buckling ||= cv2 < 1;
  }
  if (elements.length > 1) trace.push(step(clause, 'Nominal shear strength of all flanges', 'Vn = Σ Vn,i', elements.map((el) => `${f(el.b_mm)}×${f(el.t_mm)}`).join(' + '), vn / 1000, 'kN'));
  return available(axis, section, method, aw, vn, buckling, false, trace);
}

/** G2.1(b) for a channel loaded parallel to its web: as the I-shape rule, never case (a). */
function channelWeb(d: Extract<SectionDimensions, { family: 'channel' }>, fabrication: Fabrication, fy: number, method: AiscMethod, params: AiscFamilyParams): AiscFamilyShear {
  const clause = 'AISC 360-22 §G2.1';
  const { depth_mm: dd, webThickness_mm: tw } = d;
  const trace: TraceStep[] = [];
  const aw = dd * tw;
  trace.push(step(clause, 'Web area', 'Aw = d·tw', `${f(dd)} mm × ${f(tw)} mm`, aw, 'mm²'));
  // The channel flange is half of an I flange twice as wide on a web twice as thick (as section-outline.ts draws it).
  const g = flangeGeometry({ width_mm: 2 * d.width_mm, thickness_mm: d.flangeThickness_mm, filletRadius_mm: d.rootRadius_mm, edgeRadius_mm: d.edgeRadius_mm, slope_rad: d.slope_rad }, 2 * tw);
  const k = fabrication === 'rolled' ? g.filletWebTangent_mm : d.flangeThickness_mm;
  const h = dd - 2 * k;
  trace.push(step(clause, fabrication === 'rolled' ? 'Web depth h, rolled channel: clear distance between flanges less the fillets' : 'Web depth h, built-up channel: clear distance between flanges', fabrication === 'rolled' ? 'h = d − 2k' : 'h = d − 2tf', `${f(dd)} − 2 × ${f(k)} mm`, h, 'mm'));
  const aOverH = params.stiffenerSpacing_mm === null ? null : params.stiffenerSpacing_mm / h;
  const kv = webBucklingCoefficientKv(aOverH);
  trace.push(step(clause + '(b)(2)', aOverH === null ? 'Web buckling coefficient, no transverse stiffeners' : 'Web buckling coefficient with transverse stiffeners', aOverH === null ? 'kv = 5.34' : aOverH > 3 ? 'kv = 5.34 (a/h > 3.0)' : 'kv = 5 + 5/(a/h)²', aOverH === null ? '—' : `a/h = ${f(aOverH)}`, kv));
  const hOverTw = h / tw;
  const cv1 = webShearCoefficientCv1(hOverTw, kv, params.e_MPa, fy);
  trace.push(step(clause + '(b)(2)', 'Web shear strength coefficient (G2.1(a) is for rolled I-shapes only)', cv1 === 1 ? 'h/tw ≤ 1.10·√(kv·E/Fy) → Cv1 = 1.0' : 'Cv1 = 1.10·√(kv·E/Fy)/(h/tw)', `h/tw = ${f(hOverTw)}, limit ${f(1.1 * Math.sqrt((kv * params.e_MPa) / fy))}`, cv1));
  const vn = 0.6 * fy * aw * cv1;
  trace.push(step(clause + ' (Eq. G2-1)', 'Nominal shear strength', 'Vn = 0.6·Fy·Aw·Cv1', `0.6 × ${f(fy)} MPa × ${f(aw)} mm² × ${f(cv1)}`, vn / 1000, 'kN'));
  const result = available('major', 'G2.1(b)', method, aw, vn, cv1 < 1, params.stiffenerSpacing_mm !== null, trace);
  trace.push(step('AISC 360-22 §G2.2', 'Tension-field action', 'not used', 'post-buckling strength of stiffened webs is not counted', '—'));
  return result;
}

/** G4 flat width h and wall t of the walls parallel to the shear. */
function boxWall(d: BoxDimensions, axis: ShearAxis, fabrication: Fabrication): { h_mm: number; t_mm: number; rule: string; formula: string; substituted: string } {
  const along = axis === 'major' ? d.depth_mm : d.width_mm;
  const t = axis === 'major' ? d.webThickness_mm : d.flangeThickness_mm;
  const across = axis === 'major' ? d.flangeThickness_mm : d.webThickness_mm;
  const clear = along - 2 * across;
  const ri = d.innerCornerRadius_mm;
  const wall = { t_mm: t };
  let result: { h_mm: number; t_mm: number; rule: string; formula: string; substituted: string };
  if (fabrication === 'welded') {
    result = { ...wall, h_mm: clear, rule: 'clear distance between the flanges of a box section', formula: 'h = D − 2·tf', substituted: `${f(along)} − 2 × ${f(across)} mm` };
  } else if (ri !== undefined) {
    result = { ...wall, h_mm: clear - 2 * ri, rule: 'flat width: clear distance between the flanges less the inside corner radius on each side', formula: 'h = D − 2·tf − 2·ri', substituted: `${f(along)} − 2 × ${f(across)} − 2 × ${f(ri)} mm` };
  } else {
    result = { ...wall, h_mm: along - 3 * t, rule: 'corner radius not known: outside dimension less three wall thicknesses', formula: 'h = D − 3t', substituted: `${f(along)} − 3 × ${f(t)} mm` };
  }
  if (!(result.h_mm > 0)) {
    throw new SectionInputError(ri !== undefined ? 'innerCornerRadius_mm' : axis === 'major' ? 'depth_mm' : 'width_mm', `leaves the ${axis === 'major' ? 'webs' : 'flanges'} of the box no flat width (h = ${f(result.h_mm)} mm)`);
  }
  return result;
}

function roundHss(d: Extract<SectionDimensions, { family: 'tube' }>, area_mm2: number, fy: number, method: AiscMethod, params: AiscFamilyParams): AiscFamilyShear {
  const clause = 'AISC 360-22 §G5';
  const { diameter_mm: D, wallThickness_mm: t } = d;
  const e = params.e_MPa;
  const trace: TraceStep[] = [];
  const dOverT = D / t;
  trace.push(step(clause, 'Diameter-to-thickness ratio', 'D/t', `${f(D)} / ${f(t)}`, dOverT));
  const second = (0.78 * e) / dOverT ** 1.5;
  const lv = params.shearLength_mm;
  let first = 0;
  if (lv === null) {
    trace.push(step(clause + ' (Eq. G5-2a)', 'Shear buckling with the shear length', 'not used', 'Lv not given: G5-2a falls as Lv grows, so leaving it out (Lv → ∞) is conservative', 0, 'MPa'));
  } else {
    first = (1.6 * e) / (Math.sqrt(lv / D) * dOverT ** 1.25);
    trace.push(step(clause + ' (Eq. G5-2a)', 'Shear buckling with the shear length Lv', '1.60·E/(√(Lv/D)·(D/t)^(5/4))', `1.60 × ${f(e, 6)} / (√(${f(lv)} / ${f(D)}) × ${f(dOverT)}^1.25)`, first, 'MPa'));
  }
  trace.push(step(clause + ' (Eq. G5-2b)', 'Shear buckling independent of length', '0.78·E/(D/t)^(3/2)', `0.78 × ${f(e, 6)} / ${f(dOverT)}^1.5`, second, 'MPa'));
  const fcr = Math.min(Math.max(first, second), 0.6 * fy);
  trace.push(step(clause, 'Critical stress', 'Fcr = max(G5-2a, G5-2b) ≤ 0.6·Fy', `min(max(${f(first)}, ${f(second)}), 0.6 × ${f(fy)}) MPa`, fcr, 'MPa'));
  const aw = area_mm2 / 2;
  const vn = fcr * aw;
  trace.push(step(clause + ' (Eq. G5-1)', 'Nominal shear strength', 'Vn = Fcr·Ag/2', `${f(fcr)} MPa × ${f(area_mm2)} mm² / 2`, vn / 1000, 'kN'));
  return available('major', 'G5', method, aw, vn, fcr < 0.6 * fy, false, trace);
}

/**
 * AISC shear strength of a section of any family on one axis, or why Chapter G has none. `area_mm2` is the gross area
 * (used by G5). I-shapes loaded parallel to the web go through the I-section engine unchanged.
 */
export function aiscFamilyShearCapacity(
  d: SectionDimensions,
  axis: ShearAxis,
  area_mm2: number,
  fabrication: Fabrication,
  fy_MPa: number,
  method: AiscMethod,
  params: AiscFamilyParams,
): ShearRule<AiscFamilyShear> {
  const e = params.e_MPa;
  const ok = (capacity: AiscFamilyShear): ShearRule<AiscFamilyShear> => ({ applicable: true, capacity });
  const weakAxis = (flanges: { b_mm: number; t_mm: number }[], half: boolean, what: string): AiscFamilyShear =>
    plateElements(
      axis,
      'G6',
      what,
      flanges.map((fl) => ({ count: 1, b_mm: fl.b_mm, t_mm: fl.t_mm, slenderness: half ? fl.b_mm / (2 * fl.t_mm) : fl.b_mm / fl.t_mm, slendernessFormula: half ? 'h/tw = bf/(2·tf)' : 'h/tw = bf/tf' })),
      1.2,
      fy_MPa,
      method,
      e,
    );
  switch (d.family) {
    case 'I': {
      if (axis === 'minor') return ok(weakAxis([d.topFlange, d.bottomFlange].map((fl) => ({ b_mm: fl.width_mm, t_mm: fl.thickness_mm })), true, 'one flange of an I-shape, weak-axis shear'));
      const c = aiscShearCapacity(sectionProperties({ ...d, fabrication }), fy_MPa, method, params);
      return ok({ axis, method, section: `G2.1(${c.case})`, aw_mm2: c.aw_mm2, vn_N: c.vn_N, resistanceFactor: c.resistanceFactor, available_N: c.available_N, webBucklingGoverns: c.webBucklingGoverns, tensionFieldNotCounted: params.stiffenerSpacing_mm !== null, beyondProportionLimit: c.beyondProportionLimit, trace: c.trace });
    }
    case 'channel':
      if (axis === 'minor') {
        const fl = { b_mm: d.width_mm, t_mm: d.flangeThickness_mm };
        return ok(weakAxis([fl, fl], false, 'one flange of a channel, weak-axis shear'));
      }
      return ok(channelWeb(d, fabrication, fy_MPa, method, params));
    case 'tee':
      if (axis === 'minor') return ok(weakAxis([{ b_mm: d.width_mm, t_mm: d.flangeThickness_mm }], true, 'the flange of a tee, weak-axis shear'));
      return ok(plateElements(axis, 'G3', 'tee stem', [{ count: 1, b_mm: d.depth_mm, t_mm: d.webThickness_mm, slenderness: d.depth_mm / d.webThickness_mm, slendernessFormula: 'h/tw = d/tw' }], 1.2, fy_MPa, method, e));
    case 'angle': {
      const b = axis === 'major' ? d.depth_mm : d.width_mm;
      const t = axis === 'major' ? d.thickness_mm : (d.widthLegThickness_mm ?? d.thickness_mm);
      return ok(plateElements(axis, 'G3', `single angle, the leg parallel to the shear`, [{ count: 1, b_mm: b, t_mm: t, slenderness: b / t, slendernessFormula: 'h/tw = b/t' }], 1.2, fy_MPa, method, e));
    }
    case 'box': {
      const wall = boxWall(d, axis, fabrication);
      const result = plateElements(axis, 'G4', `${fabrication === 'welded' ? 'box section' : 'rectangular HSS'}, both walls parallel to the shear; h = ${wall.rule} (${wall.formula} = ${wall.substituted})`, [{ count: 2, b_mm: wall.h_mm, t_mm: wall.t_mm, slenderness: wall.h_mm / wall.t_mm, slendernessFormula: 'h/tw = h/t' }], 5, fy_MPa, method, e);
      return ok(result);
    }
    case 'tube':
      return ok({ ...roundHss(d, area_mm2, fy_MPa, method, params), axis });
    case 'plate':
    case 'other':
      return { applicable: false, reason: `no shear rule in AISC 360-22 Chapter G for this family (${d.family === 'other' ? d.description : SECTION_FAMILY_LABELS[d.family]})` };
  }
}
