/**
 * Writes the DATA section of a STEP physical file (ISO 10303-21) one entity at a time, numbering the entities and
 * formatting values the way the standard spells them (reals always with a decimal point, strings in apostrophes).
 * Output goes to a sink, so a 50,000-member model streams to disk instead of being built as one string.
 */

/** A value already formatted as STEP text ('#12', '$', '.T.', '12.5', …). */
export type StepValue = string;

export type StepSink = (text: string) => void;

export class StepWriter {
  private nextId = 1;
  private pending: string[] = [];

  constructor(private readonly sink: StepSink) {}

  /** Writes `#id= TYPE(args);` and returns '#id' for use as a reference. */
  add(type: string, ...args: StepValue[]): StepValue {
    const id = this.nextId++;
    this.pending.push(`#${id}= ${type}(${args.join(',')});\n`);
    // Joining a few thousand lines at a time keeps both the string count and the sink calls low.
    if (this.pending.length >= 4096) this.flush();
    return `#${id}`;
  }

  flush(): void {
    if (this.pending.length > 0) this.sink(this.pending.join(''));
    this.pending = [];
  }
}

export const NULL: StepValue = '$';
export const DERIVED: StepValue = '*';
export const TRUE: StepValue = '.T.';
export const FALSE: StepValue = '.F.';

export function enumValue(name: string): StepValue {
  return `.${name}.`;
}

/** An IFC real: always with a decimal point; exponents as '1.5E-07'. */
export function real(value: number): StepValue {
  if (!Number.isFinite(value)) throw new Error(`STEP reals must be finite, got ${value}`);
  const text = String(Object.is(value, -0) ? 0 : Number(value.toPrecision(15))).toUpperCase();
  if (text.includes('E')) return text.includes('.') ? text : text.replace('E', '.E');
  return text.includes('.') ? text : `${text}.`;
}

export function integer(value: number): StepValue {
  return String(Math.trunc(value));
}

/** A STEP string: ASCII only here (the generator writes no other characters), apostrophes doubled. */
export function text(value: string): StepValue {
  if (!/^[\x20-\x7e]*$/.test(value)) throw new Error(`only printable ASCII is written, got ${JSON.stringify(value)}`);
  return `'${value.replace(/\\/g, '\\\\').replace(/'/g, "''")}'`;
}

export function list(values: readonly StepValue[]): StepValue {
  return `(${values.join(',')})`;
}

export function reals(values: readonly number[]): StepValue {
  return list(values.map(real));
}

/** A typed value inside a SELECT, e.g. IFCLENGTHMEASURE(0.0254). */
export function typed(type: string, value: StepValue): StepValue {
  return `${type}(${value})`;
}
