import { expectClose } from '../../../../server/engine/expect-close';
import { sectionProperties } from '../../../../server/engine/section-properties';
import { shearStressProfile } from '../../../../server/engine/shear-stress';
import { iSection } from '../../../../server/engine/test-sections';
import { familySheet } from './family-sheet.testing';
import { familyFrame, familySectionFigure, familyStressInput, figureFrame, PLOT_WIDTH_MM, sectionFigure, stressFigure } from './sheet-figures';

// IPE 300: h 300, b 150, tw 7.1, tf 10.7, r 15 mm (EN 10365 dimensions).
const IPE_300 = iSection(300, 7.1, [150, 10.7, 15]);
// A fillet-less girder of three rectangles (invented: d 500, tw 10, b 200, tf 16 mm) under V = 200 kN. Expected values
// by the closed-form three-rectangle formulas (common practice, no source), worked by hand beside this test:
// I = (b·d³ − (b − tw)·hw³)/12 = 460.365×10⁶ mm⁴; Q(junction) = b·tf·(d − tf)/2 = 774 400 mm³;
// Qmax = Q(junction) + tw·hw²/8 = 1 048 180 mm³ → τmax = V·Qmax/(I·tw) = 45.54 MPa; web at the junction 33.64 MPa,
// flange at the junction 1.682 MPa; V/(hw·tw) = 42.74 MPa.
const GIRDER = iSection(500, 10, [200, 16, 0]);
const GIRDER_SHEAR_N = 200_000;

function numbers(viewBox: string): number[] {
  return viewBox.split(' ').map(Number);
}

function stressOf(input: typeof GIRDER, shear_N: number, elasticLimit_MPa?: number) {
  const props = sectionProperties(input);
  const profile = shearStressProfile(props, shear_N);
  const frame = figureFrame(props);
  const figure = stressFigure(
    {
      samples: profile.points.map((p) => ({ y_mm: p.y_mm, tau_MPa: p.tau_MPa })),
      tauMax_MPa: profile.tauMax_MPa,
      tauMaxAt_mm: profile.tauMaxAt_mm,
      junctions: [profile.topJunction, profile.bottomJunction],
      webAverage: { tau_MPa: profile.webAverageClear_MPa, from_mm: props.bottomJunctionFromBottom_mm, to_mm: props.topJunctionFromBottom_mm },
      elasticLimit_MPa,
    },
    frame,
  );
  return { props, profile, frame, figure };
}

describe('section figure', () => {
  const props = sectionProperties(IPE_300);
  const frame = figureFrame(props);
  const figure = sectionFigure(props, frame);

  it('picks the largest drawing-office scale at which the section fits its paper box', () => {
    // 150 × 300 mm in a 62 × 125 mm box: at 1:2 it would be 150 mm tall; at 1:2.5 it is 60 × 120 mm.
    expect(frame.scale).toBe(2.5);
    expect(figure.widthPaper_mm).toBeCloseTo(150 / 2.5 + 16 + 18, 6);
    expect(frame.heightPaper_mm).toBeCloseTo(300 / 2.5 + 24, 6);
  });

  it('draws the outline in section millimetres: closed, as wide as the flanges and as deep as the section', () => {
    expect(figure.outlinePath.startsWith('M')).toBe(true);
    expect(figure.outlinePath.endsWith('Z')).toBe(true);
    const points = figure.outlinePath
      .slice(1, -1)
      .split('L')
      .map((pair) => pair.split(',').map(Number));
    expect(Math.max(...points.map(([x]) => x))).toBeCloseTo(75, 6);
    expect(Math.min(...points.map(([x]) => x))).toBeCloseTo(-75, 6);
    expect(Math.min(...points.map(([, y]) => y))).toBeCloseTo(0, 6);
    expect(Math.max(...points.map(([, y]) => y))).toBeCloseTo(300, 6);
    // The web is 7.1 mm wide between the fillets (at mid-depth).
    const atMid = points.filter(([, y]) => Math.abs(y - 150) < 20).map(([x]) => Math.abs(x));
    expect(Math.min(...atMid)).toBeCloseTo(3.55, 6);
  });

  it('keeps both figures of the widest section that fits its box within an A4 page inside 12 mm margins', () => {
    // 300 mm wide is 60 mm at 1:5, nearly the whole 62 mm box.
    const wide = sectionProperties(iSection(500, 12, [300, 28, 27]));
    const wideFrame = figureFrame(wide);
    const plot = stressFigure({ samples: [], tauMax_MPa: 100, tauMaxAt_mm: 250, junctions: [], webAverage: { tau_MPa: 90, from_mm: 28, to_mm: 472 } }, wideFrame);
    expect(sectionFigure(wide, wideFrame).widthPaper_mm + plot.widthPaper_mm).toBeLessThanOrEqual(210 - 2 * 12);
  });

  it('dimensions d, b, tf, tw and r, with d spanning the whole depth to scale', () => {
    expect(figure.dimensions.map((dimension) => dimension.label)).toEqual(['d = 300', 'b = 150', 'tf = 10.7', 'tw = 7.1', 'r = 15']);
    const depth = figure.dimensions.find((dimension) => dimension.key === 'd')!;
    expect(Math.abs(depth.y1 - depth.y2)).toBeCloseTo(300, 6);
    expect(depth.vertical).toBe(true);
    const tw = figure.dimensions.find((dimension) => dimension.key === 'tw')!;
    expect(tw.x2 - tw.x1).toBeCloseTo(7.1, 6);
    // Text prints 2.6 mm high whatever the scale.
    expect(figure.textSize / frame.scale).toBeCloseTo(2.6, 6);
  });

  it('dimensions the bottom flange too when the flanges differ, and leaves out r for welded plates', () => {
    const mono = sectionFigure(sectionProperties(iSection(600, 10, [250, 15, 0], [350, 25, 0])));
    expect(mono.dimensions.map((dimension) => dimension.key)).toEqual(['d', 'b-top', 'tf', 'tw', 'b-bottom']);
    expect(mono.dimensions.find((dimension) => dimension.key === 'b-bottom')!.label).toBe('b = 350');
  });
});

describe('stress figure', () => {
  it('shares the section figure’s vertical frame, so both print at the same height and scale', () => {
    const { props, frame, figure } = stressOf(GIRDER, GIRDER_SHEAR_N);
    const section = sectionFigure(props, frame);
    const [, sectionTop, , sectionHeight] = numbers(section.viewBox);
    const [, plotTop, , plotHeight] = numbers(figure.viewBox);
    expect([plotTop, plotHeight]).toEqual([sectionTop, sectionHeight]);
    // 200 × 500 mm needs 1:5 in the 60 × 125 mm box (1:2.5 would be 200 mm tall).
    expect(frame.scale).toBe(5);
  });

  it('marks τmax at the neutral axis with the closed-form value', () => {
    const { profile, figure } = stressOf(GIRDER, GIRDER_SHEAR_N);
    expectClose(profile.tauMax_MPa, 45.537, 5e-4, 'τmax');
    expect(figure.peak.label).toBe('τmax = 45.54 MPa');
    // Mid-depth of a doubly symmetric section: svg y = 500 − 250.
    expect(figure.peak.y).toBeCloseTo(250, 6);
    // Axis 0–60 MPa (round ticks) over the plot's paper width at 1:5.
    expect(figure.ticks.map((tick) => tick.label)).toEqual(['0', '20', '40', '60']);
    expect(figure.peak.x).toBeCloseTo((profile.tauMax_MPa / 60) * PLOT_WIDTH_MM * 5, 3);
  });

  it('shows the jump at each web–flange junction: τmin in the web to b/t times less in the flange', () => {
    const { figure } = stressOf(GIRDER, GIRDER_SHEAR_N);
    expect(figure.jumps.map((jump) => jump.label)).toEqual(['33.64 → 1.682', '33.64 → 1.682']);
    expect(figure.jumps.map((jump) => jump.segment.y1).sort((a, b) => a - b)).toEqual([16, 484]);
    for (const { segment } of figure.jumps) {
      expect(segment.y1).toBe(segment.y2);
      expect(segment.x2).toBeGreaterThan(segment.x1);
    }
  });

  it('draws the web average V/(hw·tw) over the clear web as a separate mark', () => {
    const { figure } = stressOf(GIRDER, GIRDER_SHEAR_N);
    expect(figure.marks.map((mark) => mark.label)).toEqual(['V/(hw·tw) = 42.74']);
    expect(figure.marks[0].segment.y1).toBeCloseTo(16, 6);
    expect(figure.marks[0].segment.y2).toBeCloseTo(484, 6);
  });

  it('adds the limit of the elastic check over the whole depth when the standard has one, and widens the axis for it', () => {
    // S235 with γM0 = 1.00: 235/√3 = 135.7 MPa (EN 1993-1-1 (6.19)).
    const { figure } = stressOf(GIRDER, GIRDER_SHEAR_N, 235 / Math.sqrt(3));
    const limit = figure.marks.find((mark) => mark.key === 'elastic-limit')!;
    expect(limit.label).toBe('fy/(√3·γM0) = 135.7');
    expect([limit.segment.y1, limit.segment.y2]).toEqual([0, 500]);
    expect(figure.ticks.map((tick) => tick.label)).toEqual(['0', '50', '100', '150']);
  });

  it('closes the filled area against the τ = 0 axis', () => {
    const { figure } = stressOf(GIRDER, GIRDER_SHEAR_N);
    expect(figure.areaPath.startsWith('M0,500L')).toBe(true);
    expect(figure.areaPath.endsWith('L0,0Z')).toBe(true);
  });
});

describe('figures of other families', () => {
  // Invented sections; the sheet data comes from the server's own sheet builder, as the API sends it.
  const box = { family: 'box', depth_mm: 300, width_mm: 200, webThickness_mm: 10, flangeThickness_mm: 16 } as const;
  const tube = { family: 'tube', diameter_mm: 219.1, wallThickness_mm: 8 } as const;

  function subpaths(path: string): number[][][] {
    return path
      .split('M')
      .filter(Boolean)
      .map((loop) =>
        loop
          .replace('Z', '')
          .split('L')
          .map((pair) => pair.split(',').map(Number)),
      );
  }

  it('draws a box to scale with its void as a second loop, and dimensions it in EN notation', () => {
    const { familySection } = familySheet(box, 'en1993-1-1');
    const frame = familyFrame(familySection);
    const figure = familySectionFigure(familySection, 'en1993-1-1', frame);
    // 200 × 300 mm in the 62 × 125 mm box: 1:5 (1:2.5 would be 120 mm tall... plus margins, and 80 mm wide).
    expect(frame.scale).toBe(5);
    const [outer, hole] = subpaths(figure.outlinePath);
    expect(subpaths(figure.outlinePath)).toHaveLength(2);
    expect(Math.max(...outer.map(([x]) => x)) - Math.min(...outer.map(([x]) => x))).toBeCloseTo(200, 9);
    expect(Math.max(...outer.map(([, y]) => y)) - Math.min(...outer.map(([, y]) => y))).toBeCloseTo(300, 9);
    // The opening: 200 − 2·10 wide and 300 − 2·16 deep, centred.
    expect(Math.max(...hole.map(([x]) => x)) - Math.min(...hole.map(([x]) => x))).toBeCloseTo(180, 9);
    expect(Math.min(...hole.map(([, y]) => y))).toBeCloseTo(16, 9);
    expect(figure.dimensions.map((dimension) => dimension.label)).toEqual(['h = 300', 'b = 200', 'tw = 10', 'tf = 16']);
    const depth = figure.dimensions.find((dimension) => dimension.key === 'depth')!;
    expect(Math.abs(depth.y1 - depth.y2)).toBeCloseTo(300, 9);
    expect(figure.webAxis).not.toBeNull();
  });

  it('dimensions a box in AISC notation and a tube by its diameter and wall', () => {
    expect(familySectionFigure(familySheet(box, 'aisc360-22-lrfd').familySection, 'aisc360-22-lrfd').dimensions.map((dimension) => dimension.label)).toEqual([
      'H = 300',
      'B = 200',
      'tw = 10',
      'tf = 16',
    ]);
    const { familySection } = familySheet(tube, 'aisc360-22-lrfd');
    const figure = familySectionFigure(familySection, 'aisc360-22-lrfd');
    expect(figure.dimensions.map((dimension) => dimension.label)).toEqual(['D = 219.1', 't = 8']);
    const [outer, hole] = subpaths(figure.outlinePath);
    expect(Math.max(...outer.map(([x]) => x))).toBeCloseTo(219.1 / 2, 6);
    expect(Math.max(...hole.map(([x]) => x))).toBeCloseTo(219.1 / 2 - 8, 6);
  });

  it('plots τ of a box level with its section: peak at mid-depth, a jump at each flange face, V/(2·hw·tw) between them', () => {
    const { familySection, familyStress } = familySheet(box, 'en1993-1-1');
    const frame = familyFrame(familySection);
    const figure = stressFigure(familyStressInput(familySection, familyStress), frame);
    expect(figure.peak.y).toBeCloseTo(150, 6);
    // Square corners: the cut width jumps from 2·tw = 20 to b = 200 at the inside faces, so τ by 10 times.
    expect(figure.jumps.map((jump) => jump.segment.y1).sort((a, b) => a - b)).toEqual([16, 284]);
    for (const jump of familyStress.jumps) expect(Math.max(jump.below_MPa, jump.above_MPa) / Math.min(jump.below_MPa, jump.above_MPa)).toBeCloseTo(10, 9);
    expect(figure.marks[0].label.startsWith('V/(2·hw·tw) = ')).toBe(true);
    expect([figure.marks[0].segment.y1, figure.marks[0].segment.y2]).toEqual([16, 284]);
  });

  it('plots τ of a tube over its whole diameter with the peak at the centre', () => {
    const { familySection, familyStress } = familySheet(tube, 'en1993-1-1');
    const figure = stressFigure(familyStressInput(familySection, familyStress), familyFrame(familySection));
    // Mid-depth, within the chords' 0.01 mm of the circle.
    expect(figure.peak.y).toBeCloseTo(219.1 / 2, 1);
    expect(figure.jumps).toEqual([]);
    expect(figure.areaPath.endsWith('L0,0Z')).toBe(true);
  });
});
