import {
  fromMillimetres,
  fromMillimetresPower,
  fromMPa,
  fromNewtons,
  MPA_PER_KSI,
  N_PER_KIP,
  parseForceUnit,
  parseLengthUnit,
  parseStressUnit,
  toMillimetres,
  toMillimetresPower,
  toMPa,
  toNewtons,
  UnitError,
} from './units';
import { expectClose } from './expect-close';

describe('unit constants', () => {
  it('uses the exact definitions', () => {
    // International inch and foot, 1959 agreement: exact by definition.
    expect(toMillimetres(1, 'in')).toBe(25.4);
    expect(toMillimetres(1, 'ft')).toBe(304.8);
    // NIST SP 811 (2008) Appendix B.8/B.9: 1 lbf = 4.448 221 615 260 5 N exactly (0.453 592 37 kg × 9.806 65 m/s²).
    expect(toNewtons(1, 'lbf')).toBe(4.4482216152605);
    expectClose(0.45359237 * 9.80665, 4.4482216152605, 1e-15, 'lbf from its definition');
  });

  it('derives stress factors from force and length, matching the published conversion factors', () => {
    // NIST SP 811 Appendix B.9: 1 ksi = 6.894 757 E+06 Pa, 1 psi = 6.894 757 E+03 Pa (7 significant figures shown).
    expectClose(MPA_PER_KSI, 6.894757, 1e-7, 'MPa per ksi');
    expectClose(toMPa(1, 'psi'), 6.894757e-3, 1e-7, 'MPa per psi');
    // NIST SP 811: 1 kip = 4.448 222 E+03 N.
    expectClose(N_PER_KIP, 4448.222, 1e-7, 'N per kip');
  });
});

describe('conversions', () => {
  it('round-trips every unit', () => {
    for (const unit of ['N', 'kN', 'kip', 'lbf'] as const) expectClose(fromNewtons(toNewtons(123.456, unit), unit), 123.456, 1e-14, unit);
    for (const unit of ['mm', 'm', 'in', 'ft'] as const) expectClose(fromMillimetres(toMillimetres(7.5, unit), unit), 7.5, 1e-14, unit);
    for (const unit of ['MPa', 'ksi', 'psi'] as const) expectClose(fromMPa(toMPa(50, unit), unit), 50, 1e-14, unit);
  });

  it('converts areas and second moments with the power of the length factor', () => {
    expect(toMillimetresPower(1, 'in', 2)).toBeCloseTo(645.16, 10);
    expectClose(fromMillimetresPower(toMillimetresPower(1550, 'in', 4), 'in', 4), 1550, 1e-14, 'in⁴ round trip');
    expect(toMillimetresPower(1, 'm', 4)).toBe(1e12);
  });

  it('gives kN for kip forces the way tables quote them (306 kips ≈ 1361 kN)', () => {
    expectClose(fromNewtons(toNewtons(306, 'kip'), 'kN'), 1361.16, 1e-5, '306 kip in kN');
  });
});

describe('unknown units', () => {
  it('throws an error listing the allowed units', () => {
    expect(() => parseForceUnit('tonf')).toThrow("Unknown force unit 'tonf'; allowed: N, kN, kip, lbf");
    expect(() => parseLengthUnit('yd')).toThrow("Unknown length unit 'yd'; allowed: mm, m, in, ft");
    expect(() => parseStressUnit('bar')).toThrow("Unknown stress unit 'bar'; allowed: MPa, ksi, psi");
    expect(() => toNewtons(1, 'KN' as never)).toThrow(UnitError);
  });

  it('names the field of the unit in the error', () => {
    try {
      parseLengthUnit('cm');
      throw new Error('no error');
    } catch (error) {
      expect(error).toBeInstanceOf(UnitError);
      expect((error as UnitError).field).toBe('lengthUnit');
    }
  });

  it('does not accept inherited object keys as units', () => {
    expect(() => parseForceUnit('toString')).toThrow(UnitError);
  });
});
