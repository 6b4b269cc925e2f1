/**
 * Geometry first, names second: a measured outline gives the section; a designation only cross-checks it, or stands in
 * for geometry that cannot be read when the named section's own outline has the measured area and inertia.
 * Dimensions: EN 10365 (IPE 270 h 270, b 135, tw 6.6, tf 10.2, r 15; HE 360 A h 350, b 300, tw 10, tf 17.5, r 27 —
 * from memory, as in server/catalogue/en-sections.ts).
 */
import type { IDimensions, SectionPolygon } from '../engine/section-family';
import { sectionOutline } from '../engine/section-outline';
import { governingOfSections, SectionResolver } from './member-section';
import { requireIProfile } from './model-read-result';

const flange = (width_mm: number, thickness_mm: number, filletRadius_mm: number) => ({ width_mm, thickness_mm, filletRadius_mm });
const IPE270: IDimensions = { family: 'I', depth_mm: 270, webThickness_mm: 6.6, topFlange: flange(135, 10.2, 15), bottomFlange: flange(135, 10.2, 15) };
const HEA360: IDimensions = { family: 'I', depth_mm: 350, webThickness_mm: 10, topFlange: flange(300, 17.5, 27), bottomFlange: flange(300, 17.5, 27) };
const outline = (d: IDimensions): SectionPolygon => sectionOutline(d, d.depth_mm * 5e-5);
const origin = { name: '', source: 'outline' as const, ifcType: 'IfcArbitraryClosedProfileDef', flags: [] };

describe('SectionResolver.fromOutline', () => {
  const resolver = new SectionResolver();

  it('reads the section from the outline and takes a matching name as confirmation (rolled)', () => {
    const outcome = resolver.fromOutline(outline(IPE270), origin, ['IPE 270']);
    expect(outcome).toMatchObject({ status: 'ok', flags: [], profile: { name: 'IPE 270', source: 'outline', fabrication: 'rolled' } });
    const profile = requireIProfile(outcome.status === 'ok' ? outcome.profile : null);
    expect(profile.depth_mm).toBeCloseTo(270, 6);
    expect(profile.webThickness_mm).toBeCloseTo(6.6, 6);
  });

  it('keeps the geometry and flags it when the name says another section', () => {
    const outcome = resolver.fromOutline(outline(IPE270), { ...origin, name: 'HEA360' }, ['HEA360']);
    expect(outcome).toMatchObject({ status: 'ok', flags: ['name-and-geometry-differ'], profile: { name: 'HEA360', source: 'outline' } });
    expect(requireIProfile(outcome.status === 'ok' ? outcome.profile : null).depth_mm).toBeCloseTo(270, 6);
  });

  it('flags an outline it cannot read, even with a catalogue name, when the named section does not fit it', () => {
    const notched: SectionPolygon = { outer: [[-150, -175], [150, -175], [150, 175], [40, 175], [40, 100], [-150, 100]], voids: [] };
    const outcome = resolver.fromOutline(notched, origin, ['HEA360']);
    expect(outcome.status).not.toBe('ok');
  });

  it('reads a channel outline with its dimensions and section properties, for checking', () => {
    const channel = sectionOutline({ family: 'channel', depth_mm: 200, width_mm: 80, webThickness_mm: 6, flangeThickness_mm: 11, rootRadius_mm: 13 }, 0.01);
    expect(resolver.fromOutline(channel, origin, ['UPE 200'])).toMatchObject({
      status: 'ok',
      section: { area_mm2: expect.any(Number) },
      profile: { family: 'channel', source: 'outline', depth_mm: expect.closeTo(200, 6), width_mm: expect.closeTo(80, 6) },
    });
  });
});

describe('governingOfSections', () => {
  const resolver = new SectionResolver();
  const read = (d: IDimensions) => resolver.fromDimensions(d, { name: 'T', source: 'ifc-profile', ifcType: 'IfcIShapeProfileDef', flags: [] });

  it('takes the smaller end of a taper whichever end it is, and keeps both', () => {
    for (const [start, end, at] of [[HEA360, IPE270, 1], [IPE270, HEA360, 0]] as const) {
      const outcome = governingOfSections([{ at: 0, outcome: read(start) }, { at: 1, outcome: read(end) }]);
      const profile = requireIProfile(outcome.status === 'ok' ? outcome.profile : null);
      expect(profile.depth_mm).toBe(270);
      expect(profile.governingAt).toBe(at);
      expect(profile.along?.map((s) => s.at)).toEqual([0, 1]);
      expect(outcome.flags).toContain('tapered');
    }
  });

  it('flags the member when an end is missing', () => {
    expect(governingOfSections([{ at: 0, outcome: read(IPE270) }, { at: 1, outcome: undefined }])).toMatchObject({ status: 'flagged' });
  });
});
