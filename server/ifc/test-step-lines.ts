/** Opens a few hand-written STEP instances as a model for the reader's unit tests: test data only. */
import { openModel } from './open-model';
import { StepLines } from './step-lines';

export interface TestModel {
  lines: StepLines;
  close(): void;
}

/** A complete IFC file around `data` (instances '#1= …;' one per line), opened the way ingest opens uploads. */
export async function openStepLines(schema: 'IFC2X3' | 'IFC4' | 'IFC4X3', data: string): Promise<TestModel> {
  const text = [
    'ISO-10303-21;',
    'HEADER;',
    "FILE_DESCRIPTION(('ViewDefinition [ReferenceView]'),'2;1');",
    "FILE_NAME('unit-test.ifc','2026-12-05T09:00:00',('Taulens tests'),('Taulens'),'hand-written','hand-written','');",
    `FILE_SCHEMA(('${schema}'));`,
    'ENDSEC;',
    'DATA;',
    data.trim(),
    'ENDSEC;',
    'END-ISO-10303-21;',
    '',
  ].join('\n');
  const opened = await openModel(new TextEncoder().encode(text));
  return { lines: new StepLines(opened.api, opened.modelId, opened.text), close: () => opened.close() };
}
