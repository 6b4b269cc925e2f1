import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import type { FindingViewpoint } from './export/finding-export';
import { FINDING_KINDS, FINDING_PRIORITIES, FINDING_STATUSES, type FindingKind, type FindingPriority, type FindingStatus } from './finding-fields';

/**
 * Something about one or more members that a reviewer tracks to closure. Findings raised by check runs carry the
 * member's GlobalId in `memberKey`: at most one per member and kind in a project, which is how re-runs find them.
 */
@Entity({ name: 'finding' })
@Index(['projectId', 'number'], { unique: true })
@Index(['projectId', 'memberKey', 'kind'], { unique: true })
export class Finding {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String })
  projectId: string;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;

  /** 1, 2, 3… within the project (see findingReference). */
  @Column({ type: Number })
  number: number;

  /** BCF topic GUID, lower-case; stable across exports so an import finds the finding again. */
  @Index({ unique: true })
  @Column({ type: String, length: 36 })
  guid: string;

  @Column({ type: 'simple-enum', enum: FINDING_KINDS })
  kind: FindingKind;

  @Column({ type: String, length: 200 })
  title: string;

  @Column({ type: String, length: 4000, default: '' })
  description: string;

  @Column({ type: 'simple-enum', enum: FINDING_STATUSES, default: 'open' })
  status: FindingStatus;

  @Column({ type: 'simple-enum', enum: FINDING_PRIORITIES, default: 'normal' })
  priority: FindingPriority;

  @Column({ type: String, nullable: true })
  assigneeId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'assigneeId' })
  assignee?: User | null;

  /** ISO date (YYYY-MM-DD). */
  @Column({ type: String, length: 10, nullable: true })
  dueDate: string | null;

  @Column({ type: 'simple-json' })
  labels: string[];

  @Column({ type: 'simple-json' })
  memberGlobalIds: string[];

  /** The member's GlobalId for findings raised by check runs; null for manual findings. */
  @Column({ type: String, length: 22, nullable: true })
  memberKey: string | null;

  /** How people name the member: tag, else name. */
  @Column({ type: String, length: 200, nullable: true })
  memberTag: string | null;

  /** Tag, profile and storey, e.g. "B-204 · IPE 300 · Level 2", for exports. */
  @Column({ type: String, length: 400, nullable: true })
  memberLabel: string | null;

  /** The latest check run that found the condition. */
  @Column({ type: String, nullable: true })
  runId: string | null;

  /** Model revision number of that run: a later revision passing moves the finding to ready to verify. */
  @Column({ type: Number, nullable: true })
  revisionNumber: number | null;

  /** Governing demand / capacity in that run (1 = 100 %). */
  @Column({ type: 'real', nullable: true })
  utilisation: number | null;

  /** Why a reviewer accepted the finding as it is; set while the status is accepted. */
  @Column({ type: 'text', nullable: true })
  justification: string | null;

  /** The view it was raised in (IFC axes, metres), as BCF stores it. */
  @Column({ type: 'simple-json', nullable: true })
  viewpoint: FindingViewpoint | null;

  /** Storage key of the PNG snapshot taken with the viewpoint. */
  @Column({ type: String, nullable: true })
  snapshotKey: string | null;

  /** Null when a check run raised it. */
  @Column({ type: String, nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'createdById' })
  createdBy?: User | null;

  @CreateDateColumn()
  createdAt: Date;

  @UpdateDateColumn()
  updatedAt: Date;
}
