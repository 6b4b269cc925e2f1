/**
 * Adds an invented structural analysis model to a generated frame (IFC4 or IFC4X3, mm or m): one
 * IfcStructuralAnalysisModel, one IfcStructuralCurveMember per beam and column (braces have none), two load
 * combinations, each with its IfcStructuralResultGroup holding one IfcStructuralCurveReaction per member: internal
 * forces at three stations (start, middle, end) as an IfcStructuralLoadConfiguration of IfcStructuralLoadSingleForce
 * in the member's local axes. Most analysis members are assigned to their beam or column (IfcRelAssignsToProduct); every
 * seventh is not, so only its coordinates link it. The same forces come back as a CSV in the results import's default
 * format (README, Command line), so a test can show that both sources read the same.
 *
 * The forces are invented (a uniformly loaded span for beams, a compressed column with end moments), not an analysis.
 */
import type { FrameLayout, MemberSlot, Vec3 } from './frame-layout';
import { globalIdFor } from './global-id';
import { enumValue, list, NULL, real, reals, type StepValue, StepWriter, text, TRUE, DERIVED } from './step-writer';

export type AnalysisDefect = 'no-results' | 'empty-result-group' | 'station-beyond-end';

export interface AnalysisModelOptions {
  schema: 'IFC4' | 'IFC4X3';
  /** The frame's length unit: mm models state forces in N and N·mm, m models in kN and kN·m. */
  unit: 'mm' | 'm';
  /** The frame's site origin (its members are placed under the site). */
  siteOrigin_mm?: Vec3;
  /** A broken export, for the reader's bad-input tests. */
  defect?: AnalysisDefect;
}

export interface InventedForce {
  /** The physical member's GlobalId, and how the analysis member is linked to it. */
  globalId: string;
  link: 'assignment' | 'coordinates';
  combination: string;
  station_mm: number;
  Vz_N: number;
  Vy_N: number;
  My_Nmm: number;
  Mz_Nmm: number;
  N_N: number;
}

export interface AnalysisModel {
  ifc: string;
  csv: string;
  forces: InventedForce[];
}

/** Load combinations of the scenario (invented factors on invented loads). */
export const ANALYSIS_COMBINATIONS = [
  { name: 'ULS-A dead + imposed', loadGroup: 'Dead and imposed', factor: 1 },
  { name: 'ULS-B dead + wind', loadGroup: 'Dead and wind', factor: -0.55 },
] as const;

const COORDINATES_ONLY_EVERY = 7;
/** GlobalId indices of the analysis model start here, far past the frame's own. */
const GUID_BASE = 1_000_000;
const MM_PER_UNIT = { mm: 1, m: 1000 } as const;
/** Forces written per unit: N in mm models, kN in m models; moments N·mm or kN·m. */
const N_PER_FORCE_UNIT = { mm: 1, m: 1000 } as const;
const NMM_PER_MOMENT_UNIT = { mm: 1, m: 1e6 } as const;

/** The frame's own entities this model refers to, found in its text (the frame writer keeps its ids to itself). */
interface FrameEntities {
  lastId: number;
  context: number;
  unitAssignment: number;
  /** Beams, columns and members in the order the layout's slots were written. */
  elements: { id: number; globalId: string }[];
}

function frameEntities(frameIfc: string): FrameEntities {
  const one = (pattern: RegExp, what: string): number => {
    const match = pattern.exec(frameIfc);
    if (!match) throw new Error(`the frame has no ${what}`);
    return Number(match[1]);
  };
  const elements = [...frameIfc.matchAll(/^#(\d+)= IFC(?:BEAM|BEAMSTANDARDCASE|COLUMN|MEMBER)\('([^']+)'/gm)].map((m) => ({ id: Number(m[1]), globalId: m[2] }));
  const ids = [...frameIfc.matchAll(/^#(\d+)=/gm)];
  return {
    lastId: Number(ids[ids.length - 1][1]),
    context: one(/^#(\d+)= IFCGEOMETRICREPRESENTATIONCONTEXT\(/m, 'geometric representation context'),
    unitAssignment: one(/^#(\d+)= IFCUNITASSIGNMENT\(/m, 'unit assignment'),
    elements,
  };
}

/** Invented internal forces of a slot at a station, for a combination factor (N, N·mm). */
export function inventedForces(slot: MemberSlot, station_mm: number, length_mm: number, factor: number): Omit<InventedForce, 'globalId' | 'link' | 'combination' | 'station_mm'> {
  if (slot.role === 'column') {
    // A column under 300 + 20 kN per role index of compression, with a sway moment changing sign along it.
    const end = (1 - (2 * station_mm) / length_mm) * factor;
    return { N_N: -(300_000 + 20_000 * (slot.roleIndex % 5)) * Math.abs(factor), Vz_N: 6_000 * factor, Vy_N: -2_000 * factor, My_Nmm: 12e6 * end, Mz_Nmm: 3e6 * end };
  }
  // A simply supported span under w = 10 + 2 kN/m per role index: V = w (L/2 − x), M = w x (L − x) / 2.
  const w_N_per_mm = (10 + 2 * (slot.roleIndex % 5)) * factor;
  return {
    N_N: 1_500 * factor,
    Vz_N: w_N_per_mm * (length_mm / 2 - station_mm),
    Vy_N: 0.04 * w_N_per_mm * (length_mm / 2 - station_mm),
    My_Nmm: (w_N_per_mm * station_mm * (length_mm - station_mm)) / 2,
    Mz_Nmm: (0.04 * w_N_per_mm * station_mm * (length_mm - station_mm)) / 2,
  };
}

/** Lines written by a StepWriter numbered from 1, moved past the frame's last id; '@12' refers to frame entity #12. */
function shifted(lines: string, by: number): string {
  return lines.replace(/#(\d+)/g, (_, id: string) => `#${Number(id) + by}`).replace(/@(\d+)/g, '#$1');
}

const frameRef = (id: number): StepValue => `@${id}`;

const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const lengthOf = (v: Vec3): number => Math.hypot(v[0], v[1], v[2]);

/** The frame with the analysis model added before its end, and the same forces as CSV. */
export function addAnalysisModel(frameIfc: string, layout: FrameLayout, options: AnalysisModelOptions): AnalysisModel {
  const frame = frameEntities(frameIfc);
  if (frame.elements.length !== layout.slots.length) throw new Error(`the frame holds ${frame.elements.length} members, its layout ${layout.slots.length}`);
  const parts: string[] = [];
  const w = new StepWriter((t) => parts.push(t));
  let guidIndex = GUID_BASE;
  const guid = () => text(globalIdFor(guidIndex++));
  const perUnit = MM_PER_UNIT[options.unit];
  const len = (value_mm: number) => real(value_mm / perUnit);
  const origin = options.siteOrigin_mm ?? [0, 0, 0];

  const prefix = options.unit === 'm' ? enumValue('KILO') : NULL;
  const force = w.add('IFCSIUNIT', DERIVED, enumValue('FORCEUNIT'), prefix, enumValue('NEWTON'));
  const metre = w.add('IFCSIUNIT', DERIVED, enumValue('LENGTHUNIT'), options.unit === 'mm' ? enumValue('MILLI') : NULL, enumValue('METRE'));
  const torqueElements = list([w.add('IFCDERIVEDUNITELEMENT', force, '1'), w.add('IFCDERIVEDUNITELEMENT', metre, '1')]);
  const torque = w.add('IFCDERIVEDUNIT', torqueElements, enumValue('TORQUEUNIT'), NULL, ...(options.schema === 'IFC4X3' ? [NULL] : []));

  const placement = w.add('IFCLOCALPLACEMENT', NULL, w.add('IFCAXIS2PLACEMENT3D', w.add('IFCCARTESIANPOINT', list(origin.map(len))), NULL, NULL));
  const vertex = (p_mm: Vec3) => w.add('IFCVERTEXPOINT', w.add('IFCCARTESIANPOINT', list(p_mm.map(len))));
  const slots = layout.slots.flatMap((slot, i) => (slot.role === 'brace' ? [] : [{ slot, element: frame.elements[i] }]));
  const members = slots.map(({ slot, element }, k) => {
    const edge = w.add('IFCEDGE', vertex(slot.start_mm), vertex(slot.end_mm));
    const topology = w.add('IFCTOPOLOGYREPRESENTATION', frameRef(frame.context), text('Reference'), text('Edge'), list([edge]));
    const shape = w.add('IFCPRODUCTDEFINITIONSHAPE', NULL, NULL, list([topology]));
    // Local z up for beams (along the web); across a column, along global x.
    const axis = w.add('IFCDIRECTION', reals(slot.role === 'column' ? [1, 0, 0] : [0, 0, 1]));
    const name = text(`A-${slot.role === 'column' ? 'C' : 'B'}${k + 1}`);
    const member = w.add('IFCSTRUCTURALCURVEMEMBER', guid(), NULL, name, NULL, NULL, placement, shape, enumValue('RIGID_JOINED_MEMBER'), axis);
    const link: InventedForce['link'] = k % COORDINATES_ONLY_EVERY === COORDINATES_ONLY_EVERY - 1 ? 'coordinates' : 'assignment';
    if (link === 'assignment') w.add('IFCRELASSIGNSTOPRODUCT', guid(), NULL, NULL, NULL, list([member]), NULL, frameRef(element.id));
    return { slot, element, member, link, length_mm: lengthOf(sub(slot.end_mm, slot.start_mm)) };
  });

  const forces: InventedForce[] = [];
  const loadGroups: StepValue[] = [];
  const resultGroups: StepValue[] = [];
  for (const combination of ANALYSIS_COMBINATIONS) {
    const loadGroup = w.add('IFCSTRUCTURALLOADGROUP', guid(), NULL, text(combination.loadGroup), NULL, NULL, enumValue('LOAD_COMBINATION'), enumValue('NOTDEFINED'), enumValue('NOTDEFINED'), NULL, text('ultimate limit state'));
    loadGroups.push(loadGroup);
    if (options.defect === 'no-results') continue;
    const resultGroup = w.add('IFCSTRUCTURALRESULTGROUP', guid(), NULL, text(combination.name), NULL, NULL, enumValue('FIRST_ORDER_THEORY'), loadGroup, TRUE);
    resultGroups.push(resultGroup);
    if (options.defect === 'empty-result-group' && combination === ANALYSIS_COMBINATIONS[1]) continue;
    const reactions = members.map(({ slot, element, member, link, length_mm }, k) => {
      const beyond = options.defect === 'station-beyond-end' && k === 0 ? 50 : 0;
      const stations = [0, length_mm / 2, length_mm + beyond];
      const values = stations.map((station_mm) => {
        const f = inventedForces(slot, station_mm, length_mm, combination.factor);
        forces.push({ globalId: element.globalId, link, combination: combination.name, station_mm, ...f });
        const n = N_PER_FORCE_UNIT[options.unit];
        const nmm = NMM_PER_MOMENT_UNIT[options.unit];
        return w.add('IFCSTRUCTURALLOADSINGLEFORCE', NULL, real(f.N_N / n), real(f.Vy_N / n), real(f.Vz_N / n), real(0), real(f.My_Nmm / nmm), real(f.Mz_Nmm / nmm));
      });
      const configuration = w.add('IFCSTRUCTURALLOADCONFIGURATION', NULL, list(values), list(stations.map((s) => list([len(s)]))));
      const reaction = w.add('IFCSTRUCTURALCURVEREACTION', guid(), NULL, NULL, NULL, NULL, NULL, NULL, configuration, enumValue('LOCAL_COORDS'), enumValue('DISCRETE'));
      w.add('IFCRELCONNECTSSTRUCTURALACTIVITY', guid(), NULL, NULL, NULL, member, reaction);
      return reaction;
    });
    w.add('IFCRELASSIGNSTOGROUP', guid(), NULL, NULL, NULL, list(reactions), NULL, resultGroup);
  }
  const model = w.add(
    'IFCSTRUCTURALANALYSISMODEL', guid(), NULL, text('Warehouse frame analysis'), NULL, NULL, enumValue('LOADING_3D'), NULL,
    list(loadGroups), resultGroups.length > 0 ? list(resultGroups) : NULL, placement,
  );
  w.add('IFCRELASSIGNSTOGROUP', guid(), NULL, NULL, NULL, list(members.map((m) => m.member)), NULL, model);
  w.flush();

  const added = shifted(parts.join(''), frame.lastId);
  const units = `#${frame.lastId + Number(force.slice(1))},#${frame.lastId + Number(torque.slice(1))}`;
  const withUnits = frameIfc.replace(new RegExp(`^(#${frame.unitAssignment}= IFCUNITASSIGNMENT\\(\\()([^)]*)\\)`, 'm'), `$1$2,${units})`);
  const end = withUnits.lastIndexOf('ENDSEC;');
  return { ifc: withUnits.slice(0, end) + added + withUnits.slice(end), csv: forcesCsv(forces), forces };
}

/** kN and kN·m to at most 9 decimals: the CSV carries the IFC's numbers, not more digits than they hold. */
const kilo = (value: number, per: number): string => String(Number((value / per).toFixed(9)));

/** The results import's default format with a station column and units in the headers (README, Command line). */
export function forcesCsv(forces: readonly InventedForce[]): string {
  const header = 'member,combination,station [mm],shear [kN],Vy [kN],My [kNm],Mz [kNm],N [kN]';
  const rows = forces.map((f) =>
    [f.globalId, f.combination, String(Number(f.station_mm.toFixed(6))), kilo(f.Vz_N, 1e3), kilo(f.Vy_N, 1e3), kilo(f.My_Nmm, 1e6), kilo(f.Mz_Nmm, 1e6), kilo(f.N_N, 1e3)].join(','),
  );
  return [header, ...rows, ''].join('\n');
}
