import { type ViewerMember, isFailing } from './viewer-member';

/** The member filters of the 3D view; hide and isolate come on top of these. */
export interface MemberFilters {
  onlyFailing: boolean;
  /** Show only this storey's members; null for all storeys. */
  storey: string | null;
}

export const NO_MEMBER_FILTERS: MemberFilters = { onlyFailing: false, storey: null };

/** GlobalIds of the members the filters let through, or null when no filter is on (everything shows). */
export function filteredGlobalIds(
  members: readonly ViewerMember[],
  filters: MemberFilters,
): ReadonlySet<string> | null {
  if (!filters.onlyFailing && filters.storey === null) return null;
  const kept = new Set<string>();
  for (const member of members) {
    if (filters.onlyFailing && !isFailing(member)) continue;
    if (filters.storey !== null && member.storey !== filters.storey) continue;
    kept.add(member.globalId);
  }
  return kept;
}

/** Storey names present in the members, in natural order. */
export function storeysOf(members: readonly ViewerMember[]): string[] {
  const storeys = new Set(members.flatMap((member) => (member.storey === null ? [] : [member.storey])));
  return [...storeys].sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
}

/**
 * Members whose tag or GlobalId matches the query, best first: exact matches, then those that start with it, then
 * those that contain it. Tags compare without regard to case; GlobalIds are case-sensitive in IFC, so a GlobalId
 * only matches exactly or by its start.
 */
export function searchMembers(members: readonly ViewerMember[], query: string, limit: number): ViewerMember[] {
  const text = query.trim();
  if (text === '') return [];
  const lower = text.toLowerCase();
  const rank = (member: ViewerMember): number => {
    const tag = member.tag?.toLowerCase() ?? '';
    if (member.globalId === text || tag === lower) return 0;
    if (member.globalId.startsWith(text) || tag.startsWith(lower)) return 1;
    return tag.includes(lower) ? 2 : 3;
  };
  return members
    .map((member) => ({ member, rank: rank(member) }))
    .filter((entry) => entry.rank < 3)
    .sort((a, b) => a.rank - b.rank)
    .slice(0, limit)
    .map((entry) => entry.member);
}
