import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { Fabrication } from '../engine/section';
import type { SectionFamily } from '../engine/section-family';
import type { MemberFlag, MemberProfile, MemberStatus } from '../ifc/model-read-result';
import { MEMBER_STATUSES } from './member-row';
import { ModelRevision } from './model-revision.entity';

/**
 * One beam, column or member of a revision: the columns the members table sorts and filters on. The whole record
 * lives in model_member_record, so these rows stay small and a sort or filter reads few pages. Written only by the
 * ingest worker (member-store.ts), so the column names here and there must stay the same.
 */
@Entity({ name: 'model_member' })
@Index(['revisionId', 'globalId'])
@Index(['revisionId', 'status'])
@Index(['revisionId', 'storey'])
@Index(['revisionId', 'profileName'])
@Index(['revisionId', 'tag'])
@Index(['revisionId', 'name'])
@Index(['revisionId', 'depth_mm'])
@Index(['revisionId', 'length_mm'])
@Index(['revisionId', 'profileFamily'])
export class ModelMember {
  @PrimaryColumn({ type: String })
  revisionId: string;

  /** Unique within a file, unlike a GlobalId in a badly exported one. */
  @PrimaryColumn({ type: 'integer' })
  expressId: number;

  @Column({ type: String, length: 64 })
  globalId: string;

  @Column({ type: String, length: 64 })
  ifcClass: string;

  @Column({ type: 'text', nullable: true })
  name: string | null;

  @Column({ type: 'text', nullable: true })
  tag: string | null;

  @Column({ type: 'text', nullable: true })
  storey: string | null;

  @Column({ type: 'simple-enum', enum: MEMBER_STATUSES })
  status: MemberStatus;

  @Column({ type: 'text', nullable: true })
  reason: string | null;

  @Column({ type: 'text', nullable: true })
  profileName: string | null;

  @Column({ type: String, length: 20, nullable: true })
  profileSource: MemberProfile['source'] | null;

  @Column({ type: String, length: 64, nullable: true })
  profileType: string | null;

  @Column({ type: String, length: 16, nullable: true })
  profileFamily: SectionFamily | null;

  @Column({ type: String, length: 16, nullable: true })
  fabrication: Fabrication | null;

  @Column({ type: 'real', nullable: true })
  depth_mm: number | null;

  @Column({ type: 'real', nullable: true })
  webThickness_mm: number | null;

  /** Of the top flange; the record holds both flanges of an asymmetric section. */
  @Column({ type: 'real', nullable: true })
  flangeWidth_mm: number | null;

  @Column({ type: 'real', nullable: true })
  flangeThickness_mm: number | null;

  @Column({ type: String, length: 16, nullable: true })
  grade: string | null;

  @Column({ type: 'real', nullable: true })
  fy_MPa: number | null;

  @Column({ type: Boolean, nullable: true })
  gradeAssumed: boolean | null;

  @Column({ type: 'real', nullable: true })
  length_mm: number | null;

  @Column({ type: 'simple-json' })
  flags: MemberFlag[];

  @ManyToOne(() => ModelRevision, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revisionId' })
  revision?: ModelRevision;
}
