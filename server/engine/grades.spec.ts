import { GradeError, gradeFromMaterialName, yieldStrength } from './grades';
import { expectClose } from './expect-close';
import { MPA_PER_KSI } from './units';

describe('yieldStrength, EN 10025-2 bands (the default rule)', () => {
  // S355 355 / 345 / 335 MPa up to 16 / 40 / 63 mm: EN 10025-2 Table 7, values as recorded in the team's reference
  // notes; the S235 and S275 bands are from memory of the same table.
  it.each([
    ['S355', 10, 355, 't ≤ 16 mm'],
    ['S355', 16, 355, 't ≤ 16 mm'],
    ['S355', 16.5, 345, '16 < t ≤ 40 mm'],
    ['S355', 40, 345, '16 < t ≤ 40 mm'],
    ['S355', 41, 335, '40 < t ≤ 63 mm'],
    ['S235', 20, 225, '16 < t ≤ 40 mm'],
    ['S275', 50, 255, '40 < t ≤ 63 mm'],
  ] as const)('%s at %s mm gives %s MPa', (grade, t, fy, band) => {
    expect(yieldStrength(grade, t)).toEqual({ fy_MPa: fy, rule: 'en10025-2', band });
  });

  it('covers the thermomechanical grades (EN 10025-4, from memory)', () => {
    expect(yieldStrength('S460', 12).fy_MPa).toBe(460);
    expect(yieldStrength('S460', 30).fy_MPa).toBe(440);
    expect(yieldStrength('S420', 30).fy_MPa).toBe(400);
  });
});

describe('yieldStrength, EN 1993-1-1 Table 3.1 (project option)', () => {
  it('uses one value up to 40 mm (from memory of Table 3.1)', () => {
    expect(yieldStrength('S355', 30, 'en1993-1-1-table-3.1')).toEqual({ fy_MPa: 355, rule: 'en1993-1-1-table-3.1', band: 't ≤ 40 mm' });
    expect(yieldStrength('S355', 60, 'en1993-1-1-table-3.1').fy_MPa).toBe(335);
  });

  it('differs from EN 10025-2 for plates between 16 and 40 mm by about 3 % (reference-notes trap)', () => {
    const product = yieldStrength('S355', 19).fy_MPa;
    const eurocode = yieldStrength('S355', 19, 'en1993-1-1-table-3.1').fy_MPa;
    expectClose(eurocode / product, 355 / 345, 1e-12, 'ratio');
  });

  it('refuses thicknesses beyond the table instead of guessing', () => {
    expect(() => yieldStrength('S355', 90, 'en1993-1-1-table-3.1')).toThrow(/EN 1993-1-1 Table 3.1 gives no yield strength for S355 thicker than 80 mm/);
  });
});

describe('yieldStrength, ASTM grades', () => {
  it('gives 50 ksi for A992 and A572 Gr 50 and 36 ksi for A36 at any shape thickness (AISC Manual Table 2-4)', () => {
    expectClose(yieldStrength('A992', 100).fy_MPa, 50 * MPA_PER_KSI, 1e-15, 'A992');
    expectClose(yieldStrength('A572-50', 10, 'en10025-2').fy_MPa, 344.73785, 1e-7, 'A572 Gr 50 in MPa (50 × 6.894757)');
    expect(yieldStrength('A36', 20)).toEqual({ fy_MPa: 36 * MPA_PER_KSI, rule: 'astm', band: 'Fy = 36 ksi, all shape thicknesses' });
  });
});

describe('yieldStrength, bad input', () => {
  it.each([
    [() => yieldStrength('S355', 0), 'thickness_mm'],
    [() => yieldStrength('S355', Number.NaN), 'thickness_mm'],
    [() => yieldStrength('S999' as never, 10), 'grade'],
    [() => yieldStrength('S355', 10, 'astm'), 'yieldRule'],
    [() => yieldStrength('S235', 300), 'thickness_mm'],
  ])('throws a GradeError naming the field (%#)', (call, field) => {
    expect(call).toThrow(GradeError);
    try {
      call();
    } catch (error) {
      expect((error as GradeError).field).toBe(field);
    }
  });
});

describe('gradeFromMaterialName', () => {
  it.each([
    ['S355JR', 'S355'],
    ['S355J2+N', 'S355'],
    ['Steel S355', 'S355'],
    ['steel_s235jr', 'S235'],
    ['S 275 J0', 'S275'],
    ['EN 10025-2 S460M', 'S460'],
    ['S420ML', 'S420'],
    ['Fe 510', 'S355'],
    ['ASTM A992', 'A992'],
    ['A992 Gr 50', 'A992'],
    ['ASTM A36', 'A36'],
    ['A572 Grade 50', 'A572-50'],
    ['A572-50', 'A572-50'],
    ['ASTM A572', 'A572-50'],
    ['Gr.50', 'A572-50'],
    ['Grade 50', 'A572-50'],
  ])('reads %s as %s', (name, grade) => {
    expect(gradeFromMaterialName(name)).toBe(grade);
  });

  it.each(['Concrete C30/37', 'S450', 'A572 Grade 65', 'A3600', 'Timber GL24h', 'S3555', ''])('returns null for %s', (name) => {
    expect(gradeFromMaterialName(name)).toBeNull();
  });
});
