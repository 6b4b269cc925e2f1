import { INGEST_PHASES, overallFraction, phaseActivity } from './ingest-phases';

describe('overallFraction', () => {
  it('runs from 0 to 1 across the phases in order, never backwards', () => {
    const steps = INGEST_PHASES.flatMap((phase) => [0, 0.5, 1].map((f) => overallFraction(phase, f)));
    expect(steps[0]).toBe(0);
    expect(steps.at(-1)).toBeCloseTo(1, 12);
    expect(steps).toEqual([...steps].sort((a, b) => a - b));
  });

  it('keeps a phase inside its share when a reader reports out of range', () => {
    expect(overallFraction('members', 2)).toBe(overallFraction('members', 1));
    expect(overallFraction('members', -1)).toBe(overallFraction('members', 0));
  });
});

describe('phaseActivity', () => {
  it('says what the ingest was doing, for failure messages', () => {
    expect(phaseActivity('geometry')).toBe('building the 3D geometry');
    expect(phaseActivity(null)).toBe('starting to read the file');
  });
});
