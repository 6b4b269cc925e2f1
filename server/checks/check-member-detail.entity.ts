import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { MemberCheck } from './check-run-compute';
import { CheckRun } from './check-run.entity';

/**
 * The engine's full result for one member of a check run (what its calculation sheet and reports read), beside the
 * narrow check_member_result row of the same run and ordinal. Written once when the run finishes; never updated.
 */
@Entity({ name: 'check_member_detail' })
export class CheckMemberDetail {
  @PrimaryColumn({ type: String })
  runId: string;

  @PrimaryColumn({ type: 'integer' })
  ordinal: number;

  /** The engine's MemberCheck without `combinations`. */
  @Column({ type: 'simple-json' })
  detail: Omit<MemberCheck, 'combinations'>;

  /** Per-combination values, compact (member-result-row.ts). */
  @Column({ type: 'text' })
  combinations: string;

  @ManyToOne(() => CheckRun, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'runId' })
  run?: CheckRun;
}
