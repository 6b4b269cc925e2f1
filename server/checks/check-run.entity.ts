import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Project } from '../projects/project.entity';
import { STANDARDS, type Standard } from '../engine/check';
import type { CheckParameters } from './check-parameters';
import { CHECK_RUN_STATUSES, type CheckRunStatus } from './checks-api-types';
import type { RunSummary } from './run-summary';


/**
 * One check of a model revision against a result set: the record of its inputs (who, when, file hashes, parameters,
 * engine version) and its outcome. Once done or failed it never changes; the migration adds a trigger that refuses
 * any update then, whatever code tries.
 */
@Entity({ name: 'check_run' })
@Index(['projectId', 'createdAt'])
export class CheckRun {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String })
  projectId: string;

  @Column({ type: 'simple-enum', enum: CHECK_RUN_STATUSES, default: 'queued' })
  status: CheckRunStatus;

  /** Why the run failed, in words for the engineer. */
  @Column({ type: String, length: 2000, nullable: true })
  error: string | null;

  @Column({ type: 'simple-enum', enum: STANDARDS })
  standard: Standard;

  /** As the run used them, every default filled in. */
  @Column({ type: 'simple-json' })
  parameters: CheckParameters;

  @Column({ type: String, length: 120 })
  engineVersion: string;

  // The model revision and result set as they were when the run started: copied, so the record stands alone.
  @Column({ type: String })
  modelRevisionId: string;

  @Column({ type: 'integer' })
  modelRevisionNumber: number;

  @Column({ type: String, length: 255 })
  modelFileName: string;

  @Column({ type: String, length: 64 })
  modelSha256: string;

  @Column({ type: String })
  resultSetId: string;

  @Column({ type: String, length: 200 })
  resultSetName: string;

  @Column({ type: String, length: 64 })
  resultsSha256: string;

  /** Names of the result set's load combinations; per-member values refer to them by index. */
  @Column({ type: 'simple-json' })
  combinations: string[];

  /** The engineer went on although almost no result key matched a member. */
  @Column({ type: Boolean, default: false })
  poorMatchConfirmed: boolean;

  @Column({ type: 'simple-json', nullable: true })
  summary: RunSummary | null;

  // Who ran it, copied (no foreign key), so the record keeps its author whatever happens to the account.
  @Column({ type: String })
  createdById: string;

  @Column({ type: String, length: 120 })
  createdByName: string;

  @CreateDateColumn()
  createdAt: Date;

  @Column({ type: 'datetime', nullable: true })
  finishedAt: Date | null;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;
}
