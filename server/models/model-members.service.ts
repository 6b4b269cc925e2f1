import type { DataSource, SelectQueryBuilder } from 'typeorm';
import { NotFoundError, ValidationError } from '../http/errors';
import { SECTION_FAMILIES, SECTION_FAMILY_LABELS, type SectionFamily } from '../engine/section-family';
import { type MemberRecord, PROFILE_SOURCES } from '../ifc/model-read-result';
import type { MemberListQuery } from './member-list-query';
import { MEMBER_ROW_COLUMNS, type MemberFacets, type MemberLabels, type MemberPage, type MemberRow } from './member-row';
import { ModelMember } from './model-member.entity';
import { ModelMemberRecord } from './model-member-record.entity';
import { loadMemberRecords, toRevisionView } from './model-queries';
import { ModelRevision } from './model-revision.entity';
import { type RevisionComparison, compareRevisions } from './revision-compare';
import { revisionNotFound, revisionNotReady } from './revision-errors';
import type { RevisionView } from './revision-view';

function uncheckedFamilyReason(family: SectionFamily | null): string {
  return family ? `Section family '${SECTION_FAMILY_LABELS[family]}': no web shear rule for it; listed with its dimensions.` : 'No reason recorded.';
}

export interface ComparisonView extends RevisionComparison {
  from: RevisionView;
  to: RevisionView;
}

const naturalOrder = new Intl.Collator('en', { numeric: true, sensitivity: 'base' }).compare;

/** `%`, `_` and the escape character itself match literally in a LIKE search. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function toRow(member: ModelMember): MemberRow {
  return Object.fromEntries(MEMBER_ROW_COLUMNS.map((column) => [column, member[column]])) as unknown as MemberRow;
}

/** The members of ready revisions: the sortable, filterable table, facets, one member's record, and comparisons. */
export class ModelMembersService {
  constructor(private readonly dataSource: DataSource) {}

  async list(projectId: string, revisionId: string, query: MemberListQuery): Promise<MemberPage> {
    await this.readyRevision(projectId, revisionId);
    const filtered = this.filtered(revisionId, query);
    const [total, members] = await Promise.all([
      filtered.getCount(),
      filtered
        .clone()
        .select(['m.revisionId', ...MEMBER_ROW_COLUMNS.map((column) => `m.${column}`)])
        // With a text search few rows match: `+` keeps SQLite from walking the whole sort index to find them.
        .orderBy(`${query.q === undefined ? '' : '+'}m.${query.sort}`, query.dir === 'asc' ? 'ASC' : 'DESC')
        // Ties (same profile, same storey…) keep file order, so pages never overlap.
        .addOrderBy('m.expressId', 'ASC')
        .offset(query.page * query.pageSize)
        .limit(query.pageSize)
        .getMany(),
    ]);
    return { total, members: members.map(toRow) };
  }

  async facets(projectId: string, revisionId: string): Promise<MemberFacets> {
    await this.readyRevision(projectId, revisionId);
    const distinct = async (column: 'storey' | 'profileName' | 'profileFamily' | 'profileSource'): Promise<string[]> => {
      const rows = await this.members()
        .createQueryBuilder('m')
        .select(`DISTINCT m.${column}`, 'value')
        .where('m.revisionId = :revisionId', { revisionId })
        .andWhere(`m.${column} IS NOT NULL`)
        .getRawMany<{ value: string }>();
      return rows.map((r) => r.value).sort(naturalOrder);
    };
    // Members of a family without a shear rule (plates, other shapes) count by family; the rest by their reason.
    const skippedRows = this.members()
      .createQueryBuilder('m')
      .select('m.profileFamily', 'family')
      .addSelect("CASE WHEN m.status = 'not-applicable' AND m.profileFamily IS NOT NULL THEN NULL ELSE m.reason END", 'reason')
      .addSelect('COUNT(*)', 'count')
      .where('m.revisionId = :revisionId', { revisionId })
      .andWhere("m.status != 'ok'")
      .groupBy('family')
      .addGroupBy('reason')
      .getRawMany<{ family: SectionFamily | null; reason: string | null; count: number | string }>();
    const [storeys, profiles, families, sources, skipped] = await Promise.all([
      distinct('storey'),
      distinct('profileName'),
      distinct('profileFamily'),
      distinct('profileSource'),
      skippedRows,
    ]);
    return {
      storeys,
      profiles,
      families: SECTION_FAMILIES.filter((f) => families.includes(f)),
      sources: PROFILE_SOURCES.filter((s) => sources.includes(s)),
      skipped: skipped
        .map((r) => ({ reason: r.reason ?? uncheckedFamilyReason(r.family), count: Number(r.count) }))
        .sort((a, b) => b.count - a.count || a.reason.localeCompare(b.reason)),
    };
  }

  /** The labels of every member in file order, in one answer: the 3D view names and filters all of them at once. */
  async labels(projectId: string, revisionId: string): Promise<MemberLabels> {
    await this.readyRevision(projectId, revisionId);
    const rows = await this.members()
      .createQueryBuilder('m')
      .select(['m.globalId AS globalId', 'm.tag AS tag', 'm.profileName AS profileName', 'm.storey AS storey'])
      .where('m.revisionId = :revisionId', { revisionId })
      .orderBy('m.expressId', 'ASC')
      .getRawMany<{ globalId: string; tag: string | null; profileName: string | null; storey: string | null }>();
    return { columns: ['globalId', 'tag', 'profileName', 'storey'], members: rows.map((r) => [r.globalId, r.tag, r.profileName, r.storey]) };
  }

  /** The whole record; a GlobalId written twice in one file gives its first member. */
  async detail(projectId: string, revisionId: string, globalId: string): Promise<MemberRecord> {
    await this.readyRevision(projectId, revisionId);
    const member = await this.dataSource
      .getRepository(ModelMemberRecord)
      .createQueryBuilder('r')
      .select('r.record', 'record')
      .innerJoin(ModelMember, 'm', 'm.revisionId = r.revisionId AND m.expressId = r.expressId')
      .where('m.revisionId = :revisionId AND m.globalId = :globalId', { revisionId, globalId })
      .orderBy('m.expressId', 'ASC')
      .getRawOne<{ record: string }>();
    if (!member) throw new NotFoundError(`No member with GlobalId ${globalId} in this revision.`, { code: 'member_not_found' });
    return JSON.parse(member.record) as MemberRecord;
  }

  async compare(projectId: string, fromId: string, toId: string): Promise<ComparisonView> {
    if (fromId === toId) throw new ValidationError('Choose two different revisions to compare.', { code: 'same_revision' });
    const [from, to] = [await this.readyRevision(projectId, fromId), await this.readyRevision(projectId, toId)];
    const [before, after] = [await loadMemberRecords(this.dataSource, fromId), await loadMemberRecords(this.dataSource, toId)];
    return { from: toRevisionView(from), to: toRevisionView(to), ...compareRevisions(before, after) };
  }

  private filtered(revisionId: string, query: MemberListQuery): SelectQueryBuilder<ModelMember> {
    const builder = this.members().createQueryBuilder('m').where('m.revisionId = :revisionId', { revisionId });
    if (query.status?.length) builder.andWhere('m.status IN (:...status)', { status: query.status });
    if (query.storey !== undefined) builder.andWhere('m.storey = :storey', { storey: query.storey });
    if (query.profile !== undefined) builder.andWhere('m.profileName = :profile', { profile: query.profile });
    if (query.family !== undefined) builder.andWhere('m.profileFamily = :family', { family: query.family });
    if (query.source !== undefined) builder.andWhere('m.profileSource = :source', { source: query.source });
    if (query.q !== undefined) {
      builder.andWhere(
        "(m.name LIKE :q ESCAPE '\\' OR m.tag LIKE :q ESCAPE '\\' OR m.globalId LIKE :q ESCAPE '\\' OR m.profileName LIKE :q ESCAPE '\\')",
        { q: likePattern(query.q) },
      );
    }
    return builder;
  }

  private async readyRevision(projectId: string, revisionId: string): Promise<ModelRevision> {
    const revision = await this.dataSource.getRepository(ModelRevision).findOne({ where: { id: revisionId, projectId }, relations: { uploadedBy: true } });
    if (!revision) throw revisionNotFound();
    if (revision.status !== 'ready') throw revisionNotReady(revision);
    return revision;
  }

  private members() {
    return this.dataSource.getRepository(ModelMember);
  }
}
