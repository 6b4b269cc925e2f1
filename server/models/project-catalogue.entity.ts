import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import type { CatalogueSection } from '../catalogue/catalogue-section';
import { Project } from '../projects/project.entity';

/** A project's own rolled sections (uploaded as CSV), searched before the built-in tables at each later ingest. */
@Entity({ name: 'project_catalogue' })
export class ProjectCatalogue {
  @PrimaryColumn({ type: String })
  projectId: string;

  @Column({ type: 'simple-json' })
  sections: CatalogueSection[];

  @Column({ type: String, length: 255 })
  fileName: string;

  @Column({ type: String, nullable: true })
  uploadedById: string | null;

  @UpdateDateColumn()
  uploadedAt: Date;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;
}
