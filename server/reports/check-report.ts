/**
 * The PDF check report (pdfkit): cover with the cautions and sign-off block, check parameters, the run record,
 * summary, findings table, and one calculation sheet per failing or flagged member. Every page carries the cautions
 * in its footer.
 */
import PDFDocument from 'pdfkit';
import type { GoverningCheck, RunFlag } from '../checks/check-run-compute';
import { ValidationError } from '../http/errors';
import { sectionProperties } from '../engine/section-properties';
import { shearStressProfile } from '../engine/shear-stress';
import {
  FINDING_PRIORITY_LABELS,
  FINDING_STATUSES,
  FINDING_STATUS_LABELS,
  type FindingStatus,
} from '../findings/export/finding-export';
import type { CalculationSheetData, CheckReportData, SignOffEntry } from './check-report-data';
import { type Pdf, registerReportFonts, textHeight, writeText } from './pdf-text';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TEXT } from './report-cautions';
import { STANDARD_LABELS, dateText, dateTimeText, formatNumber, parameterRows, percentText } from './report-format';
import {
  COLOURS,
  CONTENT_WIDTH_PT,
  PAGE,
  TEXT_SIZE,
  type TableRow,
  ensureSpace,
  heading,
  paragraph,
  table,
} from './report-layout';
import { PT_PER_MM, drawingScale } from './section-outline';
import { drawFamilySection, drawSection, drawShearStressPlot, type SheetFrame, type StressPlotData } from './section-drawing';
import { WEB_AVERAGE_FORMULAS } from './section-dimension-marks';
import { outlineAlongShear } from '../engine/shear-axis';

export interface CheckReportOptions {
  /** Deflate page content (default). Tests switch it off to read the text back. */
  compress?: boolean;
}

/** Plain-language notes for the flags a sheet most often carries; others are printed by name. */
const FLAG_TEXT: Readonly<Partial<Record<RunFlag, string>>> = {
  'web-buckling-governs': 'Web shear buckling reduces the capacity.',
  'web-proportion-limit': 'The web is more slender than the code allows for an unstiffened web.',
  'elastic-check-exceeded': 'The elastic check (6.19) is exceeded although the plastic check passes.',
  'yield-strength-given': 'The yield strength was given directly, not taken from the grade.',
  'assumed-grade': "The grade was assumed: the model's material name was not recognised.",
  'catalogue-section': 'Section dimensions come from the catalogue, not from the model.',
  'fabrication-overridden': 'The run sets the fabrication (rolled or welded) differently from the model.',
  'resistance-factor-overridden': 'A project resistance factor replaces the code value.',
  'several-result-keys': 'Shear results of several analysis members are combined for this member.',
  'tension-field-not-counted': 'Tension-field action (AISC 360-22 §G2.2) would add strength; it is not counted.',
  'flexure-checked-separately': 'A moment acts with the shear: check flexure and combined forces separately (AISC 360-22 chapters F and H).',
  'shear-length-not-given': 'No shear length was given, so the length-dependent buckling term was left out (conservative).',
  'whole-section-reduced-for-shear': 'The reduced yield strength for shear was applied to the whole section (conservative).',
};

const SHEET_STATUS = {
  fail: { label: 'Fails', fill: COLOURS.fail },
  warning: { label: 'Flagged', fill: COLOURS.warning },
} as const;

function utilisationCell(utilisation: number | undefined): TableRow[number] {
  if (utilisation === undefined) return '—';
  return { text: percentText(utilisation), fill: utilisation > 1 ? COLOURS.fail : undefined };
}

function cover(doc: Pdf, data: CheckReportData): void {
  doc.rect(0, 0, PAGE.width_pt, 10).fill(COLOURS.patina);
  writeText(doc, 'Taulens', 'bold', PAGE.margin_pt, 44, { size: 11, color: COLOURS.patina });
  writeText(doc, 'Web shear check report', 'body', PAGE.margin_pt, 60, { size: 11, color: COLOURS.muted });
  writeText(doc, data.project.name, 'bold', PAGE.margin_pt, 110, { size: TEXT_SIZE.title, color: COLOURS.ink, width: CONTENT_WIDTH_PT });
  doc.moveDown(0.4);
  paragraph(doc, `Model revision ${data.revision.label} · ${data.revision.fileName}`, { size: 11 });
  if (data.project.reference) paragraph(doc, `Project reference ${data.project.reference}`, { color: COLOURS.muted });
  doc.moveDown(1);
  table(
    doc,
    [{ header: 'Check run', weight: 1 }, { header: '', weight: 2.6 }],
    [
      ['Standard', STANDARD_LABELS[data.parameters.standard]],
      ['Run', data.run.id],
      ['Started', `${dateTimeText(data.run.startedAt)} by ${data.run.startedBy}`],
      ['Report generated', `${dateTimeText(data.generatedAt)} by ${data.generatedBy}`],
    ],
    TEXT_SIZE.body,
  );
  cautionsBox(doc);
  signOffBlock(doc, data.signOff);
}

function cautionsBox(doc: Pdf): void {
  const lines = REPORT_CAUTIONS.map((line) => `• ${line}`).join('\n');
  const height = textHeight(doc, lines, 'body', TEXT_SIZE.body, CONTENT_WIDTH_PT - 24) + 34;
  ensureSpace(doc, height + 10);
  const top = doc.y + 6;
  doc.rect(PAGE.margin_pt, top, CONTENT_WIDTH_PT, height).fill('#FBF3EE');
  doc.rect(PAGE.margin_pt, top, 3, height).fill(COLOURS.copper);
  writeText(doc, 'Cautions — read before using these results', 'bold', PAGE.margin_pt + 14, top + 9, { size: TEXT_SIZE.body, color: COLOURS.copper });
  writeText(doc, lines, 'body', PAGE.margin_pt + 14, top + 24, { size: TEXT_SIZE.body, color: COLOURS.ink, width: CONTENT_WIDTH_PT - 24 });
  doc.y = top + height + 10;
}

function signOffBlock(doc: Pdf, signOff: CheckReportData['signOff']): void {
  heading(doc, 'Sign-off');
  const entries: [string, SignOffEntry | undefined][] = [
    ['Prepared by', signOff.prepared],
    ['Checked by', signOff.checked],
    ['Approved by', signOff.approved],
  ];
  const columnWidth = CONTENT_WIDTH_PT / 3;
  ensureSpace(doc, 90);
  const top = doc.y + 4;
  entries.forEach(([role, entry], i) => {
    const x = PAGE.margin_pt + i * columnWidth;
    const width = columnWidth - 14;
    writeText(doc, role, 'bold', x, top, { size: TEXT_SIZE.small, color: COLOURS.muted });
    writeText(doc, entry?.name ?? '', 'body', x, top + 14, { size: TEXT_SIZE.body, color: COLOURS.ink, width });
    doc.moveTo(x, top + 56).lineTo(x + width, top + 56).lineWidth(0.5).strokeColor(COLOURS.ink).stroke();
    writeText(doc, 'Signature', 'body', x, top + 59, { size: TEXT_SIZE.tiny, color: COLOURS.muted });
    writeText(doc, `Date ${dateText(entry?.date) || '____________'}`, 'body', x, top + 70, { size: TEXT_SIZE.small, color: COLOURS.ink });
  });
  doc.y = top + 90;
}

function parametersAndRun(doc: Pdf, data: CheckReportData): void {
  doc.addPage();
  heading(doc, 'Check parameters');
  const rows = parameterRows(data.parameters, data.parametersBasis);
  table(doc, [{ header: 'Parameter', weight: 1.2 }, { header: 'Value', weight: 2.4 }], rows.map((row) => [row.label, row.value]), TEXT_SIZE.body);

  heading(doc, 'Check run record');
  paragraph(doc, 'A check run is a fixed record of its inputs: the files below, identified by their SHA-256, the parameters above and the engine version. The same inputs give the same results.', { color: COLOURS.muted, size: TEXT_SIZE.small });
  table(
    doc,
    [{ header: 'Item', weight: 1.2 }, { header: 'Value', weight: 2.4 }],
    [
      ['Run', data.run.id],
      ['Started by', data.run.startedBy],
      ['Started', dateTimeText(data.run.startedAt)],
      ['Finished', dateTimeText(data.run.finishedAt)],
      ['Engine version', data.run.engineVersion],
    ],
    TEXT_SIZE.body,
  );
  table(
    doc,
    [{ header: 'Input', weight: 0.9 }, { header: 'File', weight: 1.3 }, { header: 'SHA-256', weight: 3, role: 'mono' }],
    data.run.inputFiles.map((file) => [file.role, file.fileName, file.sha256]),
  );
}

function findingCounts(data: CheckReportData): Map<FindingStatus, number> {
  const counts = new Map<FindingStatus, number>(FINDING_STATUSES.map((status) => [status, 0]));
  for (const finding of data.findings) counts.set(finding.status, (counts.get(finding.status) ?? 0) + 1);
  return counts;
}

function countCell(count: number, fill: string): TableRow[number] {
  return { text: String(count), fill: count > 0 ? fill : undefined };
}

function summary(doc: Pdf, data: CheckReportData): void {
  heading(doc, 'Summary');
  const members = data.summary;
  table(
    doc,
    [{ header: `Members (${members.members})`, weight: 2 }, { header: 'Count', weight: 1, align: 'right', role: 'mono' }],
    [
      ['Pass', String(members.pass)],
      ['of which close to capacity', countCell(members.warnings, COLOURS.warning)],
      ['Fail', countCell(members.fail, COLOURS.fail)],
      ['Not checked', String(members.notChecked)],
      ['Not applicable (no shear rule for the section)', String(members.notApplicable)],
    ],
    TEXT_SIZE.body,
  );
  if (members.maxUtilisation !== null) {
    const who = data.highestMemberLabel ?? members.maxUtilisationGlobalId ?? '';
    paragraph(doc, `Highest utilisation: ${percentText(members.maxUtilisation)} — ${who}.`, { role: 'bold' });
  }
  const counts = findingCounts(data);
  table(
    doc,
    [{ header: 'Findings by status', weight: 2 }, { header: 'Count', weight: 1, align: 'right', role: 'mono' }],
    FINDING_STATUSES.map((status) => [FINDING_STATUS_LABELS[status], String(counts.get(status))]),
    TEXT_SIZE.body,
  );
}

function findingsTable(doc: Pdf, data: CheckReportData): void {
  heading(doc, 'Findings');
  if (data.findings.length === 0) {
    paragraph(doc, 'No findings.', { color: COLOURS.muted });
    return;
  }
  table(
    doc,
    [
      { header: 'Ref', weight: 0.7, role: 'mono' },
      { header: 'Title', weight: 2.6 },
      { header: 'Member', weight: 1.8 },
      { header: 'Status', weight: 1 },
      { header: 'Priority', weight: 0.7 },
      { header: 'Assignee', weight: 1.6 },
      { header: 'Util.', weight: 0.8, align: 'right', role: 'mono' },
    ],
    data.findings.map((finding) => [
      finding.id,
      finding.title,
      finding.memberLabel ?? finding.memberGlobalIds.join(', '),
      FINDING_STATUS_LABELS[finding.status],
      FINDING_PRIORITY_LABELS[finding.priority],
      finding.assigneeEmail ?? '—',
      utilisationCell(finding.utilisation),
    ]),
  );
  const accepted = data.findings.filter((finding) => finding.acceptance !== undefined);
  if (accepted.length === 0) return;
  // An accepted finding is closed without a change to the model: the reason is part of the record it stands on.
  heading(doc, 'Accepted findings and their justifications');
  table(
    doc,
    [
      { header: 'Ref', weight: 0.7, role: 'mono' },
      { header: 'Accepted by', weight: 2 },
      { header: 'On', weight: 1.2 },
      { header: 'Justification', weight: 5.3 },
    ],
    accepted.map(({ id, acceptance }) => [id, acceptance!.author, dateTimeText(acceptance!.date), acceptance!.justification]),
  );
}

/** Room for the section drawing and τ(y) plot, and the margin kept around the outline for dimensions. */
const DRAWING_HEIGHT_PT = 280;
const DRAWING_WIDTH_PT = 200;
const DIMENSION_ROOM_PT = 60;
const LABEL_COLUMN_PT = 78;

/** What the drawings of one sheet need: the section's extent, how to draw it, and τ over its depth. */
interface SheetFigure {
  width_mm: number;
  depth_mm: number;
  /** Where x = 0 of the drawing lies, in millimetres right of the drawing's left edge. */
  left_mm: number;
  draw: (doc: Pdf, frame: SheetFrame) => void;
  plot: StressPlotData;
  formula: string;
}

function iSectionFigure(section: NonNullable<CalculationSheetData['section']>, governing: GoverningCheck, elasticLimit_MPa: number | undefined): SheetFigure {
  const props = sectionProperties(section);
  const profile = shearStressProfile(props, governing.VEd_N);
  const width_mm = Math.max(section.topFlange.width_mm, section.bottomFlange.width_mm);
  return {
    width_mm,
    depth_mm: props.depth_mm,
    left_mm: width_mm / 2,
    draw: (doc, frame) => drawSection(doc, props, frame),
    plot: {
      depth_mm: props.depth_mm,
      points: profile.points,
      tauMax_MPa: profile.tauMax_MPa,
      tauMaxAt_mm: profile.tauMaxAt_mm,
      jumps: [profile.topJunction, profile.bottomJunction],
      webAverage: { tau_MPa: profile.webAverageClear_MPa, formula: 'V/(hw·tw)' },
      elasticLimit_MPa,
    },
    formula: 'τ(y) = V·Q(y)/(I·t(y))',
  };
}

function familyFigure({ section, stress }: NonNullable<CalculationSheetData['family']>, standard: CheckReportData['parameters']['standard']): SheetFigure {
  const { from_mm: from, to_mm: to, neutralAxis_mm: na } = section.properties;
  const xs = outlineAlongShear(section.outline, section.axis).outer.map(([x]) => x);
  const minX = Math.min(...xs);
  return {
    width_mm: Math.max(...xs) - minX,
    depth_mm: to - from,
    left_mm: -minX,
    draw: (doc, frame) => drawFamilySection(doc, section, standard, frame),
    plot: {
      depth_mm: to - from,
      points: stress.samples.map((sample) => ({ y_mm: sample.s_mm - from, tau_MPa: sample.tau_MPa })),
      tauMax_MPa: stress.tauMax_MPa,
      tauMaxAt_mm: stress.at_mm - from,
      jumps: stress.jumps.map((jump) => {
        const below = jump.level_mm > na;
        return { level_mm: jump.level_mm - from, webSide_MPa: below ? jump.below_MPa : jump.above_MPa, flangeSide_MPa: below ? jump.above_MPa : jump.below_MPa };
      }),
      webAverage: stress.webAverage_MPa === null ? null : { tau_MPa: stress.webAverage_MPa, formula: WEB_AVERAGE_FORMULAS[section.dimensions.family] },
      elasticLimit_MPa: stress.elasticLimit_MPa,
    },
    formula: `τ(s) = V·Q(s)/(I·b(s)), b the total cut width, ${section.axis} axis`,
  };
}

function sheetFigureOf(sheet: CalculationSheetData, governing: GoverningCheck, data: CheckReportData): SheetFigure {
  if (sheet.family) return familyFigure(sheet.family, data.parameters.standard);
  if (sheet.section) return iSectionFigure(sheet.section, governing, sheet.elasticLimit_MPa);
  throw new ValidationError(`The calculation sheet for ${sheet.memberLabel} has no section to draw.`, { code: 'report_sheet_invalid' });
}

function sheetDrawings(doc: Pdf, sheet: CalculationSheetData, governing: GoverningCheck, data: CheckReportData): void {
  const figure = sheetFigureOf(sheet, governing, data);
  const innerHeight = DRAWING_HEIGHT_PT - DIMENSION_ROOM_PT;
  const scale = drawingScale(figure.width_mm, figure.depth_mm, DRAWING_WIDTH_PT - DIMENSION_ROOM_PT, innerHeight);
  const ptPerMm = PT_PER_MM / scale;
  ensureSpace(doc, DRAWING_HEIGHT_PT + 50);
  const top = doc.y + 28;
  // Centred in the drawing area.
  const undersideY = top + (innerHeight + figure.depth_mm * ptPerMm) / 2;
  const frame = { webAxisX_pt: PAGE.margin_pt + 10 + DRAWING_WIDTH_PT / 2 + (figure.left_mm - figure.width_mm / 2) * ptPerMm, undersideY_pt: undersideY, ptPerMm };
  figure.draw(doc, frame);
  const plotLeft = PAGE.margin_pt + DRAWING_WIDTH_PT + 30;
  const plotWidth = PAGE.margin_pt + CONTENT_WIDTH_PT - plotLeft - LABEL_COLUMN_PT;
  const legend = drawShearStressPlot(doc, figure.plot, frame, { left_pt: plotLeft, width_pt: plotWidth, labelWidth_pt: LABEL_COLUMN_PT });

  let y = top + innerHeight + 30;
  writeText(doc, `Section to scale 1:${formatNumber(scale)} on A4; dimensions in mm.`, 'body', PAGE.margin_pt, y, { size: TEXT_SIZE.tiny, color: COLOURS.muted, width: DRAWING_WIDTH_PT });
  writeText(
    doc,
    `Elastic shear stress ${figure.formula}, for the governing VEd = ${kN(governing.VEd_N)} kN, level with the section. ` +
      'At each flange τ jumps where the width changes: "jump a / b" gives the value just inside the web (or fillet) and just inside the flange.',
    'body',
    plotLeft,
    y,
    { size: TEXT_SIZE.tiny, color: COLOURS.muted, width: PAGE.margin_pt + CONTENT_WIDTH_PT - plotLeft },
  );
  for (const entry of legend) {
    y = doc.y + 3;
    doc.moveTo(plotLeft, y + 3).lineTo(plotLeft + 14, y + 3).lineWidth(0.8).dash(3, { space: 2 }).strokeColor(entry.colour).stroke().undash();
    writeText(doc, entry.text, 'body', plotLeft + 18, y, { size: TEXT_SIZE.tiny, color: COLOURS.ink, width: PAGE.margin_pt + CONTENT_WIDTH_PT - plotLeft - 18 });
  }
  doc.x = PAGE.margin_pt;
  doc.y += 8;
}

function kN(force_N: number): string {
  return formatNumber(Math.abs(force_N) / 1000);
}

function flagText(flag: RunFlag): string {
  return FLAG_TEXT[flag] ?? `Flag: ${flag}.`;
}

function calculationSheet(doc: Pdf, sheet: CalculationSheetData, data: CheckReportData): void {
  const { check } = sheet;
  const governing = check.governing;
  if (governing === null) {
    throw new ValidationError(`The calculation sheet for ${sheet.memberLabel} needs a checked member: it has no governing combination.`, {
      code: 'report_sheet_invalid',
    });
  }
  doc.addPage();
  heading(doc, `Calculation sheet — ${sheet.memberLabel}`);
  const status = check.status === 'fail' ? SHEET_STATUS.fail : SHEET_STATUS.warning;
  table(
    doc,
    [{ header: 'Member', weight: 1 }, { header: '', weight: 1.6 }, { header: 'Result', weight: 1 }, { header: '', weight: 1.2 }],
    [
      ['GlobalId', check.globalId, 'Standard', STANDARD_LABELS[data.parameters.standard]],
      ['Profile', `${sheet.profileName} (${check.fabrication ?? sheet.section?.fabrication ?? '—'})`, 'Governing combination', governing.combination],
      ['Grade', `${check.grade ?? 'given fy'} · fy = ${formatNumber(check.fy_MPa ?? Number.NaN)} MPa`, 'VEd / VRd', `${kN(governing.VEd_N)} / ${kN(governing.VRd_N)} kN`],
      ['Storey', sheet.storey ?? '—', 'Utilisation', { text: `${percentText(governing.utilisation)} · ${status.label}`, fill: status.fill }],
    ],
  );
  if (sheet.sectionNote) paragraph(doc, sheet.sectionNote, { size: TEXT_SIZE.small });
  sheetDrawings(doc, sheet, governing, data);
  if (check.flags.length > 0) paragraph(doc, check.flags.map((flag) => `• ${flagText(flag)}`).join('\n'), { size: TEXT_SIZE.small });

  heading(doc, 'Clause by clause (governing combination)');
  table(
    doc,
    [
      { header: 'Clause', weight: 1.3 },
      { header: 'What', weight: 1.9 },
      { header: 'Formula', weight: 1.6, role: 'mono' },
      { header: 'Values', weight: 2.2, role: 'mono' },
      { header: 'Result', weight: 0.9, align: 'right', role: 'mono' },
      { header: 'Unit', weight: 0.5 },
    ],
    sheet.trace.map((step) => [
      step.clause,
      step.what,
      step.formula,
      step.substituted,
      typeof step.result === 'number' ? formatNumber(step.result) : step.result,
      step.unit,
    ]),
    TEXT_SIZE.tiny,
  );

  heading(doc, 'Load combinations');
  paragraph(doc, 'The capacity does not depend on the combination; each row is |VEd| / VRd.', { size: TEXT_SIZE.small, color: COLOURS.muted });
  table(
    doc,
    [
      { header: 'Combination', weight: 2 },
      { header: 'VEd [kN]', weight: 1, align: 'right', role: 'mono' },
      { header: 'VRd [kN]', weight: 1, align: 'right', role: 'mono' },
      { header: 'Utilisation', weight: 1, align: 'right', role: 'mono' },
    ],
    check.combinations.map((combination) => [
      combination.combination === governing.combination ? `${combination.combination} (governing)` : combination.combination,
      formatNumber(combination.VEd_N / 1000),
      kN(governing.VRd_N),
      utilisationCell(combination.utilisation),
    ]),
  );
}

/** Header (after the cover) and the cautions footer with page numbers, written once all pages exist. */
function pageFurniture(doc: Pdf, data: CheckReportData): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // Writing below the bottom margin would otherwise start a new page.
    const margins = doc.page.margins;
    doc.page.margins = { ...margins, bottom: 0 };
    if (i > range.start) {
      writeText(doc, `${data.project.name} · revision ${data.revision.label} · run ${data.run.id}`, 'body', PAGE.margin_pt, 24, {
        size: TEXT_SIZE.tiny,
        color: COLOURS.muted,
        width: CONTENT_WIDTH_PT,
        lineBreak: false,
      });
    }
    const footerTop = PAGE.height_pt - PAGE.bottomMargin_pt + 18;
    doc.moveTo(PAGE.margin_pt, footerTop).lineTo(PAGE.margin_pt + CONTENT_WIDTH_PT, footerTop).lineWidth(0.4).strokeColor(COLOURS.rule).stroke();
    writeText(doc, REPORT_CAUTIONS_TEXT, 'body', PAGE.margin_pt, footerTop + 5, { size: TEXT_SIZE.tiny, color: COLOURS.muted, width: CONTENT_WIDTH_PT });
    writeText(doc, `Page ${i - range.start + 1} of ${range.count}`, 'body', PAGE.margin_pt, footerTop + 34, {
      size: TEXT_SIZE.tiny,
      color: COLOURS.muted,
      width: CONTENT_WIDTH_PT,
      align: 'right',
    });
    doc.page.margins = margins;
  }
}

function toBuffer(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}

export async function buildCheckReport(data: CheckReportData, options: CheckReportOptions = {}): Promise<Buffer> {
  const doc = new PDFDocument({
    size: PAGE.size,
    margins: { top: 48, left: PAGE.margin_pt, right: PAGE.margin_pt, bottom: PAGE.bottomMargin_pt },
    bufferPages: true,
    compress: options.compress ?? true,
    info: {
      Title: `Web shear check report — ${data.project.name}, revision ${data.revision.label}`,
      Author: data.generatedBy,
      Creator: 'Taulens',
      Subject: STANDARD_LABELS[data.parameters.standard],
      CreationDate: new Date(data.generatedAt),
    },
  });
  const done = toBuffer(doc);
  registerReportFonts(doc);
  cover(doc, data);
  parametersAndRun(doc, data);
  summary(doc, data);
  findingsTable(doc, data);
  for (const sheet of data.sheets) calculationSheet(doc, sheet, data);
  pageFurniture(doc, data);
  doc.end();
  return done;
}
