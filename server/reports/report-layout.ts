/** Page furniture of the check report: A4 geometry, colours, headings, tables that break across pages. */
import { type FontRole, type Pdf, textHeight, writeText } from './pdf-text';

export const PAGE = {
  size: 'A4' as const,
  width_pt: 595.28,
  height_pt: 841.89,
  margin_pt: 48,
  /** Room under the body for the cautions footer. */
  bottomMargin_pt: 86,
};

export const CONTENT_WIDTH_PT = PAGE.width_pt - 2 * PAGE.margin_pt;

/** Our seed colours (PRODUCT.md: patina and copper) and neutral greys. */
export const COLOURS = {
  patina: '#2E5E5A',
  patinaLight: '#E3ECEA',
  copper: '#B8622D',
  ink: '#1E2322',
  muted: '#5B6563',
  rule: '#C5CFCD',
  zebra: '#F4F7F6',
  /** Same status colours as the 3D view (src/app/viewer/utilisation-colours.ts): magenta for over capacity. */
  fail: '#F000F0',
  warning: '#E69F00',
  pass: '#4477AA',
};

export const TEXT_SIZE = { body: 9, small: 7.5, tiny: 6.5, heading: 13, title: 22 };

export function bottomLimit(): number {
  return PAGE.height_pt - PAGE.bottomMargin_pt;
}

/** Starts a new page when fewer than `height_pt` remain above the footer. */
export function ensureSpace(doc: Pdf, height_pt: number): void {
  if (doc.y + height_pt > bottomLimit()) doc.addPage();
}

export function heading(doc: Pdf, text: string): void {
  ensureSpace(doc, 60);
  doc.moveDown(0.6);
  writeText(doc, text, 'bold', PAGE.margin_pt, doc.y, { size: TEXT_SIZE.heading, color: COLOURS.patina });
  const y = doc.y + 2;
  doc.moveTo(PAGE.margin_pt, y).lineTo(PAGE.margin_pt + CONTENT_WIDTH_PT, y).lineWidth(0.8).strokeColor(COLOURS.patina).stroke();
  doc.y = y + 6;
}

export function paragraph(doc: Pdf, text: string, options: { size?: number; color?: string; role?: FontRole } = {}): void {
  const size = options.size ?? TEXT_SIZE.body;
  ensureSpace(doc, textHeight(doc, text, options.role ?? 'body', size, CONTENT_WIDTH_PT));
  writeText(doc, text, options.role ?? 'body', PAGE.margin_pt, doc.y, { size, color: options.color ?? COLOURS.ink, width: CONTENT_WIDTH_PT });
  doc.moveDown(0.3);
}

export interface TableColumn {
  header: string;
  /** Share of the table width; the shares are scaled to fill it. */
  weight: number;
  align?: 'left' | 'right';
  role?: FontRole;
}

export interface TableCell {
  text: string;
  /** Fill behind the cell (status chips). */
  fill?: string;
}

export type TableRow = readonly (string | TableCell)[];

const CELL_PAD_PT = 3;

function cellOf(value: string | TableCell): TableCell {
  return typeof value === 'string' ? { text: value } : value;
}

function rowHeight(doc: Pdf, columns: readonly TableColumn[], widths: readonly number[], row: TableRow, size: number): number {
  let height = 0;
  row.forEach((value, i) => {
    const role = columns[i].role ?? 'body';
    height = Math.max(height, textHeight(doc, cellOf(value).text, role, size, widths[i] - 2 * CELL_PAD_PT));
  });
  return height + 2 * CELL_PAD_PT;
}

function drawRow(
  doc: Pdf,
  columns: readonly TableColumn[],
  widths: readonly number[],
  row: TableRow,
  y: number,
  height: number,
  style: { size: number; header: boolean; zebra: boolean },
): void {
  let x = PAGE.margin_pt;
  if (style.header || style.zebra) {
    doc.rect(x, y, CONTENT_WIDTH_PT, height).fill(style.header ? COLOURS.patinaLight : COLOURS.zebra);
  }
  row.forEach((value, i) => {
    const cell = cellOf(value);
    if (cell.fill) doc.rect(x + 1, y + 1, widths[i] - 2, height - 2).fill(cell.fill);
    const role = style.header ? 'bold' : columns[i].role ?? 'body';
    writeText(doc, cell.text, role, x + CELL_PAD_PT, y + CELL_PAD_PT, {
      size: style.size,
      color: COLOURS.ink,
      width: widths[i] - 2 * CELL_PAD_PT,
      align: style.header ? 'left' : columns[i].align ?? 'left',
    });
    x += widths[i];
  });
  doc.moveTo(PAGE.margin_pt, y + height).lineTo(PAGE.margin_pt + CONTENT_WIDTH_PT, y + height).lineWidth(0.4).strokeColor(COLOURS.rule).stroke();
}

/** A table across the content width; the header row is repeated on every page the table runs onto. */
export function table(doc: Pdf, columns: readonly TableColumn[], rows: readonly TableRow[], size = TEXT_SIZE.small): void {
  const total = columns.reduce((sum, column) => sum + column.weight, 0);
  const widths = columns.map((column) => (column.weight / total) * CONTENT_WIDTH_PT);
  const headerRow = columns.map((column) => column.header);
  const headerHeight = rowHeight(doc, columns, widths, headerRow, size);
  // Cells move doc.y as they are written, so each row's top is kept here.
  let y = 0;
  const startPage = (): void => {
    y = doc.y;
    drawRow(doc, columns, widths, headerRow, y, headerHeight, { size, header: true, zebra: false });
    y += headerHeight;
  };
  ensureSpace(doc, headerHeight * 3);
  startPage();
  rows.forEach((row, index) => {
    const height = rowHeight(doc, columns, widths, row, size);
    if (y + height > bottomLimit()) {
      doc.addPage();
      startPage();
    }
    drawRow(doc, columns, widths, row, y, height, { size, header: false, zebra: index % 2 === 1 });
    y += height;
  });
  doc.x = PAGE.margin_pt;
  doc.y = y;
  doc.moveDown(0.6);
}
