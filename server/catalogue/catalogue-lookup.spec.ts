import { BUILT_IN_ENTRIES, findCatalogueEntry } from './catalogue-lookup';
import { CATALOGUE_SOURCES } from './catalogue';
import type { CatalogueSection } from './catalogue-section';

describe('findCatalogueEntry', () => {
  it.each([
    ['Beam:IPE270:341211', 'IPE 270', 'I'],
    ['IPE 270', 'IPE 270', 'I'],
    ['IPE270', 'IPE 270', 'I'],
    ['HEA360-S355', 'HEA 360', 'I'],
    ['HE 360 A', 'HEA 360', 'I'],
    ['HE360A', 'HEA 360', 'I'],
    ['W12X26', 'W12X26', 'I'],
    ['W12x26', 'W12X26', 'I'],
    ['W 12 x 26', 'W12X26', 'I'],
    ['310UC96.8', '310UC96.8', 'I'],
    ['UC 310x96.8', '310UC96.8', 'I'],
    ['Steel - 310UC96.8', '310UC96.8', 'I'],
    ['1200WB455', '1200WB455', 'I'],
    ['UB 305x165x40 S355', '305x165x40 UB', 'I'],
    ['UB305x165x40', '305x165x40 UB', 'I'],
    ['305x165x40UB', '305x165x40 UB', 'I'],
    ['300PFC40.1', '300PFC40.1', 'channel'],
    ['300PFC', '300PFC40.1', 'channel'],
    ['150PFC17.7', '150PFC17.7', 'channel'],
    ['100x100x6.0 SHS', '100x100x6.0 SHS', 'box'],
    ['SHS 100x100x6.0 EN 10219', 'SHS 100x100x6.0 EN 10219', 'box'],
    ['SHS 100x100x6.3', 'SHS 100x100x6.3 EN 10210', 'box'],
    ['CHS 168.3x5', 'CHS 168.3x5.0 EN 10210', 'tube'],
    ['100x50x4RHS', '100x50x4.0 RHS', 'box'],
    ['168.3x4.8CHS', '168.3x4.8 CHS', 'tube'],
    ['UPN 200', 'UPN 200', 'channel'],
    ['UPN200', 'UPN 200', 'channel'],
    ['UPE 200', 'UPE 200', 'channel'],
    ['IPN 200', 'IPN 200', 'I'],
    ['Beam:IPN200:77', 'IPN 200', 'I'],
    ['HD 320x300', 'HD 320x300', 'I'],
    ['HD320X300', 'HD 320x300', 'I'],
    ['PFC 300x90x41', '300x90x41 PFC', 'channel'],
    ['300x90x41PFC', '300x90x41 PFC', 'channel'],
    ['S12x50', 'S12X50', 'I'],
    ['S 12 x 50', 'S12X50', 'I'],
    ['M5X18.9', 'M5X18.9', 'I'],
    ['C15x33.9', 'C15X33.9', 'channel'],
  ])('finds %s as %s (%s)', (text, name, family) => {
    const hit = findCatalogueEntry(text);
    expect(hit).toMatchObject({ entry: { name, family }, origin: 'catalogue' });
    expect(hit!.entry.dimensions.family).toBe(family);
  });

  it.each(['310UC97', '300PFC41', 'U200', 'IPE 301', 'IPE270A', 'PL-GIRDER-7', 'W12X27', '', '   '])('finds nothing for %s', (text) => {
    expect(findCatalogueEntry(text)).toBeNull();
  });

  it.each(['SHS 100x100x6', 'SHS 100x100x6.0', '100x6SHS', '100x100x5SHS', 'CHS 139.7x5'])('finds nothing for %s, which names sections of different standards', (text) => {
    // 100x100x6.0: AS/NZS 1163 corners 2.5t (15 mm) against EN 10219 2t (12 mm); 100x100x5.0 is also an EN 10210 size
    // with 1.5t corners; 139.7x5.0 CHS is made cold-formed (AS/NZS 1163) and hot-finished (EN 10210). Guessing would
    // pick a section whose area or making differs. Written series first, or without the one-decimal wall, the name is
    // no single region's form.
    expect(findCatalogueEntry(text)).toBeNull();
  });

  it.each([
    // The AS/NZS makers' form: size first, family last, wall in one decimal (common practice, no source).
    ['100x6.0SHS', '100x100x6.0 SHS', 'box'],
    ['Steel - 100x6.0SHS', '100x100x6.0 SHS', 'box'],
    ['100x100x6.0SHS', '100x100x6.0 SHS', 'box'],
    ['100x5.0SHS', '100x100x5.0 SHS', 'box'],
    ['100x50x4.0RHS', '100x50x4.0 RHS', 'box'],
    ['168.3x7.1CHS', '168.3x7.1 CHS', 'tube'],
    ['139.7x5.0CHS', '139.7x5.0 CHS', 'tube'],
  ])('finds %s, written the AS/NZS way, in the AS/NZS table (%s) although EN tables list the size too', (text, name, family) => {
    expect(findCatalogueEntry(text)).toMatchObject({ entry: { name, family, sourceId: 'asnzs-1163' }, origin: 'catalogue' });
  });

  it('lets the written form choose only among the tables that name the size', () => {
    // SHS 100x100x6.3 is listed by EN 10210 only: written the AS/NZS way it still names that one section (the form
    // only chooses among tables that list the size), and a size no table lists finds nothing, never a neighbour.
    expect(findCatalogueEntry('100x6.3SHS')).toMatchObject({ entry: { name: 'SHS 100x100x6.3 EN 10210' } });
    expect(findCatalogueEntry('100x6.1SHS')).toBeNull();
  });

  it('lets a project catalogue entry answer an AS/NZS-form name before any built-in table', () => {
    const project: CatalogueSection[] = [
      { name: '100x100x6.0 SHS', series: 'BOX', depth_mm: 100, width_mm: 100, webThickness_mm: 6, flangeThickness_mm: 6, rootRadius_mm: 0, sourceId: 'project' },
    ];
    expect(findCatalogueEntry('100x6.0SHS', project)).toMatchObject({ origin: 'project-catalogue' });
  });

  it('names the part of the text that was read', () => {
    expect(findCatalogueEntry('Beam:IPE270:341211')!.designation).toBe('IPE270');
  });

  it('says when the section came from the project catalogue, which wins over the built-in tables', () => {
    const project: CatalogueSection[] = [
      { name: 'IPE 270', series: 'IPE', depth_mm: 271, width_mm: 135, webThickness_mm: 6.6, flangeThickness_mm: 10.2, rootRadius_mm: 15, sourceId: 'project' },
      { name: 'PL-GIRDER-7', series: 'GIRDER', depth_mm: 900, width_mm: 300, webThickness_mm: 8, flangeThickness_mm: 20, rootRadius_mm: 0, sourceId: 'project' },
    ];
    expect(findCatalogueEntry('Beam:IPE270:341211', project)).toMatchObject({ origin: 'project-catalogue', entry: { dimensions: { depth_mm: 271 } } });
    expect(findCatalogueEntry('pl girder 7', project)).toMatchObject({ origin: 'project-catalogue', entry: { name: 'PL-GIRDER-7' } });
    expect(findCatalogueEntry('HEA360', project)).toMatchObject({ origin: 'catalogue', entry: { name: 'HEA 360' } });
    expect(findCatalogueEntry('PL-GIRDER-7')).toBeNull();
  });

  it('answers the same text the same way, from its cache', () => {
    expect(findCatalogueEntry('Beam:IPE270:9')).toBe(findCatalogueEntry('Beam:IPE270:9'));
  });

  it('names a known source and a family of the shared vocabulary for every built-in entry', () => {
    for (const entry of BUILT_IN_ENTRIES) {
      expect(CATALOGUE_SOURCES[entry.sourceId]).toBeDefined();
      expect(entry.dimensions.family).toBe(entry.family);
    }
  });

  it('finds every built-in entry by its own name, and only itself', () => {
    for (const entry of BUILT_IN_ENTRIES) expect(findCatalogueEntry(entry.name)?.entry).toBe(entry);
  });
});
