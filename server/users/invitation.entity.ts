import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { LinkTokenRecord } from '../auth/link-token-record';
import { Project } from '../projects/project.entity';
import { PROJECT_ROLES, type ProjectRole } from '../projects/project-role';

/** An e-mailed, single-use link to create an account. */
@Entity({ name: 'invitation' })
export class Invitation extends LinkTokenRecord {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ type: String, length: 254 })
  email: string;

  /** Suggested name; the invitee may change it when accepting. */
  @Column({ type: String, length: 120, default: '' })
  name: string;

  @Column({ type: Boolean, default: false })
  isAdmin: boolean;

  @Column({ type: String, nullable: true })
  projectId: string | null;

  @ManyToOne(() => Project, { onDelete: 'CASCADE', nullable: true })
  @JoinColumn({ name: 'projectId' })
  project?: Project | null;

  @Column({ type: 'simple-enum', enum: PROJECT_ROLES, nullable: true })
  role: ProjectRole | null;

  @Column({ type: String, nullable: true })
  invitedById: string | null;
}
