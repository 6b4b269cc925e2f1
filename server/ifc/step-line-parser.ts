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
  const start = typeNameStart(bytes, at);
  return typeCode(bytes, start, nameEnd(bytes, start));
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

/**
 * Kinds of the values of a FlatLine: the codes of the line data above, plus LIST for a list (also the arguments of a
 * typed value, which follow it).
 */
export const FLAT_STRING = 1;
export const FLAT_TYPED = 2;
export const FLAT_ENUM = 3;
export const FLAT_REAL = 4;
export const FLAT_REF = 5;
export const FLAT_NULL = 0;
export const FLAT_INTEGER = 10;
export const FLAT_BINARY = 11;
export const FLAT_LIST = 20;

/**
 * One instance read into numbers only, for the hot paths that read tens of thousands of points and face loops: each
 * value, depth first, has a kind and a number (a real or integer's value, a reference's id, 1 or 0 for .T. and .F.,
 * and for a list or typed value the index of the first value after it; NaN otherwise). Strings are not decoded.
 * The arrays are reused from one read to the next.
 */
export class FlatLine {
  type = 0;
  count = 0;
  kinds = new Uint8Array(256);
  values = new Float64Array(256);

  /** Index of the value after the one at `at` (a list's values are skipped). */
  next(at: number): number {
    return this.kinds[at] === FLAT_LIST || this.kinds[at] === FLAT_TYPED ? this.values[at] : at + 1;
  }

  /** Index of the attribute at `position`, or -1 when the instance has fewer attributes. */
  attribute(position: number): number {
    let at = 0;
    for (let k = 0; k < position && at < this.count; k++) at = this.next(at);
    return at < this.count ? at : -1;
  }

  push(kind: number, value: number): number {
    if (this.count === this.kinds.length) {
      const kinds = new Uint8Array(2 * this.count);
      const values = new Float64Array(2 * this.count);
      kinds.set(this.kinds);
      values.set(this.values);
      this.kinds = kinds;
      this.values = values;
    }
    this.kinds[this.count] = kind;
    this.values[this.count] = value;
    return this.count++;
  }
}

/** Exact powers of ten: a decimal mantissa below 2^53 divided by one of them rounds as Number() would. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);

/** The number written in bytes [start, end): exactly Number() of the text, without building the text when it is plain. */
function numberIn(bytes: Uint8Array, start: number, end: number): number {
  let i = start;
  const negative = bytes[i] === 0x2d;
  if (negative || bytes[i] === 0x2b) i++;
  let mantissa = 0;
  let digits = 0;
  let decimals = 0;
  let dot = false;
  for (; i < end; i++) {
    const b = bytes[i];
    if (b >= 0x30 && b <= 0x39) {
      mantissa = mantissa * 10 + (b - 0x30);
      digits++;
      if (dot) decimals++;
    } else if (b === DOT && !dot) dot = true;
    else break;
  }
  if (i < end || digits === 0 || mantissa > Number.MAX_SAFE_INTEGER || decimals > 22) return Number(text(bytes, start, end));
  const value = mantissa / POWERS_OF_TEN[decimals];
  return negative ? -value : value;
}

/** Past blanks and comments from `i`; throws NeedMoreBytes when the bytes end first. */
function skipBlank(bytes: Uint8Array, i: number): number {
  const n = bytes.length;
  for (;;) {
    while (i < n && bytes[i] <= 0x20) i++;
    if (i + 1 < n && bytes[i] === SLASH && bytes[i + 1] === STAR) {
      i = findCommentEnd(bytes, i + 2);
      if (i < 0) throw new NeedMoreBytes();
      continue;
    }
    if (i >= n) throw new NeedMoreBytes();
    return i;
  }
}

/** Where the type name of the instance at `at` starts, past '#id='. */
function typeNameStart(bytes: Uint8Array, at: number): number {
  let i = skipBlank(bytes, at);
  if (bytes[i] !== HASH) throw new SyntaxError(`expected '#' at byte ${i}`);
  i = skipBlank(bytes, i + 1);
  while (bytes[i] >= 0x30 && bytes[i] <= 0x39) i = skipBlank(bytes, i + 1);
  if (bytes[i] !== 0x3d) throw new SyntaxError(`expected '=' at byte ${i}`);
  return skipBlank(bytes, i + 1);
}

/** Past the name bytes from `i`. */
function nameEnd(bytes: Uint8Array, i: number): number {
  while (i < bytes.length && isNameByte(bytes[i])) i++;
  if (i >= bytes.length) throw new NeedMoreBytes();
  return i;
}

/** Reads the list at `i` ('(' after blanks) into `into` without an entry of its own; answers the position after ')'. */
function flatItems(bytes: Uint8Array, i: number, into: FlatLine): number {
  i = skipBlank(bytes, i);
  if (bytes[i] !== OPEN) throw new SyntaxError(`expected '(' at byte ${i}`);
  i = skipBlank(bytes, i + 1);
  if (bytes[i] === CLOSE) return i + 1;
  for (;;) {
    i = flatValue(bytes, i, into);
    i = skipBlank(bytes, i);
    const next = bytes[i++];
    if (next === CLOSE) return i;
    if (next !== COMMA) throw new SyntaxError(`expected ',' or ')' at byte ${i - 1}`);
  }
}

/** Reads the value at `i` (blanks skipped) into `into`; answers the position after it. */
function flatValue(bytes: Uint8Array, i: number, into: FlatLine): number {
  i = skipBlank(bytes, i);
  const n = bytes.length;
  const b = bytes[i];
  if (b === DOLLAR || b === STAR) {
    into.push(FLAT_NULL, NaN);
    return i + 1;
  }
  if (b === OPEN) {
    const entry = into.push(FLAT_LIST, NaN);
    i = flatItems(bytes, i, into);
    into.values[entry] = into.count;
    return i;
  }
  if (b === HASH) {
    let id = 0;
    i++;
    while (i < n && bytes[i] >= 0x30 && bytes[i] <= 0x39) id = id * 10 + (bytes[i++] - 0x30);
    if (i >= n) throw new NeedMoreBytes();
    into.push(FLAT_REF, id);
    return i;
  }
  if ((b >= 0x30 && b <= 0x39) || b === 0x2b || b === 0x2d) {
    const start = i;
    let real = false;
    while (i < n && isNumberByte(bytes[i])) {
      const c = bytes[i++];
      real ||= c === DOT || c === 0x45 || c === 0x65;
    }
    if (i >= n) throw new NeedMoreBytes();
    into.push(real ? FLAT_REAL : FLAT_INTEGER, numberIn(bytes, start, i));
    return i;
  }
  if (b === DOT) {
    const start = ++i;
    while (i < n && bytes[i] !== DOT) i++;
    if (i >= n) throw new NeedMoreBytes();
    const one = i === start + 1 ? bytes[start] : 0;
    into.push(FLAT_ENUM, one === 0x54 ? 1 : one === 0x46 ? 0 : NaN);
    return i + 1;
  }
  if (b === QUOTE) {
    i++;
    for (;;) {
      const close = bytes.indexOf(QUOTE, i);
      if (close < 0 || close + 1 >= n) throw new NeedMoreBytes();
      i = close + 1;
      if (bytes[i] !== QUOTE) break;
      i++;
    }
    into.push(FLAT_STRING, NaN);
    return i;
  }
  if (b === QUOTE2) {
    const close = bytes.indexOf(QUOTE2, i + 1);
    if (close < 0) throw new NeedMoreBytes();
    into.push(FLAT_BINARY, NaN);
    return close + 1;
  }
  // A typed value such as IFCPARAMETERVALUE(0.5): its arguments follow as a list.
  i = nameEnd(bytes, i);
  const entry = into.push(FLAT_TYPED, NaN);
  i = flatItems(bytes, i, into);
  into.values[entry] = into.count;
  return i;
}

/**
 * Reads the instance starting at `at` (its '#') into `into`: its type, then its arguments from index 0. Throws as
 * parseLine does.
 */
export function parseFlatLine(bytes: Uint8Array, at: number, typeCode: TypeCodeOf, into: FlatLine): void {
  const nameStart = typeNameStart(bytes, at);
  let i = nameEnd(bytes, nameStart);
  into.type = typeCode(bytes, nameStart, i);
  into.count = 0;
  i = skipBlank(bytes, flatItems(bytes, i, into));
  if (bytes[i] !== SEMICOLON) throw new SyntaxError(`expected ';' at byte ${i}`);
}
