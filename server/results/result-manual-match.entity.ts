import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/**
 * A coordinator's match of a result key to a member, kept per project by GlobalId so it carries over to every later
 * revision and every later results file that uses the same key.
 */
@Entity({ name: 'result_manual_match' })
export class ResultManualMatch {
  @PrimaryColumn({ type: String })
  projectId: string;

  @PrimaryColumn({ type: 'text' })
  memberKey: string;

  @Column({ type: String, length: 64 })
  globalId: string;

  @Column({ type: String, nullable: true })
  updatedById: string | null;

  @UpdateDateColumn()
  updatedAt: Date;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'updatedById' })
  updatedBy?: User | null;
}
