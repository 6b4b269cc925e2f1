import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Project } from '../projects/project.entity';
import type { ColumnMapping } from './column-mapping';

/** A column mapping saved under a name, for the next export of the same analysis program. */
@Entity({ name: 'result_mapping_template' })
@Index(['projectId', 'name'], { unique: true })
export class ResultMappingTemplate {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String })
  projectId: string;

  @Column({ type: String, length: 120 })
  name: string;

  @Column({ type: 'simple-json' })
  mapping: ColumnMapping;

  @Column({ type: String, nullable: true })
  createdById: string | null;

  @CreateDateColumn()
  createdAt: Date;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;
}
