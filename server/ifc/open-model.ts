/**
 * Opens an IFC file with web-ifc after checking its STEP header. A path is streamed into web-ifc in chunks, so a
 * large upload is never held in JavaScript memory as a whole.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { IfcAPI, LogLevel, type LoaderSettings } from 'web-ifc';
import { IfcReadError } from './ifc-read-error';
import { HEADER_PROBE_BYTES, readStepHeader, type StepHeader, TAIL_PROBE_BYTES } from './step-header';

export interface OpenedModel {
  api: IfcAPI;
  modelId: number;
  header: StepHeader;
  byteLength: number;
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

function opened(api: IfcAPI, modelId: number, header: StepHeader, byteLength: number): OpenedModel {
  if (modelId < 0) {
    throw new IfcReadError('unreadable', `web-ifc could not open this ${header.fileSchema} file; it may be damaged.`);
  }
  return { api, modelId, header, byteLength, close: () => api.CloseModel(modelId) };
}

/** Checks the header, then opens the model. Throws IfcReadError for a file that is not a complete, supported IFC. */
export async function openModel(source: Uint8Array | string, settings: LoaderSettings = {}): Promise<OpenedModel> {
  const loaderSettings: LoaderSettings = { ...settings, ALLOW_INCOMPATIBLE_SCHEMA_ALIASES: false };
  if (typeof source !== 'string') {
    const header = headerOfBytes(source);
    const api = await ifcApi();
    return opened(api, api.OpenModel(source, loaderSettings), header, source.byteLength);
  }
  const fd = fs.openSync(source, 'r');
  try {
    const size = fs.fstatSync(fd).size;
    const header = headerOfFile(fd, size);
    const api = await ifcApi();
    let chunk = Buffer.alloc(0);
    const modelId = api.OpenModelFromCallback((offset, length) => {
      if (chunk.length < length) chunk = Buffer.alloc(length);
      const read = fs.readSync(fd, chunk, 0, length, offset);
      return chunk.subarray(0, read);
    }, loaderSettings);
    return opened(api, modelId, header, size);
  } finally {
    fs.closeSync(fd);
  }
}
