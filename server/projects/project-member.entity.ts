import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { User } from '../users/user.entity';
import { Project } from './project.entity';
import { PROJECT_ROLES, type ProjectRole } from './project-role';

/** A user's role in one project. */
@Entity({ name: 'project_member' })
export class ProjectMember {
  @PrimaryColumn({ type: String })
  projectId: string;

  /** Indexed for "which projects is this user in" (the primary key leads with projectId). */
  @Index()
  @PrimaryColumn({ type: String })
  userId: string;

  @Column({ type: 'simple-enum', enum: PROJECT_ROLES })
  role: ProjectRole;

  @CreateDateColumn()
  createdAt: Date;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: User;
}
