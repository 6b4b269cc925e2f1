/** How a changed field of a compared member reads: "Section IPE 300 → IPE 270". */
import type { ChangedField, FieldChange } from './models-api';

const FIELD_LABELS: Readonly<Record<ChangedField, string>> = {
  section: 'Section',
  grade: 'Grade',
  fabrication: 'Fabrication',
  length: 'Length',
  position: 'Position',
};

interface AxisValue {
  start_mm: number[];
  end_mm: number[];
}

function isAxis(value: unknown): value is AxisValue {
  return typeof value === 'object' && value !== null && Array.isArray((value as AxisValue).start_mm) && Array.isArray((value as AxisValue).end_mm);
}

function valueText(field: ChangedField, value: unknown): string {
  if (value === null || value === undefined) return 'none';
  if (field === 'length' && typeof value === 'number') return `${value.toLocaleString('en')} mm`;
  if (isAxis(value)) {
    const point = (p: number[]) => `(${p.map((v) => v.toLocaleString('en')).join(', ')})`;
    return `${point(value.start_mm)} → ${point(value.end_mm)} mm`;
  }
  return String(value);
}

export function fieldLabel(field: ChangedField): string {
  return FIELD_LABELS[field] ?? field;
}

/** "IPE 300 → IPE 270"; a moved axis reads "from … to …" because its own value holds an arrow. */
export function changeText(change: FieldChange): string {
  const from = valueText(change.field, change.from);
  const to = valueText(change.field, change.to);
  return change.field === 'position' ? `from ${from} to ${to}` : `${from} → ${to}`;
}
