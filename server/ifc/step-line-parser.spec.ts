/**
 * The numbers-only reading of an instance against the general one and against ECMAScript's own decimal conversion
 * (Number() of the text, a general-purpose reference): same values, same references, same list structure. Instances
 * follow ISO 10303-21 (lists in parentheses, '$' and '*', enumerations in dots, strings with '' inside, comments).
 */
import { FLAT_ENUM, FLAT_INTEGER, FLAT_LIST, FLAT_NULL, FLAT_REAL, FLAT_REF, FLAT_STRING, FLAT_TYPED, FlatLine, NeedMoreBytes, parseFlatLine, parseLine, type TypeCodeOf } from './step-line-parser';
import type { StepValue } from './step-lines';

const bytesOf = (text: string): Uint8Array => new TextEncoder().encode(text);
/** Type codes for the test: the name's length is enough to tell the few names apart. */
const typeCode: TypeCodeOf = (_, start, end) => end - start;

function flat(text: string): FlatLine {
  const into = new FlatLine();
  parseFlatLine(bytesOf(text), 0, typeCode, into);
  return into;
}

/** The general reading turned into the flat layout, for comparison. */
function flattened(values: StepValue[], kinds: number[] = [], numbers: number[] = []): { kinds: number[]; numbers: number[] } {
  for (const value of values) {
    if (value === null) {
      kinds.push(FLAT_NULL);
      numbers.push(NaN);
    } else if (Array.isArray(value)) {
      const entry = kinds.push(FLAT_LIST) - 1;
      numbers.push(NaN);
      flattened(value, kinds, numbers);
      numbers[entry] = kinds.length;
    } else if (value.type === 4 || value.type === 10) {
      kinds.push(value.type === 4 ? FLAT_REAL : FLAT_INTEGER);
      numbers.push(Number(value.value));
    } else if (value.type === 5) {
      kinds.push(FLAT_REF);
      numbers.push(value.value as number);
    } else if (value.type === 3) {
      kinds.push(FLAT_ENUM);
      numbers.push(value.value === true ? 1 : value.value === false ? 0 : NaN);
    } else if (value.type === 1) {
      kinds.push(FLAT_STRING);
      numbers.push(NaN);
    } else {
      throw new Error(`not compared: ${JSON.stringify(value)}`);
    }
  }
  return { kinds, numbers };
}

describe('parseFlatLine', () => {
  it.each([
    '#12= IFCCARTESIANPOINT((0.,7500.,-12.5));',
    '#5=IFCPOLYLOOP((#77,#78,#102,#101));',
    '#7 = IFCFACEOUTERBOUND( #6 , .T. ) ;',
    "#8= IFCBEAM('2O2Fr$t4X7Zf8NOew3FLOH',#5,'B ''12''',$,'HE 300 B',#74,#204,*,.BEAM.);",
    '#9= IFCCARTESIANPOINTLIST3D(((0.,0.,0.),(1.5E3,-2.25E-2,1.)),$);',
    '#10= IFCX(/* a comment */ (), ((), (1, 2)), .F., .NOTDEFINED.);',
  ])('reads %s as the general reading does', (text) => {
    const line = flat(text);
    const general = parseLine(bytesOf(text), 0, typeCode);
    expect(line.type).toBe(general.type);
    const expected = flattened(general.args);
    expect({ kinds: [...line.kinds.subarray(0, line.count)], numbers: [...line.values.subarray(0, line.count)] }).toEqual(expected);
  });

  it('gives every number exactly as Number() of its text, the plain ones without building the text', () => {
    const literals = ['0.', '-0.', '+3.', '0.1', '-12.5', '1.E-5', '6.02E23', '123456789.123456789', '0.30000000000000004', '9007199254740993.', '1.7976931348623157E308', '1E400', '42', '-7'];
    const line = flat(`#1= IFCX((${literals.join(',')}));`);
    expect(line.count).toBe(literals.length + 1);
    literals.forEach((literal, i) => expect([literal, line.values[i + 1]]).toEqual([literal, Number(literal)]));
    expect(Object.is(line.values[2], -0)).toBe(true);
  });

  it('finds attributes past nested lists and typed values, and the value after each', () => {
    const line = flat('#1= IFCX(((1.,2.),(3.,4.)),IFCPARAMETERVALUE(0.5),#3,$);');
    expect([0, 1, 2, 3].map((k) => line.attribute(k))).toEqual([0, 7, 9, 10]);
    expect(line.kinds[7]).toBe(FLAT_TYPED);
    expect(line.attribute(4)).toBe(-1);
  });

  it('grows past its first arrays for a long point list', () => {
    const points = Array.from({ length: 1000 }, (_, i) => `(${i}.,${-i}.,0.5)`);
    const line = flat(`#1= IFCCARTESIANPOINTLIST3D((${points.join(',')}));`);
    expect(line.count).toBe(1 + 1000 * 4);
    expect([line.values[line.count - 3], line.values[line.count - 2]]).toEqual([999, -999]);
  });

  it('asks for more bytes when the instance is cut short, and refuses text that is not an instance', () => {
    for (const cut of ['#1= IFCX((1.,2.', '#1= IFCX(#12', "#1= IFCX('it''s", '#1= IFCX(1.)']) {
      expect(() => flat(cut)).toThrow(NeedMoreBytes);
    }
    for (const bad of ['#1= IFCX(1.;', '1= IFCX();', '#1 IFCX();', '#1= IFCX() x']) {
      expect(() => flat(bad)).toThrow(SyntaxError);
    }
  });
});
