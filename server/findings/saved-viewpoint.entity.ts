import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Project } from '../projects/project.entity';
import type { ClippingPlane, FindingCamera } from './export/finding-export';

/** A named view of the 3D model kept for the project (IFC axes, metres, as BCF writes them). */
@Entity({ name: 'saved_viewpoint' })
export class SavedViewpoint {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ type: String })
  projectId: string;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;

  @Column({ type: String, length: 120 })
  name: string;

  @Column({ type: 'simple-json' })
  camera: FindingCamera;

  /** Null: everything visible. */
  @Column({ type: 'simple-json', nullable: true })
  visibleGlobalIds: string[] | null;

  @Column({ type: 'simple-json' })
  selectedGlobalIds: string[];

  @Column({ type: 'simple-json', nullable: true })
  sectionPlane: ClippingPlane | null;

  @Column({ type: String, nullable: true })
  createdById: string | null;

  @CreateDateColumn()
  createdAt: Date;
}
