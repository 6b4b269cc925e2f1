/**
 * The text of entity instances, by express id, straight from the file's bytes: the bytes themselves when the model
 * was given in memory, else the file read in 64 KB blocks through a small cache (instances that belong together are
 * written close together, so a handful of blocks serve most reads).
 */
import * as fs from 'node:fs';
import { NeedMoreBytes, type ParsedLine, parseLine, parseTypeName, type TypeCodeOf } from './step-line-parser';
import type { StepOffsets } from './step-offsets';

const BLOCK_BYTES = 64 * 1024;
const CACHED_BLOCKS = 64;
/** Longest instance accepted (an IfcCartesianPointList3D of a large mesh can run to megabytes). */
const MAX_INSTANCE_BYTES = 256 * 1024 * 1024;

/** Reads the instance whose '#' is at `at`; throws NeedMoreBytes when the bytes end first. */
export type InstanceParser<T> = (bytes: Uint8Array, at: number, typeCode: TypeCodeOf) => T;

export type StepBytes = { kind: 'bytes'; bytes: Uint8Array } | { kind: 'file'; path: string; size: number };

export class StepText {
  private fd: number | undefined;
  private readonly blocks = new Map<number, Uint8Array>();
  /** The block read last: most reads fall in it, and this skips the cache bookkeeping. */
  private lastIndex = -1;
  private lastBlock: Uint8Array = new Uint8Array();

  constructor(
    private readonly source: StepBytes,
    private readonly offsets: StepOffsets,
    private readonly typeCode: TypeCodeOf,
  ) {}

  /** The parsed instance, or undefined when the file has no such id or the text is not an instance we read. */
  line(id: number): ParsedLine | undefined {
    return this.parse(id, parseLine);
  }

  /** The instance read by `parser` (parseLine or another reader of step-line-parser.ts), or undefined as for line(). */
  parse<T>(id: number, parser: InstanceParser<T>): T | undefined {
    const offset = this.offsets.offsetOf(id);
    if (offset === undefined) return undefined;
    try {
      if (this.source.kind === 'bytes') return parser(this.source.bytes, offset, this.typeCode);
      return this.parseFromFile(offset, parser);
    } catch (error) {
      if (error instanceof SyntaxError || error instanceof NeedMoreBytes) return undefined;
      throw error;
    }
  }

  /** Parses in place in the offset's block; only an instance running past the block needs a joined window. */
  private parseFromFile<T>(offset: number, parser: InstanceParser<T>): T {
    const index = Math.floor(offset / BLOCK_BYTES);
    const block = this.block(index);
    try {
      return parser(block, offset - index * BLOCK_BYTES, this.typeCode);
    } catch (error) {
      if (!(error instanceof NeedMoreBytes) || block.length < BLOCK_BYTES) throw error;
    }
    for (let length = 2 * BLOCK_BYTES; ; length *= 4) {
      const window = this.window(offset, length);
      try {
        return parser(window, 0, this.typeCode);
      } catch (error) {
        if (!(error instanceof NeedMoreBytes) || window.length < length || length >= MAX_INSTANCE_BYTES) throw error;
      }
    }
  }

  /** Entity type code of an instance, from its name alone (0 when there is none): avoids parsing long instances. */
  typeOf(id: number): number {
    const offset = this.offsets.offsetOf(id);
    if (offset === undefined) return 0;
    try {
      const bytes = this.source.kind === 'bytes' ? this.source.bytes : this.window(offset, Math.min(BLOCK_BYTES, 256));
      return parseTypeName(bytes, this.source.kind === 'bytes' ? offset : 0, this.typeCode);
    } catch (error) {
      if (error instanceof SyntaxError || error instanceof NeedMoreBytes) return 0;
      throw error;
    }
  }

  /** Up to `length` bytes from `offset`, from cached blocks. */
  private window(offset: number, length: number): Uint8Array {
    const end = Math.min(offset + length, (this.source as { size: number }).size);
    const first = Math.floor(offset / BLOCK_BYTES);
    const last = Math.floor((end - 1) / BLOCK_BYTES);
    if (first === last) {
      const block = this.block(first);
      return block.subarray(offset - first * BLOCK_BYTES, end - first * BLOCK_BYTES);
    }
    const out = new Uint8Array(end - offset);
    for (let b = first; b <= last; b++) {
      const block = this.block(b);
      const from = Math.max(offset, b * BLOCK_BYTES);
      const to = Math.min(end, (b + 1) * BLOCK_BYTES);
      out.set(block.subarray(from - b * BLOCK_BYTES, to - b * BLOCK_BYTES), from - offset);
    }
    return out;
  }

  private block(index: number): Uint8Array {
    if (index === this.lastIndex) return this.lastBlock;
    const block = this.cachedBlock(index);
    this.lastIndex = index;
    this.lastBlock = block;
    return block;
  }

  private cachedBlock(index: number): Uint8Array {
    let block = this.blocks.get(index);
    if (block) {
      // Refresh its place in the insertion order, which the cache evicts from the front.
      this.blocks.delete(index);
      this.blocks.set(index, block);
      return block;
    }
    const source = this.source as { path: string };
    this.fd ??= fs.openSync(source.path, 'r');
    const buffer = Buffer.alloc(BLOCK_BYTES);
    const read = fs.readSync(this.fd, buffer, 0, BLOCK_BYTES, index * BLOCK_BYTES);
    block = buffer.subarray(0, read);
    this.blocks.set(index, block);
    if (this.blocks.size > CACHED_BLOCKS) this.blocks.delete(this.blocks.keys().next().value as number);
    return block;
  }

  close(): void {
    if (this.fd !== undefined) fs.closeSync(this.fd);
    this.fd = undefined;
    this.blocks.clear();
    this.lastIndex = -1;
  }
}
