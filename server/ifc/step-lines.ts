/**
 * Positional access to the lines of an open model through web-ifc's raw line data. Raw reads cost a fraction of
 * GetLine (which builds a typed object per value), and the reader makes tens of thousands of them per model.
 *
 * Positions follow the IFC schema's attribute order, except that web-ifc leaves out attributes written '*' (derived
 * in a subtype); none of the entities read positionally here has such attributes, the units are read by name instead.
 */
import type { IfcAPI } from 'web-ifc';

export type StepValue = null | StepValue[] | { type: number; value: unknown; typecode?: number };

export interface StepLine {
  id: number;
  type: number;
  args: StepValue[];
}

const STRING = 1;
const TYPED = 2;
const ENUM = 3;
const REAL = 4;
const REF = 5;
const INTEGER = 10;

function scalar(value: StepValue | undefined): { type: number; value: unknown } | undefined {
  return value !== null && value !== undefined && !Array.isArray(value) ? value : undefined;
}

/** Express id of a reference, or undefined for '$' and for anything that is not a reference. */
export function refOf(value: StepValue | undefined): number | undefined {
  const v = scalar(value);
  return v?.type === REF && typeof v.value === 'number' && v.value > 0 ? v.value : undefined;
}

export function refsOf(value: StepValue | undefined): number[] {
  if (!Array.isArray(value)) return [];
  const ids: number[] = [];
  for (const item of value) {
    const id = refOf(item);
    if (id !== undefined) ids.push(id);
  }
  return ids;
}

export function textOf(value: StepValue | undefined): string | null {
  const v = scalar(value);
  return v && (v.type === STRING || v.type === TYPED) && typeof v.value === 'string' ? v.value : null;
}

/** A real or integer, also inside a typed select such as IFCPARAMETERVALUE(0.5). */
export function numberOf(value: StepValue | undefined): number | undefined {
  const v = scalar(value);
  if (!v || (v.type !== REAL && v.type !== INTEGER && v.type !== TYPED)) return undefined;
  const n = typeof v.value === 'number' ? v.value : typeof v.value === 'string' ? Number(v.value) : NaN;
  return Number.isFinite(n) ? n : undefined;
}

export function numbersOf(value: StepValue | undefined): number[] {
  return Array.isArray(value) ? value.map((v) => numberOf(v) ?? NaN) : [];
}

export function enumOf(value: StepValue | undefined): string | null {
  const v = scalar(value);
  return v?.type === ENUM && typeof v.value === 'string' ? v.value : null;
}

export function booleanOf(value: StepValue | undefined): boolean | undefined {
  const v = scalar(value);
  if (v?.type !== ENUM) return undefined;
  if (typeof v.value === 'boolean') return v.value;
  return v.value === 'T' ? true : v.value === 'F' ? false : undefined;
}

interface RawLine {
  type?: number;
  arguments?: unknown[];
}

export class StepLines {
  private readonly typeNames = new Map<number, string>();
  private readonly readRaw: (id: number) => RawLine | undefined;

  constructor(
    readonly api: IfcAPI,
    readonly modelId: number,
  ) {
    // The wasm module's single-line read skips the id-vector round trip of GetRawLineData (about 10 % per read).
    const wasm = api.wasmModule as { GetLine?: (model: number, id: number) => RawLine } | undefined;
    this.readRaw = typeof wasm?.GetLine === 'function' ? (id) => wasm.GetLine!(modelId, id) : (id) => api.GetRawLineData(modelId, id);
  }

  /** The line with this express id, or undefined when the file has none. */
  line(id: number | undefined): StepLine | undefined {
    if (id === undefined) return undefined;
    const raw = this.readRaw(id);
    return raw && typeof raw.type === 'number' ? { id, type: raw.type, args: (raw.arguments ?? []) as StepValue[] } : undefined;
  }

  /** Entity type code of a line (0 when absent); much cheaper than reading the line. */
  typeOf(id: number | undefined): number {
    return id === undefined ? 0 : this.api.GetLineType(this.modelId, id) || 0;
  }

  /** Schema spelling of a type code, e.g. 'IfcBeamStandardCase'. */
  typeName(type: number): string {
    let name = this.typeNames.get(type);
    if (name === undefined) {
      name = this.api.GetNameFromTypeCode(type) || `#type${type}`;
      this.typeNames.set(type, name);
    }
    return name;
  }

  idsOfType(type: number, withSubtypes = false): number[] {
    const vector = this.api.GetLineIDsWithType(this.modelId, type, withSubtypes);
    const ids = new Array<number>(vector.size());
    for (let i = 0; i < ids.length; i++) ids[i] = vector.get(i);
    return ids;
  }

  /** Typed read by attribute name, for the few lines where web-ifc's schema knowledge matters (units). */
  named(id: number): Record<string, unknown> | undefined {
    return this.api.GetLine(this.modelId, id) as Record<string, unknown> | undefined;
  }
}
