/**
 * Parses one entity instance '#id= NAME(arguments);' from the bytes of a STEP file into the same shape web-ifc's raw
 * line data has ({type, value} per value: 1 string, 2 typed select, 3 enumeration or logical, 4 real as written,
 * 5 reference, 10 integer; '$' and '*' as null; lists as arrays), so the readers work with either.
 * Unlike web-ifc, '*' keeps its position.
 */
import { decodeStepString } from './step-header';
import type { StepValue } from './step-lines';

/** Entity type code of the name in bytes [start, end). */
export type TypeCodeOf = (bytes: Uint8Array, start: number, end: number) => number;

export interface ParsedLine {
  /** web-ifc's code for the entity type (the constants IFCBEAM, …). */
  type: number;
  args: StepValue[];
}

/** Thrown when the bytes end before the instance does; the caller retries with a longer window. */
export class NeedMoreBytes extends Error {}

const QUOTE = 0x27;
const HASH = 0x23;
const DOLLAR = 0x24;
const STAR = 0x2a;
const DOT = 0x2e;
const OPEN = 0x28;
const CLOSE = 0x29;
const COMMA = 0x2c;
const SLASH = 0x2f;
const SEMICOLON = 0x3b;
const QUOTE2 = 0x22;

const latin1 = new TextDecoder('latin1');

/** ISO 8859-1 text of a byte range; TextDecoder only pays off for long runs. */
export function text(bytes: Uint8Array, start: number, end: number): string {
  if (end - start > 64) return latin1.decode(bytes.subarray(start, end));
  let out = '';
  for (let i = start; i < end; i++) out += String.fromCharCode(bytes[i]);
  return out;
}

const isSpace = (b: number): boolean => b <= 0x20;
const isNameByte = (b: number): boolean => (b >= 0x41 && b <= 0x5a) || (b >= 0x61 && b <= 0x7a) || (b >= 0x30 && b <= 0x39) || b === 0x5f;
const isNumberByte = (b: number): boolean => (b >= 0x30 && b <= 0x39) || b === 0x2b || b === 0x2d || b === DOT || b === 0x45 || b === 0x65;

class Cursor {
  constructor(
    readonly bytes: Uint8Array,
    public at: number,
    private readonly typeCode: TypeCodeOf,
  ) {}

  peek(): number {
    this.skipBlank();
    if (this.at >= this.bytes.length) throw new NeedMoreBytes();
    return this.bytes[this.at];
  }

  private skipBlank(): void {
    const bytes = this.bytes;
    for (;;) {
      while (this.at < bytes.length && isSpace(bytes[this.at])) this.at++;
      if (this.at + 1 < bytes.length && bytes[this.at] === SLASH && bytes[this.at + 1] === STAR) {
        const end = findCommentEnd(bytes, this.at + 2);
        if (end < 0) throw new NeedMoreBytes();
        this.at = end;
      } else return;
    }
  }

  expect(byte: number): void {
    if (this.peek() !== byte) throw new SyntaxError(`expected '${String.fromCharCode(byte)}' at byte ${this.at}`);
    this.at++;
  }

  /** Type code of the entity or select type name at the cursor. */
  typeName(): number {
    this.peek();
    const start = this.at;
    while (this.at < this.bytes.length && isNameByte(this.bytes[this.at])) this.at++;
    if (this.at >= this.bytes.length) throw new NeedMoreBytes();
    return this.typeCode(this.bytes, start, this.at);
  }

  list(): StepValue[] {
    this.expect(OPEN);
    const values: StepValue[] = [];
    if (this.peek() === CLOSE) {
      this.at++;
      return values;
    }
    for (;;) {
      values.push(this.value());
      const next = this.peek();
      this.at++;
      if (next === CLOSE) return values;
      if (next !== COMMA) throw new SyntaxError(`expected ',' or ')' at byte ${this.at - 1}`);
    }
  }

  value(): StepValue {
    const b = this.peek();
    const bytes = this.bytes;
    if (b === DOLLAR || b === STAR) {
      this.at++;
      return null;
    }
    if (b === OPEN) return this.list();
    if (b === HASH) {
      let id = 0;
      this.at++;
      while (this.at < bytes.length && bytes[this.at] >= 0x30 && bytes[this.at] <= 0x39) id = id * 10 + (bytes[this.at++] - 0x30);
      if (this.at >= bytes.length) throw new NeedMoreBytes();
      return { type: 5, value: id };
    }
    if (b === QUOTE) return { type: 1, value: this.string() };
    if (b === DOT) {
      const start = ++this.at;
      while (this.at < bytes.length && bytes[this.at] !== DOT) this.at++;
      if (this.at >= bytes.length) throw new NeedMoreBytes();
      const name = text(bytes, start, this.at++);
      return { type: 3, value: name === 'T' ? true : name === 'F' ? false : name };
    }
    if (b === QUOTE2) {
      const start = ++this.at;
      while (this.at < bytes.length && bytes[this.at] !== QUOTE2) this.at++;
      if (this.at >= bytes.length) throw new NeedMoreBytes();
      return { type: 11, value: text(bytes, start, this.at++) };
    }
    if ((b >= 0x30 && b <= 0x39) || b === 0x2b || b === 0x2d) {
      const start = this.at;
      let real = false;
      while (this.at < bytes.length && isNumberByte(bytes[this.at])) {
        const c = bytes[this.at++];
        real ||= c === DOT || c === 0x45 || c === 0x65;
      }
      if (this.at >= bytes.length) throw new NeedMoreBytes();
      const number = text(bytes, start, this.at);
      return real ? { type: 4, value: number } : { type: 10, value: Number(number) };
    }
    // A typed value such as IFCPARAMETERVALUE(0.5) or IFCARCINDEX((1,2,3)).
    const typecode = this.typeName();
    const inner = this.list();
    const only = inner[0];
    const value = only !== null && only !== undefined && !Array.isArray(only) ? only.value : only;
    return { type: 2, typecode, value };
  }

  private string(): string {
    const bytes = this.bytes;
    const start = ++this.at;
    let escaped = false;
    for (;;) {
      if (this.at >= bytes.length) throw new NeedMoreBytes();
      const b = bytes[this.at];
      if (b === QUOTE) {
        if (this.at + 1 >= bytes.length) throw new NeedMoreBytes();
        if (bytes[this.at + 1] !== QUOTE) break;
        escaped = true;
        this.at += 2;
      } else {
        if (b === 0x5c) escaped = true;
        this.at++;
      }
    }
    const raw = text(bytes, start, this.at++);
    return escaped ? decodeStepString(raw) : raw;
  }
}

/** A cursor past '#id=' of the instance at `at`. */
function instanceStart(bytes: Uint8Array, at: number, typeCode: TypeCodeOf): Cursor {
  const cursor = new Cursor(bytes, at, typeCode);
  cursor.expect(HASH);
  while (cursor.peek() >= 0x30 && cursor.peek() <= 0x39) cursor.at++;
  cursor.expect(0x3d);
  return cursor;
}

/** Only the entity type of the instance at `at`. */
export function parseTypeName(bytes: Uint8Array, at: number, typeCode: TypeCodeOf): number {
  return instanceStart(bytes, at, typeCode).typeName();
}

function findCommentEnd(bytes: Uint8Array, from: number): number {
  for (let i = from; i + 1 < bytes.length; i++) if (bytes[i] === STAR && bytes[i + 1] === SLASH) return i + 2;
  return -1;
}

/**
 * Parses the instance starting at `at` (its '#'). Throws NeedMoreBytes when `bytes` ends first, SyntaxError for text
 * that is not an instance this parser reads (complex instances '#1=(A()B());' among them).
 */
export function parseLine(bytes: Uint8Array, at: number, typeCode: TypeCodeOf): ParsedLine {
  const cursor = instanceStart(bytes, at, typeCode);
  const type = cursor.typeName();
  const args = cursor.list();
  cursor.expect(SEMICOLON);
  return { type, args };
}
