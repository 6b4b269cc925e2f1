/**
 * Section drawing to scale beside τ(y) over the depth, sharing one vertical scale so each stress sits level with
 * the part of the section that carries it. Drawn with pdfkit vector paths.
 */
import type { FamilySheetSection } from '../checks/checks-api-types';
import type { Standard } from '../engine/check';
import { flangeGeometry } from '../engine/section';
import type { SectionProperties } from '../engine/section-properties';
import { outlineAlongShear } from '../engine/shear-axis';
import { type Pdf, textWidth, writeText } from './pdf-text';
import { formatNumber } from './report-format';
import { COLOURS, TEXT_SIZE } from './report-layout';
import { sectionDimensionMarks } from './section-dimension-marks';
import { niceTicks, sectionOutline_mm } from './section-outline';

/** Where y = 0 (the underside) and the web axis land on the page, and how many points one millimetre takes. */
export interface SheetFrame {
  webAxisX_pt: number;
  undersideY_pt: number;
  ptPerMm: number;
}

const ARROW_PT = 3.2;
const DIM_SIZE = TEXT_SIZE.tiny;

function pageY(frame: SheetFrame, y_mm: number): number {
  return frame.undersideY_pt - y_mm * frame.ptPerMm;
}

function pageX(frame: SheetFrame, x_mm: number): number {
  return frame.webAxisX_pt + x_mm * frame.ptPerMm;
}

function arrowHead(doc: Pdf, tipX: number, tipY: number, angle_rad: number): void {
  const back = (offset: number): [number, number] => [
    tipX - ARROW_PT * Math.cos(angle_rad) + offset * Math.sin(angle_rad),
    tipY - ARROW_PT * Math.sin(angle_rad) - offset * Math.cos(angle_rad),
  ];
  const [ax, ay] = back(ARROW_PT / 2.6);
  const [bx, by] = back(-ARROW_PT / 2.6);
  doc.moveTo(tipX, tipY).lineTo(ax, ay).lineTo(bx, by).closePath().fill(COLOURS.ink);
}

/** A dimension between two points with arrows at both ends; the label sits beside its middle. */
function dimension(doc: Pdf, from: [number, number], to: [number, number], label: string, labelAt: 'above' | 'right' | 'left'): void {
  const angle = Math.atan2(to[1] - from[1], to[0] - from[0]);
  doc.moveTo(from[0], from[1]).lineTo(to[0], to[1]).lineWidth(0.4).strokeColor(COLOURS.ink).stroke();
  arrowHead(doc, to[0], to[1], angle);
  arrowHead(doc, from[0], from[1], angle + Math.PI);
  const midX = (from[0] + to[0]) / 2;
  const midY = (from[1] + to[1]) / 2;
  const width = textWidth(doc, label, 'mono', DIM_SIZE);
  const x = labelAt === 'above' ? midX - width / 2 : labelAt === 'right' ? midX + 3 : midX - width - 3;
  const y = labelAt === 'above' ? midY - DIM_SIZE - 2 : midY - DIM_SIZE / 2;
  writeText(doc, label, 'mono', x, y, { size: DIM_SIZE, color: COLOURS.ink, lineBreak: false });
}

function extensionLine(doc: Pdf, from: [number, number], to: [number, number]): void {
  doc.moveTo(from[0], from[1]).lineTo(to[0], to[1]).lineWidth(0.25).strokeColor(COLOURS.muted).stroke();
}

/** Outline filled, centre lines, and dimensions d, b (both flanges), tf, tw and r, in millimetres. */
export function drawSection(doc: Pdf, props: SectionProperties, frame: SheetFrame): void {
  const { input } = props;
  const d = input.depth_mm;
  const outline = sectionOutline_mm(props);
  outline.forEach((point, i) => {
    const x = pageX(frame, point.x_mm);
    const y = pageY(frame, point.y_mm);
    if (i === 0) doc.moveTo(x, y);
    else doc.lineTo(x, y);
  });
  doc.closePath().lineWidth(0.9).fillAndStroke(COLOURS.patinaLight, COLOURS.patina);

  const top = input.topFlange;
  const bottom = input.bottomFlange;
  const halfMax_mm = Math.max(top.width_mm, bottom.width_mm) / 2;
  const topY = pageY(frame, d);
  const baseY = pageY(frame, 0);

  // Depth, left of the wider flange.
  const dimX = pageX(frame, -halfMax_mm) - 14;
  extensionLine(doc, [pageX(frame, -top.width_mm / 2) - 2, topY], [dimX - 3, topY]);
  extensionLine(doc, [pageX(frame, -bottom.width_mm / 2) - 2, baseY], [dimX - 3, baseY]);
  dimension(doc, [dimX, baseY], [dimX, topY], `d = ${formatNumber(d)}`, 'left');

  // Flange widths, above and below.
  dimension(doc, [pageX(frame, -top.width_mm / 2), topY - 10], [pageX(frame, top.width_mm / 2), topY - 10], `b = ${formatNumber(top.width_mm)}`, 'above');
  dimension(doc, [pageX(frame, -bottom.width_mm / 2), baseY + 14], [pageX(frame, bottom.width_mm / 2), baseY + 14], `b = ${formatNumber(bottom.width_mm)}`, 'above');

  // Top flange thickness, right of its tip.
  const tipX = pageX(frame, top.width_mm / 2) + 8;
  dimension(doc, [tipX, topY], [tipX, pageY(frame, d - top.thickness_mm)], `tf = ${formatNumber(top.thickness_mm)}`, 'right');

  // Web thickness at mid-height: arrows pointing in from both sides.
  const midY = pageY(frame, d / 2 + d * 0.12);
  const webLeft = pageX(frame, -input.webThickness_mm / 2);
  const webRight = pageX(frame, input.webThickness_mm / 2);
  doc.moveTo(webLeft - 12, midY).lineTo(webRight + 12, midY).lineWidth(0.4).strokeColor(COLOURS.ink).stroke();
  arrowHead(doc, webLeft, midY, 0);
  arrowHead(doc, webRight, midY, Math.PI);
  writeText(doc, `tw = ${formatNumber(input.webThickness_mm)}`, 'mono', webRight + 14, midY - DIM_SIZE / 2, { size: DIM_SIZE, color: COLOURS.ink, lineBreak: false });

  // Root fillet radius, with a leader from the middle of the lower right fillet.
  if (bottom.filletRadius_mm > 0) {
    const g = flangeGeometry(bottom, input.webThickness_mm);
    const r = g.filletRadius_mm;
    const pointX = pageX(frame, g.webHalf_mm + r - r / Math.SQRT2);
    const pointY = pageY(frame, g.filletWebTangent_mm - r / Math.SQRT2);
    const labelX = pageX(frame, halfMax_mm * 0.55) + 6;
    const labelY = pageY(frame, g.filletWebTangent_mm + r) - 12;
    doc.moveTo(pointX, pointY).lineTo(labelX - 2, labelY + DIM_SIZE / 2).lineWidth(0.3).strokeColor(COLOURS.ink).stroke();
    writeText(doc, `r = ${formatNumber(r)}`, 'mono', labelX, labelY, { size: DIM_SIZE, color: COLOURS.ink, lineBreak: false });
  }

  // Web axis.
  doc.moveTo(frame.webAxisX_pt, topY - 4).lineTo(frame.webAxisX_pt, baseY + 4).lineWidth(0.3).dash(6, { space: 2 }).strokeColor(COLOURS.muted).stroke().undash();
}

/**
 * A section of another family from its outline (voids left open by the even-odd rule), turned a quarter for the
 * minor axis as its τ(s) is, with its main dimensions in the run's notation. x = 0 is the bounding box's centre.
 */
export function drawFamilySection(doc: Pdf, section: FamilySheetSection, standard: Standard, frame: SheetFrame): void {
  const from = section.properties.from_mm;
  const at = ([x, s]: readonly [number, number]): [number, number] => [pageX(frame, x), pageY(frame, s - from)];
  const polygon = outlineAlongShear(section.outline, section.axis);
  for (const loop of [polygon.outer, ...polygon.voids]) {
    loop.forEach((point, i) => {
      const [x, y] = at(point);
      if (i === 0) doc.moveTo(x, y);
      else doc.lineTo(x, y);
    });
    doc.closePath();
  }
  doc.lineWidth(0.9).fillAndStroke(COLOURS.patinaLight, COLOURS.patina, 'even-odd');

  for (const mark of sectionDimensionMarks(section.dimensions, standard, section.axis)) {
    const [x1, y1] = at(mark.from);
    const [x2, y2] = at(mark.to);
    if (mark.kind === 'thickness') {
      // Arrows on the plate's faces, pointing in, and a leader on past `to` to the label.
      const angle = Math.atan2(y2 - y1, x2 - x1);
      const [ex, ey] = [x2 + 12 * Math.cos(angle), y2 + 12 * Math.sin(angle)];
      doc.moveTo(x1 - 10 * Math.cos(angle), y1 - 10 * Math.sin(angle)).lineTo(ex, ey).lineWidth(0.4).strokeColor(COLOURS.ink).stroke();
      arrowHead(doc, x1, y1, angle);
      arrowHead(doc, x2, y2, angle + Math.PI);
      const right = ex >= x2;
      const width = textWidth(doc, mark.label, 'mono', DIM_SIZE);
      writeText(doc, mark.label, 'mono', right ? ex + 2 : ex - width - 2, ey - DIM_SIZE / 2, { size: DIM_SIZE, color: COLOURS.ink, lineBreak: false });
      continue;
    }
    const sign = mark.side === 'left' || mark.side === 'top' ? -1 : 1;
    const vertical = mark.side === 'left' || mark.side === 'right';
    const offset = 14 * sign;
    const a: [number, number] = vertical ? [x1 + offset, y1] : [x1, y1 + offset];
    const b: [number, number] = vertical ? [x2 + offset, y2] : [x2, y2 + offset];
    extensionLine(doc, [x1 + (vertical ? 2 * sign : 0), y1 + (vertical ? 0 : 2 * sign)], [a[0] + (vertical ? 3 * sign : 0), a[1] + (vertical ? 0 : 3 * sign)]);
    extensionLine(doc, [x2 + (vertical ? 2 * sign : 0), y2 + (vertical ? 0 : 2 * sign)], [b[0] + (vertical ? 3 * sign : 0), b[1] + (vertical ? 0 : 3 * sign)]);
    const labelAt = vertical ? (sign < 0 ? 'left' : 'right') : 'above';
    dimension(doc, a, b, mark.label, labelAt);
  }
}

export interface PlotBox {
  left_pt: number;
  width_pt: number;
  /** Width to the right of the plot for the value labels. */
  labelWidth_pt: number;
}

function plotPoint(frame: SheetFrame, box: PlotBox, scale_ptPerMPa: number, tau_MPa: number, y_mm: number): [number, number] {
  return [box.left_pt + tau_MPa * scale_ptPerMPa, pageY(frame, y_mm)];
}

function dashedVertical(doc: Pdf, x: number, topY: number, baseY: number, colour: string): void {
  doc.moveTo(x, topY).lineTo(x, baseY).lineWidth(0.7).dash(3, { space: 2 }).strokeColor(colour).stroke().undash();
}

/** A value at one level, written in the label column with a dotted leader from its point on the curve. */
function levelLabel(doc: Pdf, box: PlotBox, point: [number, number], label: string): void {
  const labelX = box.left_pt + box.width_pt + 6;
  doc.moveTo(point[0] + 2, point[1]).lineTo(labelX - 2, point[1]).lineWidth(0.3).dash(1, { space: 1.5 }).strokeColor(COLOURS.muted).stroke().undash();
  writeText(doc, label, 'mono', labelX, point[1] - DIM_SIZE / 2, { size: DIM_SIZE, color: COLOURS.ink, width: box.labelWidth_pt - 6 });
}

export interface PlotLegendEntry {
  colour: string;
  text: string;
}

/** τ over the depth as the plot draws it, levels measured up from the underside of the section. */
export interface StressPlotData {
  depth_mm: number;
  /** Ascending; both sides of each jump at one level. */
  points: readonly { y_mm: number; tau_MPa: number }[];
  tauMax_MPa: number;
  tauMaxAt_mm: number;
  /** Each width jump: τ on the side nearer the neutral axis (the web or wall) and beyond it (the flange). */
  jumps: readonly { level_mm: number; webSide_MPa: number; flangeSide_MPa: number }[];
  /** The web average and its formula; null where the run reports none. */
  webAverage: { tau_MPa: number; formula: string } | null;
  elasticLimit_MPa?: number;
}

/**
 * τ from the engine's samples: filled area, the peak at the neutral axis, the jump at each width change, the web
 * average (a rule of thumb, not the code check) and, for EN, the elastic limit of (6.19).
 * Returns the legend of the dashed lines for the caller to print.
 */
export function drawShearStressPlot(doc: Pdf, profile: StressPlotData, frame: SheetFrame, box: PlotBox): PlotLegendEntry[] {
  const { depth_mm: d, elasticLimit_MPa } = profile;
  const topY = pageY(frame, d);
  const baseY = pageY(frame, 0);
  const largest = Math.max(profile.tauMax_MPa, elasticLimit_MPa ?? 0);
  const ticks = niceTicks(largest * 1.05, 4);
  const scale = box.width_pt / ticks[ticks.length - 1];

  // Grid, axes, tick values.
  for (const tick of ticks) {
    const x = box.left_pt + tick * scale;
    doc.moveTo(x, topY).lineTo(x, baseY).lineWidth(0.25).strokeColor(COLOURS.rule).stroke();
    writeText(doc, formatNumber(tick), 'mono', x - 15, baseY + 4, { size: DIM_SIZE, color: COLOURS.muted, width: 30, align: 'center' });
  }
  doc.moveTo(box.left_pt, topY).lineTo(box.left_pt, baseY).lineTo(box.left_pt + box.width_pt, baseY).lineWidth(0.6).strokeColor(COLOURS.ink).stroke();
  writeText(doc, 'τ(y) [MPa]', 'body', box.left_pt, baseY + 14, { size: DIM_SIZE, color: COLOURS.muted, width: box.width_pt, align: 'right' });

  // The curve: the engine samples both sides of each junction, so the jump is drawn as a horizontal step.
  const points = profile.points.map((p) => plotPoint(frame, box, scale, p.tau_MPa, p.y_mm));
  doc.moveTo(box.left_pt, baseY);
  for (const [x, y] of points) doc.lineTo(x, y);
  doc.lineTo(box.left_pt, topY).closePath().fillOpacity(0.3).fill(COLOURS.patina).fillOpacity(1);
  points.forEach(([x, y], i) => (i === 0 ? doc.moveTo(x, y) : doc.lineTo(x, y)));
  doc.lineWidth(1.1).strokeColor(COLOURS.patina).stroke();

  // Neutral axis across section and plot, and the peak on it.
  const peak = plotPoint(frame, box, scale, profile.tauMax_MPa, profile.tauMaxAt_mm);
  doc.moveTo(frame.webAxisX_pt - 40, peak[1]).lineTo(box.left_pt + box.width_pt, peak[1]).lineWidth(0.3).dash(8, { space: 2 }).strokeColor(COLOURS.muted).stroke().undash();
  doc.circle(peak[0], peak[1], 1.8).fill(COLOURS.ink);
  writeText(doc, 'NA', 'body', box.left_pt - 16, peak[1] - DIM_SIZE - 2, { size: DIM_SIZE, color: COLOURS.muted, lineBreak: false });
  levelLabel(doc, box, peak, `τmax ${formatNumber(profile.tauMax_MPa)}`);

  // The jump at each junction: stress just inside the web (or fillet) and just inside the flange.
  for (const junction of profile.jumps) {
    const point = plotPoint(frame, box, scale, junction.webSide_MPa, junction.level_mm);
    levelLabel(doc, box, point, `jump ${formatNumber(junction.webSide_MPa)} / ${formatNumber(junction.flangeSide_MPa)}`);
  }

  const legend: PlotLegendEntry[] = [];
  if (profile.webAverage) {
    dashedVertical(doc, box.left_pt + profile.webAverage.tau_MPa * scale, topY, baseY, COLOURS.copper);
    legend.push({ colour: COLOURS.copper, text: `${profile.webAverage.formula} = ${formatNumber(profile.webAverage.tau_MPa)} MPa: web average, a rule of thumb, never the code check` });
  }
  if (elasticLimit_MPa !== undefined) {
    dashedVertical(doc, box.left_pt + elasticLimit_MPa * scale, topY, baseY, COLOURS.fail);
    legend.push({ colour: COLOURS.fail, text: `fy/(√3·γM0) = ${formatNumber(elasticLimit_MPa)} MPa: limit of the elastic check (6.19)` });
  }
  return legend;
}
