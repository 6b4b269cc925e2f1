/**
 * Opens an IFC file with web-ifc after checking its STEP header. A path is streamed into web-ifc in chunks, so a
 * large upload is never held in JavaScript memory as a whole.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { IfcAPI, LogLevel, type LoaderSettings } from 'web-ifc';
import { IfcReadError } from './ifc-read-error';
import { HEADER_PROBE_BYTES, readStepHeader, type StepHeader, TAIL_PROBE_BYTES } from './step-header';
import { text, type TypeCodeOf } from './step-line-parser';
import { StepOffsets } from './step-offsets';
import { type StepBytes, StepText } from './step-text';

export interface OpenedModel {
  api: IfcAPI;
  modelId: number;
  header: StepHeader;
  byteLength: number;
  /** The instances' own text, for reading attributes without going through web-ifc. */
  text: StepText;
  close(): void;
}

/**
 * The repository's wasm/ folder, found by walking up from this file: the same code runs from server/ifc (ts-node,
 * jest) and from dist/server/server/ifc (compiled), at different depths.
 */
export function wasmDirectory(from: string = __dirname): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    const candidate = path.join(dir, 'wasm');
    if (fs.existsSync(path.join(candidate, 'web-ifc-node.wasm'))) return candidate + path.sep;
    if (path.dirname(dir) === dir) {
      throw new Error(`web-ifc's wasm files were not found in a wasm/ folder above ${from}; run: node server/tools/sync-wasm.js`);
    }
  }
}

let apiPromise: Promise<IfcAPI> | undefined;

/** One initialised web-ifc instance per process (or worker thread): initialising costs about 100 ms. */
export function ifcApi(): Promise<IfcAPI> {
  apiPromise ??= (async () => {
    const api = new IfcAPI();
    api.SetWasmPath(wasmDirectory(), true);
    await api.Init(undefined, true);
    // web-ifc writes its own diagnostics to the console; ours go through IfcReadError and member flags instead.
    api.SetLogLevel(LogLevel.LOG_LEVEL_OFF);
    return api;
  })();
  return apiPromise;
}

function readRange(fd: number, position: number, length: number): Uint8Array {
  const buffer = Buffer.alloc(Math.max(0, length));
  const read = fs.readSync(fd, buffer, 0, buffer.length, position);
  return buffer.subarray(0, read);
}

function headerOfFile(fd: number, size: number): StepHeader {
  return readStepHeader(readRange(fd, 0, HEADER_PROBE_BYTES), readRange(fd, Math.max(0, size - TAIL_PROBE_BYTES), TAIL_PROBE_BYTES), size);
}

function headerOfBytes(bytes: Uint8Array): StepHeader {
  return readStepHeader(bytes.subarray(0, HEADER_PROBE_BYTES), bytes.subarray(Math.max(0, bytes.byteLength - TAIL_PROBE_BYTES)), bytes.byteLength);
}

/** CRC-32 (IEEE 802.3) table: names are looked up by the checksum of their bytes, so no string is built per line. */
const CRC_TABLE = Uint32Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

/** Entity type codes by name bytes (case-insensitive, as STEP names are), asking web-ifc once per distinct name. */
function typeCodesOf(api: IfcAPI): TypeCodeOf {
  const codes = new Map<number, number>();
  return (bytes, start, end) => {
    let crc = 0xffffffff;
    for (let i = start; i < end; i++) {
      const b = bytes[i] >= 0x61 && bytes[i] <= 0x7a ? bytes[i] - 0x20 : bytes[i];
      crc = CRC_TABLE[(crc ^ b) & 0xff] ^ (crc >>> 8);
    }
    let code = codes.get(crc);
    if (code === undefined) {
      code = api.GetTypeCodeFromName(text(bytes, start, end).toUpperCase());
      codes.set(crc, code);
    }
    return code;
  };
}

function opened(api: IfcAPI, modelId: number, header: StepHeader, source: StepBytes, offsets: StepOffsets): OpenedModel {
  if (modelId < 0) {
    throw new IfcReadError('unreadable', `web-ifc could not open this ${header.fileSchema} file; it may be damaged.`);
  }
  const text = new StepText(source, offsets, typeCodesOf(api));
  const byteLength = source.kind === 'bytes' ? source.bytes.byteLength : source.size;
  return {
    api,
    modelId,
    header,
    byteLength,
    text,
    close: () => {
      text.close();
      api.CloseModel(modelId);
    },
  };
}

/** Checks the header, then opens the model. Throws IfcReadError for a file that is not a complete, supported IFC. */
export async function openModel(source: Uint8Array | string, settings: LoaderSettings = {}): Promise<OpenedModel> {
  // web-ifc parses a pre-release name (IFC4X3_RC2) with the released schema only when allowed; the header check lets
  // through only the names it reads as (step-header.ts), never an arbitrary one.
  const loaderSettingsFor = (header: StepHeader): LoaderSettings => ({ ...settings, ALLOW_INCOMPATIBLE_SCHEMA_ALIASES: header.readAs === true });
  const offsets = new StepOffsets();
  if (typeof source !== 'string') {
    const header = headerOfBytes(source);
    const loaderSettings = loaderSettingsFor(header);
    const api = await ifcApi();
    offsets.scan(source, 0);
    return opened(api, api.OpenModel(source, loaderSettings), header, { kind: 'bytes', bytes: source }, offsets);
  }
  const fd = fs.openSync(source, 'r');
  try {
    const size = fs.fstatSync(fd).size;
    const header = headerOfFile(fd, size);
    const loaderSettings = loaderSettingsFor(header);
    const api = await ifcApi();
    let chunk = Buffer.alloc(0);
    // web-ifc reads the file twice, in TAPE_SIZE chunks; the offsets are taken on the first pass only.
    let scannedTo = 0;
    const modelId = api.OpenModelFromCallback((offset, length) => {
      const wanted = Math.max(0, Math.min(length, size - offset));
      // Not zero-filled and no larger than the file: a 64 MB chunk for a small file would only add to the memory used.
      if (chunk.length < wanted) chunk = Buffer.allocUnsafe(wanted);
      const read = wanted === 0 ? 0 : fs.readSync(fd, chunk, 0, wanted, offset);
      const bytes = chunk.subarray(0, read);
      if (offset === scannedTo && read > 0) {
        offsets.scan(bytes, offset);
        scannedTo += read;
      }
      return bytes;
    }, loaderSettings);
    return opened(api, modelId, header, { kind: 'file', path: source, size }, offsets);
  } finally {
    fs.closeSync(fd);
  }
}
