/**
 * Shear resistance of every section family on both axes by EN 1993-1-1 §6.2.6 and, for slender webs, EN 1993-1-5 §5.
 *
 * Shear areas of §6.2.6(3) (EN 1993-1-1:2005 with corrigendum AC:2009, letters and formulae recalled from memory):
 *   (a) rolled I/H, load ∥ web: A − 2b·tf + (tw + 2r)·tf ≥ η·hw·tw       (the I-section engine, en-1993.ts)
 *   (b) rolled channel, load ∥ web: A − 2b·tf + (tw + r)·tf
 *   (c) rolled T, load ∥ web: 0.9·(A − b·tf) (AC:2009; the 2005 print read A − b·tf + (tw + 2r)·tf/2, which is larger);
 *       welded T, load ∥ web: tw·(h − tf/2)
 *   (d) welded I, H and box, load ∥ web: η·Σ(hw·tw)                        (welded I: en-1993.ts)
 *   (e) welded I, H, channel and box, load ∥ flanges: A − Σ(hw·tw)
 *   (f) rolled RHS of uniform thickness: load ∥ depth A·h/(b + h), load ∥ width A·b/(b + h)
 *   (g) CHS and tubes of uniform thickness: 2A/π
 *   Vpl,Rd = Av·(fy/√3)/γM0 (6.18). Plates of box and channel webs with hw/t > 72ε/η: EN 1993-1-5 §5 (Vbf,Rd not
 *   counted, as in en-1993.ts). Angles, plates and other shapes: §6.2.6(3) gives no shear area, so no capacity.
 * Verify against the edition and national annex in force.
 */
import { enShearCapacity, type EnShearParams, epsilonOf, shearBucklingCoefficientKTau, webContributionFactorChiW } from './en-1993';
import type { Fabrication } from './section';
import { type IDimensions, SECTION_FAMILY_LABELS, type SectionDimensions } from './section-family';
import { sectionProperties } from './section-properties';
import type { ShearAxis, ShearRule } from './shear-axis';
import { formatNumber as f, step, type TraceStep } from './trace';

/** The plates that carry the shear as webs, all alike: EN 1993-1-5 §5 and §7.1 work on these. */
export interface WebPlates {
  count: number;
  hw_mm: number;
  t_mm: number;
}

export interface EnFamilyShear {
  axis: ShearAxis;
  av_mm2: number;
  vplRd_N: number;
  /** Webs checked for shear buckling, or null where EN 1993-1-5 §5 does not apply (flanges, stems, tubes). */
  webs: WebPlates | null;
  bucklingChecked: boolean;
  /** Web contribution Vbw,Rd (all webs) when buckling is checked: the η̄3 denominator of EN 1993-1-5 §7.1. */
  vbwRd_N: number | null;
  vbRd_N: number | null;
  vRd_N: number;
  webBucklingGoverns: boolean;
  elasticStressLimit_MPa: number;
  trace: TraceStep[];
}

const CLAUSE = 'EN 1993-1-1 §6.2.6';
const CLAUSE_1_5 = 'EN 1993-1-5 §5';
const SQRT3 = Math.sqrt(3);

interface ShearArea {
  av_mm2: number;
  webs: WebPlates | null;
  steps: TraceStep[];
}

function none(reason: string): ShearRule<never> {
  return { applicable: false, reason };
}

/** The §6.2.6(3) shear area of a family other than I (those come from en-1993.ts), or why there is none. */
function shearArea(d: Exclude<SectionDimensions, IDimensions>, axis: ShearAxis, area_mm2: number, fabrication: Fabrication, eta: number): ShearArea | string {
  const A = f(area_mm2);
  switch (d.family) {
    case 'channel': {
      const { depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf, rootRadius_mm: r } = d;
      const hw = h - 2 * tf;
      if (axis === 'minor') {
        const av = area_mm2 - hw * tw;
        return {
          av_mm2: av,
          webs: null,
          steps: [step(CLAUSE + '(3)(e)', `Shear area, ${fabrication} channel, load parallel to the flanges (the rule is written for welded sections; applied to rolled ones as common practice, no source)`, 'Av = A − hw·tw', `${A} − ${f(hw)} × ${f(tw)} mm²`, av, 'mm²')],
        };
      }
      if (fabrication === 'welded') return 'no shear rule in EN 1993-1-1 §6.2.6(3) for a welded channel loaded parallel to its web';
      const av = area_mm2 - 2 * b * tf + (tw + r) * tf;
      return {
        av_mm2: av,
        webs: { count: 1, hw_mm: hw, t_mm: tw },
        steps: [step(CLAUSE + '(3)(b)', 'Shear area, rolled channel, load parallel to the web', 'Av = A − 2b·tf + (tw + r)·tf', `${A} − 2 × ${f(b)} × ${f(tf)} + (${f(tw)} + ${f(r)}) × ${f(tf)} mm²`, av, 'mm²')],
      };
    }
    case 'tee': {
      if (axis === 'minor') return 'no shear rule in EN 1993-1-1 §6.2.6(3) for a tee loaded parallel to its flange';
      const { depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf } = d;
      if (fabrication === 'welded') {
        const av = tw * (h - tf / 2);
        return { av_mm2: av, webs: null, steps: [step(CLAUSE + '(3)(c)', 'Shear area, welded T-section, load parallel to the web', 'Av = tw·(h − tf/2)', `${f(tw)} × (${f(h)} − ${f(tf)}/2) mm`, av, 'mm²')] };
      }
      const av = 0.9 * (area_mm2 - b * tf);
      return {
        av_mm2: av,
        webs: null,
        steps: [
          step(CLAUSE + '(3)(c)', 'Shear area, rolled T-section, load parallel to the web (EN 1993-1-1:2005/AC:2009, from memory; the 2005 print gave the larger A − b·tf + (tw + 2r)·tf/2)', 'Av = 0.9·(A − b·tf)', `0.9 × (${A} − ${f(b)} × ${f(tf)}) mm²`, av, 'mm²'),
          step(CLAUSE_1_5, 'Shear buckling of the stem', 'not checked', 'EN 1993-1-5 §5 covers webs held by flanges on both edges; a tee stem is an outstand', '—'),
        ],
      };
    }
    case 'box': {
      const { depth_mm: h, width_mm: b, webThickness_mm: tw, flangeThickness_mm: tf } = d;
      const uniform = tw === tf;
      // The walls parallel to the shear act as webs: the webs for 'major', the flanges for 'minor'.
      const webs: WebPlates = axis === 'major' ? { count: 2, hw_mm: h - 2 * tf, t_mm: tw } : { count: 2, hw_mm: b - 2 * tw, t_mm: tf };
      if (fabrication === 'rolled' && uniform) {
        const along = axis === 'major' ? h : b;
        const av = (area_mm2 * along) / (b + h);
        return {
          av_mm2: av,
          webs,
          steps: [step(CLAUSE + '(3)(f)', `Shear area, rolled hollow section of uniform thickness, load parallel to the ${axis === 'major' ? 'depth' : 'width'}`, axis === 'major' ? 'Av = A·h/(b + h)' : 'Av = A·b/(b + h)', `${A} × ${f(along)} / (${f(b)} + ${f(h)}) mm²`, av, 'mm²')],
        };
      }
      const why = fabrication === 'rolled' ? 'walls of unequal thickness, taken as welded plates' : 'welded box';
      if (axis === 'major') {
        const av = eta * 2 * webs.hw_mm * tw;
        return { av_mm2: av, webs, steps: [step(CLAUSE + '(3)(d)', `Shear area, ${why}, load parallel to the webs`, 'Av = η·Σ(hw·tw)', `${f(eta)} × 2 × ${f(webs.hw_mm)} × ${f(tw)} mm²`, av, 'mm²')] };
      }
      const hwWebs = h - 2 * tf;
      const av = area_mm2 - 2 * hwWebs * tw;
      return { av_mm2: av, webs, steps: [step(CLAUSE + '(3)(e)', `Shear area, ${why}, load parallel to the flanges`, 'Av = A − Σ(hw·tw)', `${A} − 2 × ${f(hwWebs)} × ${f(tw)} mm²`, av, 'mm²')] };
    }
    case 'tube': {
      const av = (2 * area_mm2) / Math.PI;
      return {
        av_mm2: av,
        webs: null,
        steps: [
          step(CLAUSE + '(3)(g)', 'Shear area, circular hollow section of uniform thickness', 'Av = 2A/π', `2 × ${A} / π mm²`, av, 'mm²'),
          step(CLAUSE_1_5, 'Shear buckling of the wall', 'not checked', 'a tube wall is a shell (EN 1993-1-6), outside EN 1993-1-5 §5', '—'),
        ],
      };
    }
    case 'angle':
    case 'plate':
    case 'other':
      return `no shear rule in EN 1993-1-1 §6.2.6(3) for this family (${d.family === 'other' ? d.description : SECTION_FAMILY_LABELS[d.family]})`;
  }
}

/** §6.2.6(3)(e) for I/H sections loaded parallel to the flanges, applied to rolled ones too (common practice). */
function iFlangeShearArea(area_mm2: number, hw_mm: number, tw_mm: number, fabrication: Fabrication): ShearArea {
  const av = area_mm2 - hw_mm * tw_mm;
  return {
    av_mm2: av,
    webs: null,
    steps: [
      step(CLAUSE + '(3)(e)', `Shear area, ${fabrication} I/H section, load parallel to the flanges${fabrication === 'rolled' ? ' (the rule is written for welded sections; applied to rolled ones as common practice, no source)' : ''}`, 'Av = A − hw·tw', `${f(area_mm2)} − ${f(hw_mm)} × ${f(tw_mm)} mm²`, av, 'mm²'),
    ],
  };
}

interface WebBuckling {
  bucklingChecked: boolean;
  vbwRd_N: number | null;
  vbRd_N: number | null;
}

/** §6.2.6(6) trigger and EN 1993-1-5 §5 for `webs` alike, each with its own hw and t (stiffeners at supports or at a). */
export function enWebShearBuckling(webs: WebPlates, fy_MPa: number, params: EnShearParams, trace: TraceStep[]): WebBuckling {
  const { count, hw_mm: hw, t_mm: t } = webs;
  const { eta, gammaM1 } = params;
  const epsilon = epsilonOf(fy_MPa);
  const aOverHw = params.stiffenerSpacing_mm === null ? null : params.stiffenerSpacing_mm / hw;
  const kTau = aOverHw === null ? null : shearBucklingCoefficientKTau(aOverHw);
  const limit = kTau === null ? (72 * epsilon) / eta : (31 * epsilon * Math.sqrt(kTau)) / eta;
  const slenderness = hw / t;
  const checked = slenderness > limit;
  trace.push(
    step(
      CLAUSE + '(6)',
      checked ? 'Web slenderness above the limit: shear buckling to EN 1993-1-5 §5' : 'Web slenderness within the limit: no shear buckling check',
      kTau === null ? 'hw/t vs 72·ε/η' : 'hw/t vs 31·ε·√kτ/η',
      `${f(hw)} / ${f(t)} = ${f(slenderness)} ${checked ? '>' : '≤'} ${f(limit)} (ε = ${f(epsilon)})`,
      limit,
    ),
  );
  if (!checked) return { bucklingChecked: false, vbwRd_N: null, vbRd_N: null };
  if (kTau !== null) {
    trace.push(step('EN 1993-1-5 A.3', 'Shear buckling coefficient', (aOverHw as number) >= 1 ? 'kτ = 5.34 + 4.00·(hw/a)²' : 'kτ = 4.00 + 5.34·(hw/a)²', `a/hw = ${f(aOverHw as number)}`, kTau));
  }
  const lambdaW = kTau === null ? hw / (86.4 * t * epsilon) : hw / (37.4 * t * epsilon * Math.sqrt(kTau));
  trace.push(
    kTau === null
      ? step(CLAUSE_1_5 + '.3 (5.5)', 'Web slenderness, transverse stiffeners at supports only', 'λw = hw/(86.4·t·ε)', `${f(hw)} / (86.4 × ${f(t)} × ${f(epsilon)})`, lambdaW)
      : step(CLAUSE_1_5 + '.3 (5.6)', 'Web slenderness with transverse stiffeners', 'λw = hw/(37.4·t·ε·√kτ)', `${f(hw)} / (37.4 × ${f(t)} × ${f(epsilon)} × √${f(kTau)})`, lambdaW),
  );
  const chiW = webContributionFactorChiW(lambdaW, eta, params.endPost);
  trace.push(step(CLAUSE_1_5 + '.3 Table 5.1', `Web contribution factor, ${params.endPost} end post`, 'χw (Table 5.1)', `λw = ${f(lambdaW)}, η = ${f(eta)}`, chiW));
  const vbw = (count * chiW * fy_MPa * hw * t) / (SQRT3 * gammaM1);
  trace.push(step(CLAUSE_1_5 + '.2 (5.2)', `Web contribution of ${count} web${count > 1 ? 's' : ''}`, 'Vbw,Rd = Σ χw·fyw·hw·t/(√3·γM1)', `${count} × ${f(chiW)} × ${f(fy_MPa)} × ${f(hw)} × ${f(t)} / (√3 × ${f(gammaM1)})`, vbw / 1000, 'kN'));
  trace.push(step(CLAUSE_1_5 + '.4', 'Flange contribution', 'Vbf,Rd = 0 (not counted)', 'omitting it is conservative', 0, 'kN'));
  const cap = (count * eta * fy_MPa * hw * t) / (SQRT3 * gammaM1);
  const vb = Math.min(vbw, cap);
  trace.push(step(CLAUSE_1_5 + '.2 (5.1)', 'Shear buckling resistance', 'Vb,Rd = Vbw,Rd ≤ Σ η·fyw·hw·t/(√3·γM1)', `min(${f(vbw / 1000)}, ${f(cap / 1000)}) kN`, vb / 1000, 'kN'));
  return { bucklingChecked: true, vbwRd_N: vbw, vbRd_N: vb };
}

function finish(axis: ShearAxis, area: ShearArea, fy_MPa: number, params: EnShearParams): EnFamilyShear {
  const trace = [...area.steps];
  const vpl = (area.av_mm2 * fy_MPa) / SQRT3 / params.gammaM0;
  trace.push(step(CLAUSE + ' (6.18)', 'Plastic shear resistance', 'Vpl,Rd = Av·(fy/√3)/γM0', `${f(area.av_mm2)} mm² × ${f(fy_MPa)} MPa / √3 / ${f(params.gammaM0)}`, vpl / 1000, 'kN'));
  const buckling = area.webs ? enWebShearBuckling(area.webs, fy_MPa, params, trace) : { bucklingChecked: false, vbwRd_N: null, vbRd_N: null };
  const vRd = buckling.vbRd_N === null ? vpl : Math.min(vpl, buckling.vbRd_N);
  trace.push(
    step(
      buckling.bucklingChecked ? `${CLAUSE}, ${CLAUSE_1_5}` : CLAUSE,
      'Design shear resistance',
      buckling.bucklingChecked ? 'VRd = min(Vpl,Rd, Vb,Rd)' : 'VRd = Vpl,Rd',
      buckling.bucklingChecked ? `min(${f(vpl / 1000)}, ${f((buckling.vbRd_N as number) / 1000)}) kN` : `${f(vpl / 1000)} kN`,
      vRd / 1000,
      'kN',
    ),
  );
  return {
    axis,
    av_mm2: area.av_mm2,
    vplRd_N: vpl,
    webs: area.webs,
    ...buckling,
    vRd_N: vRd,
    webBucklingGoverns: buckling.vbRd_N !== null && buckling.vbRd_N < vpl,
    elasticStressLimit_MPa: fy_MPa / (SQRT3 * params.gammaM0),
    trace,
  };
}

/**
 * EN shear resistance of a section of any family on one axis. `area_mm2` is the section's area (from its outline; for
 * an I it is recomputed exactly). I-sections loaded parallel to the web go through the I-section engine unchanged.
 */
export function enFamilyShearCapacity(
  d: SectionDimensions,
  axis: ShearAxis,
  area_mm2: number,
  fabrication: Fabrication,
  fy_MPa: number,
  params: EnShearParams,
): ShearRule<EnFamilyShear> {
  if (d.family === 'I') {
    const props = sectionProperties({ ...d, fabrication });
    if (axis === 'minor') return { applicable: true, capacity: finish(axis, iFlangeShearArea(props.area_mm2, props.clearWebDepth_mm, d.webThickness_mm, fabrication), fy_MPa, params) };
    const en = enShearCapacity(props, fy_MPa, params);
    return {
      applicable: true,
      capacity: {
        axis,
        av_mm2: en.av_mm2,
        vplRd_N: en.vplRd_N,
        webs: { count: 1, hw_mm: props.clearWebDepth_mm, t_mm: d.webThickness_mm },
        bucklingChecked: en.bucklingChecked,
        vbwRd_N: en.vbRd_N,
        vbRd_N: en.vbRd_N,
        vRd_N: en.vRd_N,
        webBucklingGoverns: en.webBucklingGoverns,
        elasticStressLimit_MPa: en.elasticStressLimit_MPa,
        trace: en.trace,
      },
    };
  }
  const area = shearArea(d, axis, area_mm2, fabrication, params.eta);
  return typeof area === 'string' ? none(area) : { applicable: true, capacity: finish(axis, area, fy_MPa, params) };
}
