import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { CheckRun } from './check-run.entity';
import type { FamilyCheckName, ShearAxis } from '../engine/shear-axis';
import type { RunFlag } from './check-run-compute';
import { RESULT_STATUSES, type ResultStatus } from './checks-api-types';

/**
 * One member's outcome in a check run: the columns the results table sorts and filters on, indexed per run. Kept
 * narrow (the engine's full result lives in check_member_detail) so a sort or filter over 50,000 rows reads few
 * pages. Written once when the run finishes; never updated.
 */
@Entity({ name: 'check_member_result' })
@Index(['runId', 'globalId'])
@Index(['runId', 'utilisation'])
@Index(['runId', 'status', 'utilisation'])
@Index(['runId', 'storey', 'utilisation'])
@Index(['runId', 'profileName', 'utilisation'])
@Index(['runId', 'tag'])
@Index(['runId', 'VEd_kN'])
@Index(['runId', 'search'])
@Index(['runId', 'status', 'profileName', 'storey', 'utilisation'])
export class CheckMemberResult {
  @PrimaryColumn({ type: String })
  runId: string;

  /** The member's place in the model, a stable tie-break for sorting. */
  @PrimaryColumn({ type: 'integer' })
  ordinal: number;

  @Column({ type: String, length: 64 })
  globalId: string;

  @Column({ type: 'text', nullable: true })
  tag: string | null;

  @Column({ type: 'text', nullable: true })
  name: string | null;

  @Column({ type: 'text', nullable: true })
  storey: string | null;

  @Column({ type: 'text', nullable: true })
  profileName: string | null;

  @Column({ type: String, length: 16, nullable: true })
  grade: string | null;

  @Column({ type: 'simple-enum', enum: RESULT_STATUSES })
  status: ResultStatus;

  @Column({ type: 'text', nullable: true })
  governingCombination: string | null;

  @Column({ type: String, length: 8, nullable: true })
  governingAxis: ShearAxis | null;

  @Column({ type: String, length: 24, nullable: true })
  governingCheck: FamilyCheckName | null;

  @Column({ type: 'real', nullable: true })
  VEd_kN: number | null;

  @Column({ type: 'real', nullable: true })
  VRd_kN: number | null;

  @Column({ type: 'real', nullable: true })
  utilisation: number | null;

  @Column({ type: 'real', nullable: true })
  tauMax_MPa: number | null;

  @Column({ type: 'real', nullable: true })
  tauAvgWeb_MPa: number | null;

  @Column({ type: 'simple-json' })
  flags: RunFlag[];

  /** GlobalId, tag, name and profile in lower case, for the table's text filter: one column to scan, not four. */
  @Column({ type: 'text' })
  search: string;

  @ManyToOne(() => CheckRun, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'runId' })
  run?: CheckRun;
}
