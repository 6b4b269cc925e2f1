/**
 * The forces of `taulens check --forces analysis.ifc`: the internal forces of an IFC structural analysis model
 * (server/ifc/structural-results.ts), turned into the governing values per member and combination that a CSV or
 * XLSX import gives (server/results/governing-shear.ts), so the check runs on them the same way.
 *
 * The analysis members are linked to the checked model's members by assignment, else by coordinates against the axes
 * of the members already read; a linked member's rows carry the physical member's GlobalId, an unlinked one's its own
 * GlobalId and ends (so the matching can still try its geometry). A station whose Vz the file leaves unset gives no
 * row: a missing shear is not a zero shear, and a member left without forces is reported as not checked.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { MemberRecord } from '../ifc/model-read-result';
import { type PhysicalMemberAxis, readStructuralResults } from '../ifc/structural-results';
import { type GoverningTable, GoverningShearCollector } from '../results/governing-shear';
import type { ResultKeySummary } from '../results/result-key-index';
import type { ResultRow } from '../results/result-row';

export interface IfcForces {
  /** Force rows read (one per station of an analysis member and result group). */
  rowCount: number;
  /** Stations left out because the file gives no Vz there. */
  stationsWithoutShear: number;
  /** Distinct member keys in order of first appearance, with the analysis member's ends. */
  memberKeys: ResultKeySummary[];
  combinations: string[];
  /** How many analysis members are linked to a physical member, and by what. */
  links: { assignment: number; coordinates: number; none: number };
  governing: GoverningTable;
}

const STEP_MAGIC = 'ISO-10303-21';

/** An IFC file by its name (.ifc, .ifczip) or, whatever its name, by the STEP header it opens with. */
export function isIfcForcesFile(file: string): boolean {
  if (/\.ifc(zip)?$/i.test(path.extname(file))) return true;
  const fd = fs.openSync(file, 'r');
  try {
    const head = Buffer.alloc(64);
    const read = fs.readSync(fd, head, 0, head.length, 0);
    return head.subarray(0, read).toString('latin1').replace(/^\uFEFF?\s*/, '').startsWith(STEP_MAGIC);
  } finally {
    fs.closeSync(fd);
  }
}

/**
 * Reads the analysis model's forces (an .ifc file: an .ifczip is extracted by the caller). Throws StructuralResultsError
 * for a file whose forces cannot be read, IfcReadError for a file that is not IFC; nothing is returned half-read.
 */
export async function importIfcForces(ifcFile: string, members: readonly MemberRecord[]): Promise<IfcForces> {
  const physicalMembers: PhysicalMemberAxis[] = members.flatMap((m) => (m.axis ? [{ globalId: m.globalId, start_mm: m.axis.start_mm, end_mm: m.axis.end_mm }] : []));
  const results = await readStructuralResults(ifcFile, { physicalMembers });
  const collector = new GoverningShearCollector();
  const keys = new Map<string, ResultKeySummary>();
  const rows: ResultRow[] = [];
  let stationsWithoutShear = 0;
  results.rows.forEach((force, i) => {
    const row = i + 1;
    const key = keys.get(force.memberKey);
    if (key) key.rows++;
    else keys.set(force.memberKey, { memberKey: force.memberKey, rows: 1, firstRow: row, end1_mm: force.end1_mm, end2_mm: force.end2_mm });
    if (force.shear_N === undefined) {
      stationsWithoutShear++;
      return;
    }
    rows.push({
      row,
      memberKey: force.memberKey,
      combination: force.combination,
      station_mm: force.station_mm,
      shear_N: force.shear_N,
      minorShear_N: force.minorShear_N,
      majorMoment_Nmm: force.majorMoment_Nmm,
      minorMoment_Nmm: force.minorMoment_Nmm,
      end1_mm: force.end1_mm,
      end2_mm: force.end2_mm,
    });
  });
  collector.add(rows);
  const links = { assignment: 0, coordinates: 0, none: 0 };
  for (const member of results.members) links[member.link.by]++;
  return {
    rowCount: results.rows.length,
    stationsWithoutShear,
    memberKeys: [...keys.values()],
    combinations: results.groups.map((group) => group.combination).filter((name, i, all) => all.indexOf(name) === i),
    links,
    governing: collector.table(),
  };
}
