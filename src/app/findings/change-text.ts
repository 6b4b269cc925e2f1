/** One history line in words: what changed, from what to what. */
import { FindingChange, FindingPriority, FindingStatus, PRIORITY_LABELS, STATUS_LABELS } from './finding';

function statusText(value: string | null): string {
  return value ? (STATUS_LABELS[value as FindingStatus] ?? value) : '—';
}

function priorityText(value: string | null): string {
  return value ? (PRIORITY_LABELS[value as FindingPriority] ?? value) : '—';
}

function quoted(value: string | null): string {
  return value ? `“${value}”` : 'nothing';
}

/** The sentence after the actor's name, e.g. "moved it from Open to Resolved". */
export function changeText(change: FindingChange): string {
  const { from, to } = change;
  switch (change.field) {
    case 'created':
      return 'raised the finding';
    case 'status':
      return `moved it from ${statusText(from)} to ${statusText(to)}`;
    case 'assignee':
      if (!to) return `unassigned ${from ?? 'it'}`;
      return from ? `reassigned it from ${from} to ${to}` : `assigned it to ${to}`;
    case 'priority':
      return `changed the priority from ${priorityText(from)} to ${priorityText(to)}`;
    case 'dueDate':
      return to ? `set the due date to ${to}` : 'removed the due date';
    case 'labels':
      return to ? `set the labels to ${to}` : 'removed the labels';
    case 'title':
      return `renamed it to ${quoted(to)}`;
    case 'description':
      return to ? 'changed the description' : 'removed the description';
    case 'justification':
      return to ? `accepted it because: ${to}` : 'withdrew the justification';
    case 'utilisation':
      return `recorded a utilisation of ${to ?? '—'} (was ${from ?? '—'})`;
    default:
      return `changed ${change.field} from ${from ?? '—'} to ${to ?? '—'}`;
  }
}

/** How the change came in, when not typed in Taulens. */
export function changeSourceText(change: FindingChange): string | null {
  if (change.source === 'bcf-import') return 'from a BCF import';
  if (change.source === 'system') return 'after a check run';
  return null;
}
