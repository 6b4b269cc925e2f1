/**
 * The invented scenario's grid: a multi-storey steel frame (a harbour warehouse) with square bays, columns at every
 * grid node, beams along both grid directions on every floor and one pair of diagonal braces per storey. The grid is
 * sized so that the wanted member count fits; the last storey is cut off at exactly that count.
 */
export type MemberRole = 'column' | 'beam-x' | 'beam-y' | 'brace';
export type Vec3 = [number, number, number];

export interface MemberSlot {
  role: MemberRole;
  /** Position among members of the same role (drives which profile path the member gets). */
  roleIndex: number;
  storey: number;
  start_mm: Vec3;
  end_mm: Vec3;
}

export interface FrameLayout {
  bays: number;
  storeys: number;
  spanX_mm: number;
  spanY_mm: number;
  storeyHeight_mm: number;
  slots: MemberSlot[];
}

const SPAN_X_MM = 6000;
const SPAN_Y_MM = 7500;
const STOREY_HEIGHT_MM = 4000;

function membersPerStorey(bays: number): number {
  return (bays + 1) ** 2 + 2 * bays * (bays + 1) + 2;
}

function storeySlots(bays: number, storey: number): Omit<MemberSlot, 'roleIndex'>[] {
  const z0 = storey * STOREY_HEIGHT_MM;
  const z1 = z0 + STOREY_HEIGHT_MM;
  const slots: Omit<MemberSlot, 'roleIndex'>[] = [];
  for (let i = 0; i <= bays; i++) {
    for (let j = 0; j <= bays; j++) {
      slots.push({ role: 'column', storey, start_mm: [i * SPAN_X_MM, j * SPAN_Y_MM, z0], end_mm: [i * SPAN_X_MM, j * SPAN_Y_MM, z1] });
    }
  }
  for (let j = 0; j <= bays; j++) {
    for (let i = 0; i < bays; i++) {
      slots.push({ role: 'beam-x', storey, start_mm: [i * SPAN_X_MM, j * SPAN_Y_MM, z1], end_mm: [(i + 1) * SPAN_X_MM, j * SPAN_Y_MM, z1] });
    }
  }
  for (let i = 0; i <= bays; i++) {
    for (let j = 0; j < bays; j++) {
      slots.push({ role: 'beam-y', storey, start_mm: [i * SPAN_X_MM, j * SPAN_Y_MM, z1], end_mm: [i * SPAN_X_MM, (j + 1) * SPAN_Y_MM, z1] });
    }
  }
  // Braces in the first bay of the façade y = 0, one each way.
  slots.push({ role: 'brace', storey, start_mm: [0, 0, z0], end_mm: [SPAN_X_MM, 0, z1] });
  slots.push({ role: 'brace', storey, start_mm: [SPAN_X_MM, 0, z0], end_mm: [0, 0, z1] });
  return slots;
}

export function frameLayout(memberCount: number): FrameLayout {
  if (!Number.isInteger(memberCount) || memberCount < 1) throw new Error(`member count must be a positive integer, got ${memberCount}`);
  const bays = Math.max(2, Math.round(Math.cbrt(memberCount / 1.5)));
  const storeys = Math.ceil(memberCount / membersPerStorey(bays));
  const counters: Record<MemberRole, number> = { column: 0, 'beam-x': 0, 'beam-y': 0, brace: 0 };
  const slots: MemberSlot[] = [];
  for (let storey = 0; storey < storeys && slots.length < memberCount; storey++) {
    for (const slot of storeySlots(bays, storey)) {
      if (slots.length === memberCount) break;
      slots.push({ ...slot, roleIndex: counters[slot.role]++ });
    }
  }
  return { bays, storeys, spanX_mm: SPAN_X_MM, spanY_mm: SPAN_Y_MM, storeyHeight_mm: STOREY_HEIGHT_MM, slots };
}
