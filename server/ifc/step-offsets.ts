/**
 * Where each entity instance starts in a STEP file: a scanner fed the file's bytes in order (as they are handed to
 * web-ifc, so the file is read once), noting the byte offset of every '#id=' at the start of a statement. Strings and
 * comments are skipped, so a '#' or ';' inside them is not taken for structure (ISO 10303-21 §5–6). Between
 * statements it jumps from one ';', apostrophe or '/' to the next with indexOf, which runs natively.
 */
const HASH = 0x23;
const EQUALS = 0x3d;
const SEMICOLON = 0x3b;
const QUOTE = 0x27;
const SLASH = 0x2f;
const STAR = 0x2a;
const ZERO = 0x30;
const NINE = 0x39;
const SPACE = 0x20;

const NORMAL = 0;
const IN_STRING = 1;
const IN_COMMENT = 2;

/** Ids beyond this are kept in a map, so one absurd id cannot allocate a huge array. */
const DENSE_LIMIT = 1 << 26;

export class StepOffsets {
  /** offset + 1 by express id; 0 = no such instance. */
  private dense = new Uint32Array(1 << 16);
  private readonly sparse = new Map<number, number>();
  private state = NORMAL;
  /** The previous chunk ended with '/' (a comment may open) or, in a comment, with '*' (it may close). */
  private pendingSlash = false;
  private pendingStar = false;
  private atStatementStart = true;
  private readingId = false;
  private id = 0;
  private idOffset = 0;

  /** Feeds the bytes that start at file position `base`; chunks must come in file order. */
  scan(bytes: Uint8Array, base: number): void {
    const n = bytes.length;
    let i = 0;
    let nextQuote = -1;
    let nextSlash = -1;
    const nextOf = (byte: number, cached: number): number => {
      if (cached >= i) return cached;
      const at = bytes.indexOf(byte, i);
      return at < 0 ? n : at;
    };
    while (i < n) {
      if (this.state === IN_STRING) {
        const close = bytes.indexOf(QUOTE, i);
        if (close < 0) return;
        this.state = NORMAL;
        i = close + 1;
        continue;
      }
      if (this.state === IN_COMMENT) {
        if (this.pendingStar && bytes[i] === SLASH) {
          this.state = NORMAL;
          this.pendingStar = false;
          i++;
          continue;
        }
        const star = bytes.indexOf(STAR, i);
        if (star < 0) {
          this.pendingStar = false;
          return;
        }
        if (star + 1 >= n) {
          this.pendingStar = true;
          return;
        }
        if (bytes[star + 1] === SLASH) this.state = NORMAL;
        i = bytes[star + 1] === SLASH ? star + 2 : star + 1;
        continue;
      }
      if (this.pendingSlash) {
        this.pendingSlash = false;
        if (bytes[i] === STAR) {
          this.state = IN_COMMENT;
          i++;
          continue;
        }
      }
      if (this.atStatementStart) {
        i = this.statementStart(bytes, i, base);
        continue;
      }
      // Inside a statement: only a ';' (its end), an apostrophe (a string) or a '/' (maybe a comment) matter.
      nextQuote = nextOf(QUOTE, nextQuote);
      nextSlash = nextOf(SLASH, nextSlash);
      const semicolon = bytes.indexOf(SEMICOLON, i);
      const end = semicolon < 0 ? n : semicolon;
      const stop = Math.min(end, nextQuote, nextSlash);
      if (stop === n) return;
      i = stop + 1;
      if (stop === semicolon) this.atStatementStart = true;
      else if (stop === nextQuote) this.state = IN_STRING;
      else if (i >= n) this.pendingSlash = true;
      else if (bytes[i] === STAR) {
        this.state = IN_COMMENT;
        i++;
      }
    }
  }

  /** Reads the start of a statement byte by byte: '#digits=' records an instance. Returns where to go on. */
  private statementStart(bytes: Uint8Array, from: number, base: number): number {
    for (let i = from; i < bytes.length; i++) {
      const b = bytes[i];
      if (b <= SPACE) continue;
      if (b === SLASH) {
        this.pendingSlash = i + 1 >= bytes.length;
        if (!this.pendingSlash && bytes[i + 1] === STAR) {
          this.state = IN_COMMENT;
          return i + 2;
        }
        continue;
      }
      if (!this.readingId && b === HASH) {
        this.readingId = true;
        this.id = 0;
        this.idOffset = base + i;
      } else if (this.readingId && b >= ZERO && b <= NINE) {
        this.id = this.id * 10 + (b - ZERO);
      } else {
        if (this.readingId && b === EQUALS) this.record(this.id, this.idOffset);
        this.atStatementStart = this.readingId = false;
        if (b === QUOTE) this.state = IN_STRING;
        if (b === SEMICOLON) this.atStatementStart = true;
        return i + 1;
      }
    }
    return bytes.length;
  }

  private record(id: number, offset: number): void {
    if (id >= DENSE_LIMIT || offset >= 0xffffffff) {
      this.sparse.set(id, offset);
      return;
    }
    if (id >= this.dense.length) {
      let length = this.dense.length;
      while (length <= id) length *= 2;
      const grown = new Uint32Array(length);
      grown.set(this.dense);
      this.dense = grown;
    }
    this.dense[id] = offset + 1;
  }

  offsetOf(id: number): number | undefined {
    if (id < this.dense.length && id >= 0) {
      const stored = this.dense[id];
      if (stored > 0) return stored - 1;
    }
    return this.sparse.get(id);
  }
}
