/**
 * Exact section properties of an I-section about its major axis, from the width b(y) over the depth.
 *
 * The outline is split into horizontal bands where the width has one closed form,
 *   b(y) = c0 + c1·y + k·√(r² − (y − yc)²),
 * which covers plates, tapered flange faces and every circular arc (root fillets, toe radii). Area, first and second
 * moments then follow from exact antiderivatives (any calculus table: ∫√(r²−u²), ∫u√(r²−u²), ∫u²√(r²−u²)), so
 * there is no discretisation error. y is measured up from the underside of the bottom flange.
 */
import { type FlangeGeometry, type ISectionInput, validateSection } from './section';

interface WidthBand {
  readonly from_mm: number;
  readonly to_mm: number;
  readonly c0: number;
  readonly c1: number;
  readonly k: number;
  readonly r: number;
  readonly yc: number;
}

export interface SectionProperties {
  readonly input: ISectionInput;
  readonly depth_mm: number;
  readonly area_mm2: number;
  /** Second moment of area about the major (elastic neutral) axis. */
  readonly iMajor_mm4: number;
  readonly neutralAxisFromBottom_mm: number;
  readonly plasticNeutralAxisFromBottom_mm: number;
  readonly plasticModulusMajor_mm3: number;
  /** Q at the elastic neutral axis: the largest first moment of the section. */
  readonly qMax_mm3: number;
  /** Level of the underside of the top flange / top of the bottom flange (nominal thicknesses). */
  readonly topJunctionFromBottom_mm: number;
  readonly bottomJunctionFromBottom_mm: number;
  /** Q of everything above the top junction / below the bottom junction. */
  readonly qTopJunction_mm3: number;
  readonly qBottomJunction_mm3: number;
  /** hw = d − tf,top − tf,bot: clear distance between the flanges. */
  readonly clearWebDepth_mm: number;
  /** Clear distance between the flanges less the fillets, i.e. AISC's h = d − 2k for a rolled shape. */
  readonly webDepthLessFillets_mm: number;
  /** hw·tw. */
  readonly webArea_mm2: number;
  /**
   * EN 1993-1-1 §6.2.6(3): rolled I/H, load parallel to the web: A − 2b·tf + (tw + 2r)·tf, taken flange by flange for
   * unequal flanges; welded: hw·tw. The lower bound η·hw·tw and the factor η for welded webs are applied by the
   * EN check, because η is a national-annex parameter.
   */
  readonly avEn_mm2: number;
  /** AISC 360-22 §G2.1: Aw = d·tw. */
  readonly awAisc_mm2: number;
  /** Band limits of the width function, bottom to top: the levels where b(y) or its slope changes. */
  readonly levels_mm: readonly number[];
  /** Q(y): first moment about the neutral axis of the part of the section beyond level y (always ≥ 0). */
  firstMoment_mm3(y_mm: number): number;
  /** Width b(y); at a level where the width jumps, `side` says which value. Zero outside the section. */
  widthAt_mm(y_mm: number, side?: 'below' | 'above'): number;
}

/** The section's properties as plain numbers, without the input and the sampling functions (what an API sends). */
export type SectionPropertyValues = Omit<SectionProperties, 'input' | 'levels_mm' | 'firstMoment_mm3' | 'widthAt_mm'>;

export function sectionPropertyValues(props: SectionProperties): SectionPropertyValues {
  const { input: _input, levels_mm: _levels, firstMoment_mm3: _q, widthAt_mm: _b, ...values } = props;
  return values;
}

const square = (x: number): number => x * x;

function clampUnit(x: number): number {
  return x > 1 ? 1 : x < -1 ? -1 : x;
}

/** Half-width bands of one flange, from its outer face inward (z), in the form a0 + a1·z + s·√(r² − (z − zc)²). */
function flangeBands(g: FlangeGeometry): { from: number; to: number; a0: number; a1: number; s: number; r: number; zc: number }[] {
  const bands = [
    { from: 0, to: g.edgeCentre_mm, a0: g.halfWidth_mm, a1: 0, s: 0, r: 0, zc: 0 },
    { from: g.edgeCentre_mm, to: g.edgeFaceTangent_mm, a0: g.halfWidth_mm - g.edgeRadius_mm, a1: 0, s: 1, r: g.edgeRadius_mm, zc: g.edgeCentre_mm },
    { from: g.filletFaceTangent_mm, to: g.filletWebTangent_mm, a0: g.webHalf_mm + g.filletRadius_mm, a1: 0, s: -1, r: g.filletRadius_mm, zc: g.filletWebTangent_mm },
  ];
  if (g.slopeTan > 0) {
    // Inner face of a tapered flange, between the two roundings: x = xw + (T_root − z)/tan α.
    bands.splice(2, 0, {
      from: g.edgeFaceTangent_mm,
      to: g.filletFaceTangent_mm,
      a0: g.webHalf_mm + g.rootThickness_mm / g.slopeTan,
      a1: -1 / g.slopeTan,
      s: 0,
      r: 0,
      zc: 0,
    });
  }
  return bands.filter((b) => b.to - b.from > 1e-12);
}

function buildBands(input: ISectionInput, top: FlangeGeometry, bottom: FlangeGeometry): WidthBand[] {
  const d = input.depth_mm;
  const bands: WidthBand[] = flangeBands(bottom).map((b) => ({
    from_mm: b.from,
    to_mm: b.to,
    c0: 2 * b.a0,
    c1: 2 * b.a1,
    k: 2 * b.s,
    r: b.r,
    yc: b.zc,
  }));
  bands.push({ from_mm: bottom.filletWebTangent_mm, to_mm: d - top.filletWebTangent_mm, c0: input.webThickness_mm, c1: 0, k: 0, r: 0, yc: 0 });
  // Mirror the top flange: z = d − y.
  for (const b of flangeBands(top).reverse()) {
    bands.push({ from_mm: d - b.to, to_mm: d - b.from, c0: 2 * (b.a0 + b.a1 * d), c1: -2 * b.a1, k: 2 * b.s, r: b.r, yc: d - b.zc });
  }
  return bands.filter((b) => b.to_mm - b.from_mm > 1e-12);
}

function widthOf(band: WidthBand, y: number): number {
  const arc = band.k === 0 ? 0 : band.k * Math.sqrt(Math.max(0, square(band.r) - square(y - band.yc)));
  return band.c0 + band.c1 * y + arc;
}

interface Moments {
  area: number;
  first: number;
  second: number;
}

/** ∫ b(y)·{1, y, y²} dy over [a, c] inside one band, exactly. */
function bandMoments(band: WidthBand, a: number, c: number): Moments {
  const span = c - a;
  const sum = c + a;
  const sq = c * c + a * a;
  let area = band.c0 * span + (band.c1 * span * sum) / 2;
  let first = (band.c0 * span * sum) / 2 + (band.c1 * span * (sq + a * c)) / 3;
  let second = (band.c0 * span * (sq + a * c)) / 3 + (band.c1 * span * sum * sq) / 4;
  if (band.k !== 0) {
    const r = band.r;
    const prim = (y: number): [number, number, number] => {
      const u = y - band.yc;
      const root = Math.sqrt(Math.max(0, r * r - u * u));
      const angle = Math.asin(clampUnit(u / r));
      return [(u * root + r * r * angle) / 2, -(root * root * root) / 3, (u * (2 * u * u - r * r) * root) / 8 + (r ** 4 * angle) / 8];
    };
    const [f0c, f1c, f2c] = prim(c);
    const [f0a, f1a, f2a] = prim(a);
    const d0 = f0c - f0a;
    const d1 = f1c - f1a;
    const d2 = f2c - f2a;
    area += band.k * d0;
    first += band.k * (d1 + band.yc * d0);
    second += band.k * (d2 + 2 * band.yc * d1 + band.yc * band.yc * d0);
  }
  return { area, first, second };
}

function findBand(bands: readonly WidthBand[], y: number, side: 'below' | 'above'): number {
  for (let i = 0; i < bands.length; i++) {
    const b = bands[i];
    if (side === 'above' ? y < b.to_mm : y <= b.to_mm) return i;
  }
  return bands.length - 1;
}

/** Moments of the part of the section below level y. */
function momentsBelow(bands: readonly WidthBand[], cumulative: readonly Moments[], y: number): Moments {
  const i = findBand(bands, y, 'above');
  const before = i === 0 ? { area: 0, first: 0, second: 0 } : cumulative[i - 1];
  const part = bandMoments(bands[i], bands[i].from_mm, Math.min(Math.max(y, bands[i].from_mm), bands[i].to_mm));
  return { area: before.area + part.area, first: before.first + part.first, second: before.second + part.second };
}

/** Properties of a validated I-section (throws SectionInputError for bad geometry). */
export function sectionProperties(input: ISectionInput): SectionProperties {
  const { top, bottom } = validateSection(input);
  const d = input.depth_mm;
  const tw = input.webThickness_mm;
  const bands = buildBands(input, top, bottom);
  const cumulative: Moments[] = [];
  let running: Moments = { area: 0, first: 0, second: 0 };
  for (const band of bands) {
    const m = bandMoments(band, band.from_mm, band.to_mm);
    running = { area: running.area + m.area, first: running.first + m.first, second: running.second + m.second };
    cumulative.push(running);
  }
  const total = running;
  const yNa = total.first / total.area;
  const iMajor = total.second - total.area * yNa * yNa;

  const firstMoment_mm3 = (y_mm: number): number => {
    if (!(y_mm > 0 && y_mm < d)) return 0;
    const below = momentsBelow(bands, cumulative, y_mm);
    // Take whichever side of the cut is on the far side from the axis, so the result is a sum of like signs.
    const q = y_mm >= yNa ? total.first - below.first - yNa * (total.area - below.area) : yNa * below.area - below.first;
    return Math.max(0, q);
  };
  const widthAt_mm = (y_mm: number, side: 'below' | 'above' = 'above'): number =>
    y_mm < 0 || y_mm > d ? 0 : widthOf(bands[findBand(bands, y_mm, side)], y_mm);

  // Plastic neutral axis: the level that halves the area (bisection; the area below is monotonic in y).
  let lo = 0;
  let hi = d;
  for (let step = 0; step < 200 && hi - lo > 1e-12 * d; step++) {
    const mid = (lo + hi) / 2;
    if (momentsBelow(bands, cumulative, mid).area < total.area / 2) lo = mid;
    else hi = mid;
  }
  const yPl = (lo + hi) / 2;
  const belowPl = momentsBelow(bands, cumulative, yPl);
  const plasticModulus = total.first - 2 * belowPl.first + yPl * (2 * belowPl.area - total.area);

  const tfTop = input.topFlange.thickness_mm;
  const tfBot = input.bottomFlange.thickness_mm;
  const hw = d - tfTop - tfBot;
  const flangeDeduction = (f: ISectionInput['topFlange']): number =>
    f.width_mm * f.thickness_mm - ((tw + 2 * f.filletRadius_mm) * f.thickness_mm) / 2;
  const avEn =
    input.fabrication === 'rolled' ? total.area - flangeDeduction(input.topFlange) - flangeDeduction(input.bottomFlange) : hw * tw;

  const levels = [bands[0].from_mm, ...bands.map((b) => b.to_mm)];
  return {
    input,
    depth_mm: d,
    area_mm2: total.area,
    iMajor_mm4: iMajor,
    neutralAxisFromBottom_mm: yNa,
    plasticNeutralAxisFromBottom_mm: yPl,
    plasticModulusMajor_mm3: plasticModulus,
    qMax_mm3: firstMoment_mm3(yNa),
    topJunctionFromBottom_mm: d - tfTop,
    bottomJunctionFromBottom_mm: tfBot,
    qTopJunction_mm3: firstMoment_mm3(d - tfTop),
    qBottomJunction_mm3: firstMoment_mm3(tfBot),
    clearWebDepth_mm: hw,
    webDepthLessFillets_mm: d - top.filletWebTangent_mm - bottom.filletWebTangent_mm,
    webArea_mm2: hw * tw,
    avEn_mm2: avEn,
    awAisc_mm2: d * tw,
    levels_mm: levels,
    firstMoment_mm3,
    widthAt_mm,
  };
}
