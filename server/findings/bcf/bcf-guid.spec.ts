import { isIfcGlobalId, isUuid, nameBasedUuid } from './bcf-guid';

describe('nameBasedUuid', () => {
  it('matches RFC 4122 version 5 for a published example', () => {
    // Python's uuid module documentation: uuid5(NAMESPACE_DNS, 'python.org') = 886313e1-3b8a-5372-9b90-0c9aee199e5d.
    expect(nameBasedUuid('6ba7b810-9dad-11d1-80b4-00c04fd430c8', 'python.org')).toBe('886313e1-3b8a-5372-9b90-0c9aee199e5d');
  });
});

describe('identifier forms', () => {
  it('accepts UUIDs in either case and rejects other strings', () => {
    expect(isUuid('ED3DF4A9-3705-4406-A2A8-FB1B66196ADC')).toBe(true);
    expect(isUuid('ed3df4a9-3705-4406-a2a8-fb1b66196adc')).toBe(true);
    expect(isUuid('ed3df4a9370544 06a2a8fb1b66196adc')).toBe(false);
  });

  it('accepts 22-character GlobalIds whose first character is 0–3', () => {
    // A GlobalId as written in IFC files (IfcGloballyUniqueId, IFC 4.3 documentation): 22 characters of 0-9A-Za-z_$.
    expect(isIfcGlobalId('2O2Fr$t4X7Zf8NOew3FLOH')).toBe(true);
    expect(isIfcGlobalId('4O2Fr$t4X7Zf8NOew3FLOH')).toBe(false);
    expect(isIfcGlobalId('2O2Fr$t4X7Zf8NOew3FLO')).toBe(false);
    expect(isIfcGlobalId('2O2Fr-t4X7Zf8NOew3FLOH')).toBe(false);
  });
});
