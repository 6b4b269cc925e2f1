/** The findings list query: filters, sort and paging in SQL, shared by the list route and the exports. */
import type { EntityManager, SelectQueryBuilder } from 'typeorm';
import { FINDING_PRIORITIES, FINDING_STATUSES } from './finding-fields';
import type { FindingFilters, FindingSort } from './finding-requests';
import { Finding } from './finding.entity';

/** Workflow order for statuses, severity for priorities, rather than the alphabet. */
function rankOf(column: string, values: readonly string[]): string {
  return `CASE ${column} ${values.map((value, i) => `WHEN '${value}' THEN ${i}`).join(' ')} END`;
}

const SORT_EXPRESSIONS: Readonly<Record<FindingSort, string>> = {
  number: 'f.number',
  title: 'f.title',
  status: rankOf('f.status', FINDING_STATUSES),
  priority: rankOf('f.priority', FINDING_PRIORITIES),
  utilisation: 'f.utilisation',
  dueDate: 'f.dueDate',
  updatedAt: 'f.updatedAt',
  assignee: 'assignee.name',
};

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** "F-0012", "f12" and "12" all find finding number 12. */
function numberIn(text: string): number | null {
  const match = /^(?:f-?)?0*(\d{1,9})$/i.exec(text.trim());
  return match ? Number(match[1]) : null;
}

/** The project's findings matching the filters, with assignee and creator joined; `me` is the caller's id. */
export function filteredFindings(manager: EntityManager, projectId: string, filters: FindingFilters, me: string): SelectQueryBuilder<Finding> {
  const query = manager
    .createQueryBuilder(Finding, 'f')
    .leftJoinAndSelect('f.assignee', 'assignee')
    .leftJoinAndSelect('f.createdBy', 'createdBy')
    .where('f.projectId = :projectId', { projectId });
  if (filters.status?.length) query.andWhere('f.status IN (:...statuses)', { statuses: filters.status });
  if (filters.kind?.length) query.andWhere('f.kind IN (:...kinds)', { kinds: filters.kind });
  if (filters.priority?.length) query.andWhere('f.priority IN (:...priorities)', { priorities: filters.priority });
  if (filters.assignee === 'none') query.andWhere('f.assigneeId IS NULL');
  else if (filters.assignee) query.andWhere('f.assigneeId = :assigneeId', { assigneeId: filters.assignee === 'me' ? me : filters.assignee });
  if (filters.q) {
    const like = `%${escapeLike(filters.q)}%`;
    const number = numberIn(filters.q);
    query.andWhere(
      `(f.title LIKE :like ESCAPE '\\' OR f.memberTag LIKE :like ESCAPE '\\' OR f.description LIKE :like ESCAPE '\\'${number === null ? '' : ' OR f.number = :number'})`,
      { like, number },
    );
  }
  return query;
}

export function sortedPage(
  query: SelectQueryBuilder<Finding>,
  sort: FindingSort,
  dir: 'asc' | 'desc',
  page: number,
  pageSize: number,
): SelectQueryBuilder<Finding> {
  const order = dir === 'asc' ? 'ASC' : 'DESC';
  return query
    .orderBy(SORT_EXPRESSIONS[sort], order)
    .addOrderBy('f.number', order)
    .offset(page * pageSize)
    .limit(pageSize);
}
