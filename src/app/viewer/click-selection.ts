/**
 * The selection after a click: a plain click selects the member under the pointer (or clears the selection on
 * empty space); with Shift, Ctrl or ⌘ held it adds the member, or takes it out when it was already selected.
 */
export function selectionAfterClick(current: readonly string[], picked: string | null, additive: boolean): string[] {
  if (!additive) return picked === null ? [] : [picked];
  if (picked === null) return [...current];
  if (current.includes(picked)) return current.filter((globalId) => globalId !== picked);
  return [...current, picked];
}
