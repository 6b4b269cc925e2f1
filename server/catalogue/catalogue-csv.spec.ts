import { EngineInputError } from '../engine/input-error';
import { findSection } from './catalogue';
import { CatalogueCsvError, MAX_CATALOGUE_ROWS, parseCatalogueCsv } from './catalogue-csv';

const HEADER = 'name,series,depth_mm,width_mm,web_mm,flange_mm,root_radius_mm';

function problemsOf(text: string) {
  try {
    parseCatalogueCsv(text);
  } catch (error) {
    expect(error).toBeInstanceOf(CatalogueCsvError);
    expect(error).toBeInstanceOf(EngineInputError);
    return (error as CatalogueCsvError).problems;
  }
  throw new Error('expected a CatalogueCsvError');
}

describe('parseCatalogueCsv', () => {
  it('reads a project catalogue of invented sections, quoted names and a BOM included', () => {
    const sections = parseCatalogueCsv(`\uFEFF${HEADER}\r\n"PL 600x10, S355 flanges",WB,600,250,10,20,0\r\nRB 310,RB,310,165,6.5,11,12\r\n\r\n`);
    expect(sections).toHaveLength(2);
    expect(sections[0]).toEqual({ name: 'PL 600x10, S355 flanges', series: 'WB', depth_mm: 600, width_mm: 250, webThickness_mm: 10, flangeThickness_mm: 20, rootRadius_mm: 0, sourceId: 'project' });
    expect(findSection('rb310', sections)?.depth_mm).toBe(310);
  });

  it('accepts the columns in any order', () => {
    const [s] = parseCatalogueCsv('series,name,root_radius_mm,flange_mm,web_mm,width_mm,depth_mm\nX,X 1,10,12,8,200,400\n');
    expect(s).toMatchObject({ name: 'X 1', depth_mm: 400, width_mm: 200, webThickness_mm: 8, flangeThickness_mm: 12, rootRadius_mm: 10 });
  });

  it('lists every bad row with its line number and column, and returns nothing', () => {
    const problems = problemsOf(
      [HEADER, 'A 1,A,300,150,7,10,15', 'A 2,A,abc,150,7,10,15', 'A 3,A,300,150,160,10,15', 'a1,A,300,150,7,10,15', ',A,300,150,7,10,15', 'A 5,A,300,150,7,10'].join('\n'),
    );
    expect(problems).toEqual([
      { line: 3, column: 'depth_mm', message: "must be a number of millimetres, got 'abc'" },
      { line: 4, column: 'web_mm', message: expect.stringContaining('must be smaller than topFlange.width_mm') },
      { line: 5, column: 'name', message: "'a1' is already defined on line 2" },
      { line: 6, column: 'name', message: 'must not be empty' },
      { line: 7, column: null, message: 'expected 7 values, got 6' },
    ]);
  });

  it('maps geometry errors to the CSV column', () => {
    expect(problemsOf(`${HEADER}\nT,T,100,150,7,60,5`)[0]).toMatchObject({ line: 2, column: 'flange_mm' });
    expect(problemsOf(`${HEADER}\nT,T,300,150,7,10,-1`)[0]).toMatchObject({ line: 2, column: 'root_radius_mm' });
  });

  it('rejects a wrong header, saying what is missing and what is unknown', () => {
    const [p] = problemsOf('name,series,depth,width_mm,web_mm,flange_mm,root_radius_mm\nA,A,1,1,1,1,1');
    expect(p.line).toBe(1);
    expect(p.message).toContain('missing depth_mm');
    expect(p.message).toContain('unknown depth');
  });

  it.each([
    ['an empty file', '', 'the file is empty'],
    ['a header only', HEADER, 'the file has a header but no sections'],
    ['broken quoting', `${HEADER}\n"A,A,1,1,1,1,1`, 'not readable as CSV'],
  ])('rejects %s', (_name, text, message) => {
    expect(problemsOf(text)[0].message).toContain(message);
  });

  it('refuses files beyond the row limit', () => {
    const rows = Array.from({ length: MAX_CATALOGUE_ROWS + 1 }, (_, i) => `S ${i},S,300,150,7,10,15`);
    expect(problemsOf([HEADER, ...rows].join('\n'))[0].message).toContain(`at most ${MAX_CATALOGUE_ROWS} sections`);
  });

  it('summarises the first problems in its message', () => {
    expect(() => parseCatalogueCsv(`${HEADER}\nA,A,x,1,1,1,1`)).toThrow(/1 problem: line 2 \(depth_mm\)/);
  });
});
