/**
 * The two figures of a calculation sheet as plain data for SVG: the section to scale with its dimensions, and τ(y)
 * over the depth beside it on the same vertical scale, so each stress sits level with the part of the section that
 * carries it.
 *
 * Both figures draw in section millimetres with y pointing down the page (SVG) and the underside of the section at
 * svgY = depth. Their width and height attributes are paper millimetres at a drawing-office scale 1:n, so a print is to
 * scale; text and arrow sizes are paper sizes multiplied by n, so they print the same at every scale.
 */
import type { FamilySheetSection, FamilySheetStress } from '../../../../server/checks/checks-api-types';
import type { Standard } from '../../../../server/engine/check';
import type { Point2_mm } from '../../../../server/engine/section-family';
import type { SectionProperties } from '../../../../server/engine/section-properties';
import { outlineAlongShear } from '../../../../server/engine/shear-axis';
import { formatNumber } from '../../../../server/engine/trace';
import { type SectionDimensionMark, sectionDimensionMarks, WEB_AVERAGE_FORMULAS } from '../../../../server/reports/section-dimension-marks';
import { drawingScale, niceTicks, PT_PER_MM, sectionOutline_mm } from '../../../../server/reports/section-outline';

/**
 * Paper room for the section and the width of the τ axis (mm), chosen so that both figures with their margins stay
 * within the 186 mm an A4 page leaves inside 12 mm margins.
 */
export const SECTION_BOX_MM = { width: 62, height: 125 } as const;
export const PLOT_WIDTH_MM = 50;
/** Paper sizes (mm) of text, arrowheads, and the margins that hold the dimensions and labels. */
export const TEXT_MM = 2.6;
const ARROW_MM = 1.6;
const MARGIN_MM = { top: 12, bottom: 12, left: 16, right: 18 } as const;
const PLOT_MARGIN_MM = { left: 8, right: 30 } as const;

export interface FigureFrame {
  /** The drawing scale 1:n. */
  scale: number;
  depth_mm: number;
  /** Top of the viewBox (negative: room above the section) and its height, in section millimetres. */
  viewTop: number;
  viewHeight: number;
  /** Paper height (mm) of both figures. */
  heightPaper_mm: number;
}

export interface Segment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface DimensionLine extends Segment {
  /** I-sections: 'd', 'b-top', 'b-bottom', 'tf', 'tw', 'r'; other families: SectionDimensionMark keys. */
  key: string;
  label: string;
  labelX: number;
  labelY: number;
  anchor: 'start' | 'middle' | 'end';
  /** Text turned to read upwards along a vertical dimension line. */
  vertical: boolean;
  /** Extension lines from the section to the dimension line. */
  extensions: Segment[];
  /** Arrowheads at the ends of the line (a leader has one, at its start). */
  arrows: 'both' | 'start';
}

export interface SectionFigure {
  frame: FigureFrame;
  viewBox: string;
  widthPaper_mm: number;
  /** The outer loop and any voids, one closed subpath each: fill it with the even-odd rule. */
  outlinePath: string;
  /** Centre line of a section symmetric about the vertical; null for channels and angles. */
  webAxis: Segment | null;
  dimensions: DimensionLine[];
  arrowSize: number;
  textSize: number;
}

export interface StressFigure {
  viewBox: string;
  widthPaper_mm: number;
  /** The curve alone, and the same closed against the axis for the fill. */
  curvePath: string;
  areaPath: string;
  axes: Segment[];
  ticks: { x: number; label: string }[];
  tickY: number;
  axisLabel: { x: number; y: number; text: string };
  peak: { x: number; y: number; label: string };
  neutralAxis: Segment;
  /** Each web–flange jump: a horizontal step in the curve, labelled with both stresses. */
  jumps: { segment: Segment; label: string; labelX: number; labelY: number }[];
  /** Vertical marks: V/(hw·tw) over the clear web (a rule of thumb, never the code check) and the elastic limit. */
  marks: StressMark[];
  textSize: number;
}

export interface StressMark {
  key: 'web-average' | 'elastic-limit';
  segment: Segment;
  label: string;
  labelX: number;
  labelY: number;
}

const round = (value: number): number => Math.round(value * 1000) / 1000;
const point = (x: number, y: number): string => `${round(x)},${round(y)}`;

/** Section millimetres measured up from the underside → SVG y. */
export function svgY(frame: FigureFrame, y_mm: number): number {
  return frame.depth_mm - y_mm;
}

/** The scale and the vertical extent both figures share. */
export function figureFrame(props: SectionProperties): FigureFrame {
  const { input } = props;
  const width_mm = Math.max(input.topFlange.width_mm, input.bottomFlange.width_mm);
  const ptBox = (paper_mm: number): number => paper_mm * PT_PER_MM;
  const scale = drawingScale(width_mm, input.depth_mm, ptBox(SECTION_BOX_MM.width), ptBox(SECTION_BOX_MM.height));
  const viewTop = -MARGIN_MM.top * scale;
  const viewHeight = input.depth_mm + (MARGIN_MM.top + MARGIN_MM.bottom) * scale;
  return { scale, depth_mm: input.depth_mm, viewTop, viewHeight, heightPaper_mm: viewHeight / scale };
}

/** The section outline (fillets and tapers as the check saw them) with d, b, tf, tw and r dimensioned. */
export function sectionFigure(props: SectionProperties, frame: FigureFrame = figureFrame(props)): SectionFigure {
  const { input } = props;
  const n = frame.scale;
  const d = input.depth_mm;
  const top = input.topFlange;
  const bottom = input.bottomFlange;
  const half = Math.max(top.width_mm, bottom.width_mm) / 2;
  const left = -half - MARGIN_MM.left * n;
  const width = 2 * half + (MARGIN_MM.left + MARGIN_MM.right) * n;
  const y = (y_mm: number): number => svgY(frame, y_mm);
  const gap = 1.5 * n;
  const text = TEXT_MM * n;

  const outline = sectionOutline_mm(props);
  const outlinePath = `M${outline.map((p) => point(p.x_mm, y(p.y_mm))).join('L')}Z`;

  const dimX = -half - 8 * n;
  const depth: DimensionLine = {
    key: 'd',
    x1: dimX,
    y1: y(0),
    x2: dimX,
    y2: y(d),
    label: `d = ${formatNumber(d)}`,
    labelX: dimX - gap,
    labelY: y(d / 2),
    anchor: 'middle',
    vertical: true,
    extensions: [
      { x1: -bottom.width_mm / 2 - gap, y1: y(0), x2: dimX - gap, y2: y(0) },
      { x1: -top.width_mm / 2 - gap, y1: y(d), x2: dimX - gap, y2: y(d) },
    ],
    arrows: 'both',
  };
  const widthLine = (key: 'b-top' | 'b-bottom', flangeWidth: number, atY: number, edgeY: number, labelBelow: boolean): DimensionLine => ({
    key,
    x1: -flangeWidth / 2,
    y1: atY,
    x2: flangeWidth / 2,
    y2: atY,
    label: `b = ${formatNumber(flangeWidth)}`,
    labelX: 0,
    labelY: labelBelow ? atY + gap + text : atY - gap,
    anchor: 'middle',
    vertical: false,
    extensions: [
      { x1: -flangeWidth / 2, y1: edgeY, x2: -flangeWidth / 2, y2: atY },
      { x1: flangeWidth / 2, y1: edgeY, x2: flangeWidth / 2, y2: atY },
    ].map((segment) => ({ ...segment, y1: segment.y1 + Math.sign(atY - edgeY) * gap })),
    arrows: 'both',
  });
  const tfX = top.width_mm / 2 + 4 * n;
  const tf: DimensionLine = {
    key: 'tf',
    x1: tfX,
    y1: y(d),
    x2: tfX,
    y2: y(d - top.thickness_mm),
    label: `tf = ${formatNumber(top.thickness_mm)}`,
    labelX: tfX + gap,
    labelY: y(d - top.thickness_mm / 2) + text / 3,
    anchor: 'start',
    vertical: false,
    extensions: [{ x1: top.width_mm / 2 + gap, y1: y(d - top.thickness_mm), x2: tfX + gap, y2: y(d - top.thickness_mm) }],
    arrows: 'both',
  };
  // Web thickness a little above mid-depth, clear of the neutral axis and the root fillet leader.
  const twY = y(d * 0.62);
  const tw: DimensionLine = {
    key: 'tw',
    x1: -input.webThickness_mm / 2,
    y1: twY,
    x2: input.webThickness_mm / 2,
    y2: twY,
    label: `tw = ${formatNumber(input.webThickness_mm)}`,
    labelX: input.webThickness_mm / 2 + 6 * n + gap,
    labelY: twY + text / 3,
    anchor: 'start',
    vertical: false,
    extensions: [{ x1: input.webThickness_mm / 2, y1: twY, x2: input.webThickness_mm / 2 + 6 * n, y2: twY }],
    arrows: 'both',
  };
  const dimensions = [depth, widthLine('b-top', top.width_mm, y(d) - 6 * n, y(d), false), tf, tw];
  if (bottom.width_mm !== top.width_mm || bottom.thickness_mm !== top.thickness_mm) {
    dimensions.push(widthLine('b-bottom', bottom.width_mm, y(0) + 6 * n, y(0), true));
  }
  const fillet = filletLeader(props, frame);
  if (fillet) dimensions.push(fillet);

  return {
    frame,
    viewBox: [left, frame.viewTop, width, frame.viewHeight].map(round).join(' '),
    widthPaper_mm: round(width / n),
    outlinePath,
    webAxis: { x1: 0, y1: y(d) - 3 * n, x2: 0, y2: y(0) + 3 * n },
    dimensions,
    arrowSize: ARROW_MM * n,
    textSize: text,
  };
}

/** A leader from the middle of the lower right root fillet to "r = …"; none for welded plates. */
function filletLeader(props: SectionProperties, frame: FigureFrame): DimensionLine | null {
  const { input } = props;
  const r = input.bottomFlange.filletRadius_mm;
  if (!(r > 0)) return null;
  const n = frame.scale;
  // Centre of the fillet arc: r out from the web face, r up from the inner face of the flange.
  const centreX = input.webThickness_mm / 2 + r;
  const centreY = input.bottomFlange.thickness_mm + r;
  const onArcX = centreX - r / Math.SQRT2;
  const onArcY = centreY - r / Math.SQRT2;
  const labelX = Math.max(input.bottomFlange.width_mm / 2, centreX + r) * 0.7 + 4 * n;
  const labelY = svgY(frame, centreY + r) - 8 * n;
  return {
    key: 'r',
    x1: onArcX,
    y1: svgY(frame, onArcY),
    x2: labelX,
    y2: labelY,
    label: `r = ${formatNumber(r)}`,
    labelX: labelX + 1.5 * n,
    labelY: labelY + (TEXT_MM * n) / 3,
    anchor: 'start',
    vertical: false,
    extensions: [],
    arrows: 'start',
  };
}

export interface StressSample {
  y_mm: number;
  tau_MPa: number;
}

/** The stress just inside the web and just inside the flange at one web–flange junction. */
export interface JunctionJump {
  level_mm: number;
  webSide_MPa: number;
  flangeSide_MPa: number;
}

export interface StressFigureInput {
  samples: readonly StressSample[];
  tauMax_MPa: number;
  tauMaxAt_mm: number;
  junctions: readonly JunctionJump[];
  /** The web average, the levels bounding the plates it averages over, and its formula ('V/(hw·tw)' when absent). */
  webAverage: { tau_MPa: number; from_mm: number; to_mm: number; formula?: string } | null;
  /** EN 1993-1-1 (6.19): fy/(√3·γM0); absent for AISC. */
  elasticLimit_MPa?: number;
}

/** τ(y) beside the section: same frame, τ to the right in MPa on a round-numbered axis. */
export function stressFigure(data: StressFigureInput, frame: FigureFrame): StressFigure {
  const n = frame.scale;
  const plotWidth = PLOT_WIDTH_MM * n;
  const left = -PLOT_MARGIN_MM.left * n;
  const width = (PLOT_MARGIN_MM.left + PLOT_WIDTH_MM + PLOT_MARGIN_MM.right) * n;
  const largest = Math.max(data.tauMax_MPa, data.elasticLimit_MPa ?? 0, ...data.samples.map((sample) => sample.tau_MPa));
  const ticks = niceTicks(largest * 1.05, 4);
  const axisMax = ticks[ticks.length - 1] || 1;
  const x = (tau_MPa: number): number => (tau_MPa / axisMax) * plotWidth;
  const y = (y_mm: number): number => svgY(frame, y_mm);
  const text = TEXT_MM * n;
  const gap = 1.5 * n;
  const d = frame.depth_mm;

  // The samples hold both sides of each junction at one level, so the curve steps there.
  const points = data.samples.map((sample) => point(x(sample.tau_MPa), y(sample.y_mm)));
  const curvePath = points.length ? `M${points.join('L')}` : '';
  const first = data.samples[0];
  const last = data.samples[data.samples.length - 1];
  const areaPath = points.length ? `M${point(0, y(first.y_mm))}L${points.join('L')}L${point(0, y(last.y_mm))}Z` : '';

  const peakY = y(data.tauMaxAt_mm);
  const labelColumn = plotWidth + 3 * n;
  const { webAverage } = data;
  const marks: StressMark[] = [];
  if (webAverage) {
    marks.push({
      key: 'web-average',
      segment: { x1: x(webAverage.tau_MPa), y1: y(webAverage.to_mm), x2: x(webAverage.tau_MPa), y2: y(webAverage.from_mm) },
      label: `${webAverage.formula ?? 'V/(hw·tw)'} = ${formatNumber(webAverage.tau_MPa)}`,
      labelX: labelColumn,
      labelY: peakY + 2.5 * text,
    });
  }
  if (data.elasticLimit_MPa !== undefined) {
    marks.push({
      key: 'elastic-limit',
      segment: { x1: x(data.elasticLimit_MPa), y1: y(d), x2: x(data.elasticLimit_MPa), y2: y(0) },
      label: `fy/(√3·γM0) = ${formatNumber(data.elasticLimit_MPa)}`,
      labelX: labelColumn,
      labelY: peakY + 4 * text,
    });
  }

  return {
    viewBox: [left, frame.viewTop, width, frame.viewHeight].map(round).join(' '),
    widthPaper_mm: round(width / n),
    curvePath,
    areaPath,
    axes: [
      { x1: 0, y1: y(d), x2: 0, y2: y(0) },
      { x1: 0, y1: y(0), x2: plotWidth, y2: y(0) },
    ],
    ticks: ticks.map((tick) => ({ x: round(x(tick)), label: formatNumber(tick) })),
    tickY: y(0) + gap + text,
    axisLabel: { x: plotWidth, y: y(0) + 2 * (gap + text), text: 'τ(y) [MPa]' },
    peak: { x: round(x(data.tauMax_MPa)), y: round(peakY), label: `τmax = ${formatNumber(data.tauMax_MPa)} MPa` },
    neutralAxis: { x1: 0, y1: peakY, x2: labelColumn - gap, y2: peakY },
    jumps: data.junctions.map((junction) => ({
      segment: { x1: x(junction.flangeSide_MPa), y1: y(junction.level_mm), x2: x(junction.webSide_MPa), y2: y(junction.level_mm) },
      label: `${formatNumber(junction.webSide_MPa)} → ${formatNumber(junction.flangeSide_MPa)}`,
      labelX: labelColumn,
      labelY: y(junction.level_mm) + text / 3,
    })),
    marks,
    textSize: text,
  };
}

/** The outline a family's sheet draws: turned a quarter for the minor axis, so the shear runs up the page as τ(s) does. */
function drawnOutline(section: FamilySheetSection): { loops: Point2_mm[][]; minX: number; maxX: number } {
  const polygon = outlineAlongShear(section.outline, section.axis);
  const loops = [polygon.outer, ...polygon.voids];
  const xs = polygon.outer.map(([x]) => x);
  return { loops, minX: Math.min(...xs), maxX: Math.max(...xs) };
}

/** The frame of a family's figures: s from the section's bottom (from_mm) to its top (to_mm) along the shear. */
export function familyFrame(section: FamilySheetSection): FigureFrame {
  const { minX, maxX } = drawnOutline(section);
  const depth_mm = section.properties.to_mm - section.properties.from_mm;
  const ptBox = (paper_mm: number): number => paper_mm * PT_PER_MM;
  const scale = drawingScale(maxX - minX, depth_mm, ptBox(SECTION_BOX_MM.width), ptBox(SECTION_BOX_MM.height));
  const viewTop = -MARGIN_MM.top * scale;
  const viewHeight = depth_mm + (MARGIN_MM.top + MARGIN_MM.bottom) * scale;
  return { scale, depth_mm, viewTop, viewHeight, heightPaper_mm: viewHeight / scale };
}

/** One dimension mark of engine/section-dimension-marks.ts as an SVG dimension line, paper offsets scaled by 1:n. */
function dimensionLineOf(mark: SectionDimensionMark, from_mm: number, frame: FigureFrame): DimensionLine {
  const n = frame.scale;
  const gap = 1.5 * n;
  const text = TEXT_MM * n;
  const at = ([px, py]: Point2_mm): [number, number] => [px, svgY(frame, py - from_mm)];
  const [x1, y1] = at(mark.from);
  const [x2, y2] = at(mark.to);
  if (mark.kind === 'thickness') {
    // Arrows on the plate's faces, a leader on past `to` to the label.
    const length = Math.hypot(x2 - x1, y2 - y1) || 1;
    const [ux, uy] = [(x2 - x1) / length, (y2 - y1) / length];
    const end: [number, number] = [x2 + ux * 6 * n, y2 + uy * 6 * n];
    const toRight = end[0] >= x2;
    return {
      key: mark.key,
      x1,
      y1,
      x2,
      y2,
      label: mark.label,
      labelX: end[0] + (toRight ? gap : -gap),
      labelY: end[1] + text / 3,
      anchor: toRight ? 'start' : 'end',
      vertical: false,
      extensions: [{ x1: x2, y1: y2, x2: end[0], y2: end[1] }],
      arrows: 'both',
    };
  }
  const offset = 8 * n;
  const vertical = mark.side === 'left' || mark.side === 'right';
  const sign = mark.side === 'left' || mark.side === 'top' ? -1 : 1;
  if (vertical) {
    const lineX = x1 + sign * offset;
    return {
      key: mark.key,
      x1: lineX,
      y1,
      x2: lineX,
      y2,
      label: mark.label,
      labelX: lineX + sign * gap,
      labelY: (y1 + y2) / 2,
      anchor: 'middle',
      vertical: true,
      extensions: [
        { x1: x1 + sign * gap, y1, x2: lineX + sign * gap, y2: y1 },
        { x1: x2 + sign * gap, y1: y2, x2: lineX + sign * gap, y2 },
      ],
      arrows: 'both',
    };
  }
  const lineY = y1 + sign * offset;
  return {
    key: mark.key,
    x1,
    y1: lineY,
    x2,
    y2: lineY,
    label: mark.label,
    labelX: (x1 + x2) / 2,
    labelY: sign < 0 ? lineY - gap : lineY + gap + text,
    anchor: 'middle',
    vertical: false,
    extensions: [
      { x1, y1: y1 + sign * gap, x2: x1, y2: lineY + sign * gap },
      { x1: x2, y1: y2 + sign * gap, x2, y2: lineY + sign * gap },
    ],
    arrows: 'both',
  };
}

/** A channel, tee, angle, box or tube drawn to scale from its outline, voids included, with its main dimensions. */
export function familySectionFigure(section: FamilySheetSection, standard: Standard, frame: FigureFrame = familyFrame(section)): SectionFigure {
  const n = frame.scale;
  const from = section.properties.from_mm;
  const { loops, minX, maxX } = drawnOutline(section);
  const y = (s_mm: number): number => svgY(frame, s_mm - from);
  const outlinePath = loops.map((loop) => `M${loop.map(([x, s]) => point(x, y(s))).join('L')}Z`).join('');
  const left = minX - MARGIN_MM.left * n;
  const width = maxX - minX + (MARGIN_MM.left + MARGIN_MM.right) * n;
  const symmetric = section.dimensions.family === 'box' || section.dimensions.family === 'tube';
  return {
    frame,
    viewBox: [left, frame.viewTop, width, frame.viewHeight].map(round).join(' '),
    widthPaper_mm: round(width / n),
    outlinePath,
    webAxis: symmetric ? { x1: 0, y1: y(section.properties.to_mm) - 3 * n, x2: 0, y2: y(from) + 3 * n } : null,
    dimensions: sectionDimensionMarks(section.dimensions, standard, section.axis).map((mark) => dimensionLineOf(mark, from, frame)),
    arrowSize: ARROW_MM * n,
    textSize: TEXT_MM * n,
  };
}

/**
 * τ(s) of a family's section as the stress figure draws it: levels from the section's bottom, each jump labelled
 * from the side nearer the neutral axis (the web or wall) to the side beyond it, the web average over the plates it
 * averages (between the outermost jumps, or the whole depth).
 */
export function familyStressInput(section: FamilySheetSection, stress: FamilySheetStress): StressFigureInput {
  const from = section.properties.from_mm;
  const neutralAxis = section.properties.neutralAxis_mm;
  const levels = stress.jumps.map((jump) => jump.level_mm - from);
  const depth = section.properties.to_mm - from;
  return {
    samples: stress.samples.map((sample) => ({ y_mm: sample.s_mm - from, tau_MPa: sample.tau_MPa })),
    tauMax_MPa: stress.tauMax_MPa,
    tauMaxAt_mm: stress.at_mm - from,
    junctions: stress.jumps.map((jump) => {
      const below = jump.level_mm > neutralAxis;
      return { level_mm: jump.level_mm - from, webSide_MPa: below ? jump.below_MPa : jump.above_MPa, flangeSide_MPa: below ? jump.above_MPa : jump.below_MPa };
    }),
    webAverage:
      stress.webAverage_MPa === null
        ? null
        : {
            tau_MPa: stress.webAverage_MPa,
            from_mm: levels.length > 1 ? Math.min(...levels) : 0,
            to_mm: levels.length > 1 ? Math.max(...levels) : depth,
            formula: WEB_AVERAGE_FORMULAS[section.dimensions.family],
          },
    elasticLimit_MPa: stress.elasticLimit_MPa,
  };
}
