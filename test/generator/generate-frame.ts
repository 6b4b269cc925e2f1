/**
 * Generator of invented steel frames as IFC files, for tests and benchmarks (100 to 50,000 members).
 *
 *   ts-node -P tsconfig.server.json test/generator/generate-frame.ts --members 20000 --schema IFC4 --unit mm --out x.ifc
 *
 * Options: --members N (default 100), --schema IFC4|IFC4X3|IFC4X3_RC2|IFC2X3 (IFC4; IFC4X3_RC2 writes IFC4X3 under
 * that old header name), --unit mm|m|inch|foot (mm), --defects (three broken beams on the first floor), --far (site
 * 485 km / 5270 km from the project origin), --patterns standard|real-exports (standard: see frame-writer.ts),
 * --bodies extruded|brep (extruded: every member's body an IfcFacetedBrep with brep), --analysis (IFC4 or IFC4X3 in mm or
 * m: adds an invented analysis model with forces, see analysis-model-writer.ts, and writes them as <out>.forces.csv).
 */
import * as fs from 'node:fs';
import { addAnalysisModel } from './analysis-model-writer';
import { frameLayout, type FrameLayout, type Vec3 } from './frame-layout';
import { imperialSections, metricSections } from './frame-sections';
import { type FrameBodies, type FramePatterns, type FrameSchema, type FrameUnit, FrameWriter, type HeaderSchema } from './frame-writer';

export interface GenerateFrameOptions {
  members: number;
  schema?: FrameSchema;
  unit?: FrameUnit;
  defects?: boolean;
  siteOrigin_mm?: Vec3;
  fileName?: string;
  /** 'standard' (default) or 'real-exports': every way real exports give a section, in one model. */
  patterns?: FramePatterns;
  /** 'extruded' (default) or 'brep': every member's body an IfcFacetedBrep, for the ingest benchmark. */
  bodies?: FrameBodies;
  /** FILE_SCHEMA spelling other than the schema's own (IFC4X3_RC2 with schema IFC4X3). */
  headerSchema?: HeaderSchema;
}

/** Survey-style coordinates of a site far from the project origin (invented). */
export const FAR_SITE_ORIGIN_MM: Vec3 = [485_000_000, 5_270_000_000, 12_000];

function write(options: GenerateFrameOptions, sink: (text: string) => void): FrameLayout {
  const schema = options.schema ?? 'IFC4';
  const unit = options.unit ?? 'mm';
  const layout = frameLayout(options.members);
  const fileName = options.fileName ?? `harbour-warehouse-${options.members}.ifc`;
  if (options.defects && (options.patterns === 'real-exports' || options.bodies === 'brep')) {
    throw new Error('defects are written with the standard patterns and extruded bodies only');
  }
  sink(FrameWriter.header({ schema, fileName, headerSchema: options.headerSchema }));
  new FrameWriter(
    {
      schema,
      unit,
      layout,
      sections: unit === 'inch' || unit === 'foot' ? imperialSections() : metricSections(),
      defects: options.defects ?? false,
      siteOrigin_mm: options.siteOrigin_mm ?? [0, 0, 0],
      fileName,
      patterns: options.patterns ?? 'standard',
      bodies: options.bodies ?? 'extruded',
    },
    sink,
  ).write();
  sink(FrameWriter.footer());
  return layout;
}

/** The whole file as a string (for small models in tests). */
export function generateFrame(options: GenerateFrameOptions): string {
  const parts: string[] = [];
  write(options, (text) => parts.push(text));
  return parts.join('');
}

/** Streams the file to `path`; returns the layout that was written. */
export function writeFrameFile(path: string, options: GenerateFrameOptions): FrameLayout {
  const fd = fs.openSync(path, 'w');
  try {
    return write(options, (text) => fs.writeSync(fd, text));
  } finally {
    fs.closeSync(fd);
  }
}

/** The frame with an analysis model (held in memory: analysis models are for small test frames), and its forces as CSV. */
function writeFrameWithAnalysis(path: string, options: GenerateFrameOptions): FrameLayout {
  const { schema = 'IFC4', unit = 'mm' } = options;
  if ((schema !== 'IFC4' && schema !== 'IFC4X3') || (unit !== 'mm' && unit !== 'm')) throw new Error('--analysis is written in IFC4 or IFC4X3, in mm or m');
  const layout = frameLayout(options.members);
  const analysis = addAnalysisModel(generateFrame(options), layout, { schema, unit, siteOrigin_mm: options.siteOrigin_mm });
  fs.writeFileSync(path, analysis.ifc);
  fs.writeFileSync(path.replace(/\.ifc$/i, '') + '.forces.csv', analysis.csv);
  return layout;
}

function parseArguments(argv: readonly string[]): GenerateFrameOptions & { out: string; analysis: boolean } {
  const value = (flag: string): string | undefined => {
    const i = argv.indexOf(flag);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  const members = Number(value('--members') ?? 100);
  const schema = (value('--schema') ?? 'IFC4').toUpperCase();
  const unit = value('--unit') ?? 'mm';
  const patterns = value('--patterns') ?? 'standard';
  const bodies = value('--bodies') ?? 'extruded';
  const out = value('--out');
  if (!Number.isInteger(members) || members < 1) throw new Error('--members must be a positive whole number');
  if (!['IFC4', 'IFC4X3', 'IFC4X3_RC2', 'IFC2X3'].includes(schema)) throw new Error('--schema must be IFC4, IFC4X3, IFC4X3_RC2 or IFC2X3');
  if (!['mm', 'm', 'inch', 'foot'].includes(unit)) throw new Error('--unit must be mm, m, inch or foot');
  if (!['standard', 'real-exports'].includes(patterns)) throw new Error('--patterns must be standard or real-exports');
  if (!['extruded', 'brep'].includes(bodies)) throw new Error('--bodies must be extruded or brep');
  if (!out) throw new Error('--out <file.ifc> is required');
  return {
    members,
    schema: schema === 'IFC4X3_RC2' ? 'IFC4X3' : (schema as FrameSchema),
    headerSchema: schema === 'IFC4X3_RC2' ? 'IFC4X3_RC2' : undefined,
    patterns: patterns as FramePatterns,
    bodies: bodies as FrameBodies,
    unit: unit as FrameUnit,
    defects: argv.includes('--defects'),
    siteOrigin_mm: argv.includes('--far') ? FAR_SITE_ORIGIN_MM : undefined,
    analysis: argv.includes('--analysis'),
    out,
  };
}

if (require.main === module) {
  try {
    const options = parseArguments(process.argv.slice(2));
    const layout = options.analysis ? writeFrameWithAnalysis(options.out, options) : writeFrameFile(options.out, options);
    console.log(`${options.out}: ${layout.slots.length} members, ${layout.bays}×${layout.bays} bays, ${layout.storeys} storeys, ${options.schema}, ${options.unit}`);
  } catch (error) {
    console.error(error instanceof Error ? error.message : String(error));
    process.exit(2);
  }
}
