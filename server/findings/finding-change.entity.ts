import { Column, Entity, JoinColumn, ManyToOne } from 'typeorm';
import { User } from '../users/user.entity';
import { CHANGE_SOURCES, type ChangeSource } from './finding-fields';
import { FindingPart } from './finding-part';

/** One line of a finding's history: who changed which field from what to what, and when. */
@Entity({ name: 'finding_change' })
export class FindingChange extends FindingPart {
  /** Null for changes the system made (a check run). */
  @Column({ type: String, nullable: true })
  actorId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'actorId' })
  actor?: User | null;

  @Column({ type: 'simple-enum', enum: CHANGE_SOURCES })
  source: ChangeSource;

  /** 'created', 'status', 'assignee', 'priority', 'dueDate', 'labels', 'title', 'description', 'justification', 'utilisation', 'comment'. */
  @Column({ type: String, length: 40 })
  field: string;

  /** The values as people read them (names, statuses, percentages). */
  @Column({ type: 'text', nullable: true })
  fromValue: string | null;

  @Column({ type: 'text', nullable: true })
  toValue: string | null;

  /** Set by the writer to the millisecond, so changes made together keep their order. */
  @Column({ type: Date })
  at: Date;
}
