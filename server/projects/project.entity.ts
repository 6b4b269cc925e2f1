import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { DESIGN_STANDARDS, type DesignStandard } from './design-standard';
import type { ProjectSettings } from './project-settings';

@Entity({ name: 'project' })
export class Project {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String, length: 120 })
  name: string;

  /** Short reference teams use on drawings; unique across the site. */
  @Index({ unique: true })
  @Column({ type: String, length: 32 })
  code: string;

  @Column({ type: String, length: 2000, default: '' })
  description: string;

  @Column({ type: String, length: 200, default: '' })
  client: string;

  @Column({ type: String, length: 200, default: '' })
  location: string;

  @Column({ type: 'simple-enum', enum: DESIGN_STANDARDS })
  standard: DesignStandard;

  @Column({ type: 'simple-json' })
  settings: ProjectSettings;

  @Column({ type: Boolean, default: false })
  archived: boolean;

  @Column({ type: String, nullable: true })
  createdById: string | null;

  @CreateDateColumn()
  createdAt: Date;

  @UpdateDateColumn()
  updatedAt: Date;
}
