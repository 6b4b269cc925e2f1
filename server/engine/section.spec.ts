import { type ISectionInput, SectionInputError, validateSection } from './section';
import { EngineInputError } from './input-error';

// An invented rolled section, only a carrier for one bad value at a time.
function section(overrides: Partial<ISectionInput> = {}): ISectionInput {
  const flange = { width_mm: 150, thickness_mm: 10, filletRadius_mm: 15 };
  return { depth_mm: 300, webThickness_mm: 7, topFlange: { ...flange }, bottomFlange: { ...flange }, fabrication: 'rolled', ...overrides };
}

function fieldOf(input: ISectionInput): string {
  try {
    validateSection(input);
  } catch (error) {
    expect(error).toBeInstanceOf(SectionInputError);
    expect(error).toBeInstanceOf(EngineInputError);
    expect((error as SectionInputError).message).toContain((error as SectionInputError).field);
    return (error as SectionInputError).field;
  }
  throw new Error('expected a SectionInputError');
}

describe('validateSection', () => {
  it('accepts a plain rolled section', () => {
    expect(() => validateSection(section())).not.toThrow();
  });

  it.each([
    ['zero depth', { depth_mm: 0 }, 'depth_mm'],
    ['negative depth', { depth_mm: -300 }, 'depth_mm'],
    ['NaN web', { webThickness_mm: Number.NaN }, 'webThickness_mm'],
    ['infinite web', { webThickness_mm: Number.POSITIVE_INFINITY }, 'webThickness_mm'],
    ['web given as text', { webThickness_mm: '7' as unknown as number }, 'webThickness_mm'],
    ['unknown fabrication', { fabrication: 'cast' as never }, 'fabrication'],
    ['missing flange', { topFlange: undefined as never }, 'topFlange'],
  ])('rejects %s', (_name, overrides, field) => {
    expect(fieldOf(section(overrides as Partial<ISectionInput>))).toBe(field);
  });

  it.each([
    ['zero flange width', { width_mm: 0 }, 'topFlange.width_mm'],
    ['negative flange thickness', { thickness_mm: -1 }, 'topFlange.thickness_mm'],
    ['NaN fillet', { filletRadius_mm: Number.NaN }, 'topFlange.filletRadius_mm'],
    ['negative edge radius', { edgeRadius_mm: -2 }, 'topFlange.edgeRadius_mm'],
    ['negative slope', { slope_rad: -0.1 }, 'topFlange.slope_rad'],
    ['slope of 50°', { slope_rad: (50 * Math.PI) / 180 }, 'topFlange.slope_rad'],
    ['fillet wider than the outstand', { filletRadius_mm: 80 }, 'topFlange.filletRadius_mm'],
    ['toe radius thicker than the flange', { edgeRadius_mm: 12 }, 'topFlange.edgeRadius_mm'],
  ])('rejects %s on the top flange', (_name, overrides, field) => {
    const s = section();
    expect(fieldOf({ ...s, topFlange: { ...s.topFlange, ...overrides } })).toBe(field);
  });

  it('rejects a web as wide as the flange, naming the web', () => {
    const s = section({ webThickness_mm: 150 });
    expect(fieldOf(s)).toBe('webThickness_mm');
    expect(() => validateSection(s)).toThrow(/must be smaller than topFlange.width_mm/);
  });

  it('rejects flanges deeper than half the section, naming the thicker flange', () => {
    const s = section({ depth_mm: 100 });
    expect(fieldOf({ ...s, bottomFlange: { ...s.bottomFlange, thickness_mm: 60 } })).toBe('bottomFlange.thickness_mm');
  });

  it('rejects root fillets that meet on the web', () => {
    const s = section({ depth_mm: 48 });
    expect(fieldOf(s)).toBe('topFlange.filletRadius_mm');
  });

  it('rejects a taper so steep that the flange tip vanishes', () => {
    const s = section();
    expect(fieldOf({ ...s, bottomFlange: { ...s.bottomFlange, filletRadius_mm: 0, slope_rad: 0.7 } })).toBe('bottomFlange.slope_rad');
  });
});
