/**
 * Positional access to the lines of an open model: attributes by their position in the IFC schema's attribute order
 * ('*' and '$' both read as null), parsed from the file's own text. web-ifc answers the questions it answers cheaply
 * (entity types, ids by type, placements) and the few by-name reads (units).
 */
import type { IfcAPI } from 'web-ifc';
import { FlatLine, parseFlatLine, type TypeCodeOf } from './step-line-parser';
import type { StepText } from './step-text';

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

export class StepLines {
  private readonly typeNames = new Map<number, string>();
  private readonly flatLine = new FlatLine();
  private readonly flatParser = (bytes: Uint8Array, at: number, typeCode: TypeCodeOf): FlatLine => {
    parseFlatLine(bytes, at, typeCode, this.flatLine);
    return this.flatLine;
  };

  /**
   * Lines are parsed from the file's own bytes rather than read through web-ifc: its per-line marshalling cost
   * several microseconds, and the reader makes tens of thousands of reads per model.
   */
  constructor(
    readonly api: IfcAPI,
    readonly modelId: number,
    private readonly text: StepText,
  ) {}

  /** The line with this express id, or undefined when the file has none. */
  line(id: number | undefined): StepLine | undefined {
    if (id === undefined) return undefined;
    const parsed = this.text.line(id);
    return parsed ? { id, type: parsed.type, args: parsed.args } : undefined;
  }

  /**
   * The line read as numbers only (see FlatLine), or undefined as for line(). The answer is one object reused by the
   * next call: copy what is needed first.
   */
  flat(id: number | undefined): FlatLine | undefined {
    return id === undefined ? undefined : this.text.parse(id, this.flatParser);
  }

  /** Entity type code of a line (0 when absent), without parsing its arguments. */
  typeOf(id: number | undefined): number {
    return id === undefined ? 0 : this.text.typeOf(id);
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
