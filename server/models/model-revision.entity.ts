import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { IfcSchema } from '../ifc/model-read-result';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { REVISION_STATUSES, type RevisionCounts, type RevisionStatus } from './revision-view';

/** One uploaded IFC file of a project and the state of its ingest. */
@Entity({ name: 'model_revision' })
@Index(['projectId', 'number'], { unique: true })
@Index(['projectId', 'sha256'])
export class ModelRevision {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String })
  projectId: string;

  /** 1, 2, 3… per project, in upload order. */
  @Column({ type: 'integer' })
  number: number;

  /** As uploaded (may end in .ifczip). */
  @Column({ type: String, length: 255 })
  fileName: string;

  /** Size and SHA-256 of the IFC content (of the extracted .ifc for an .ifczip). */
  @Column({ type: 'integer' })
  sizeBytes: number;

  @Column({ type: String, length: 64 })
  sha256: string;

  @Column({ type: String, length: 2000, default: '' })
  note: string;

  @Column({ type: String, nullable: true })
  uploadedById: string | null;

  @CreateDateColumn()
  uploadedAt: Date;

  @Column({ type: 'simple-enum', enum: REVISION_STATUSES, default: 'queued' })
  status: RevisionStatus;

  @Column({ type: String, length: 16, nullable: true })
  progressPhase: string | null;

  /** Of the whole ingest, 0 to 1. */
  @Column({ type: 'real', nullable: true })
  progressFraction: number | null;

  /** Why the ingest failed, in words for the person who uploaded the file. */
  @Column({ type: String, length: 2000, nullable: true })
  error: string | null;

  @Column({ type: String, length: 16, nullable: true })
  schema: IfcSchema | null;

  /** The schema name as the header writes it (IFC4X3_ADD2…). */
  @Column({ type: String, length: 64, nullable: true })
  fileSchema: string | null;

  @Column({ type: String, length: 64, nullable: true })
  lengthUnit: string | null;

  @Column({ type: String, length: 255, nullable: true })
  application: string | null;

  @Column({ type: 'simple-json', nullable: true })
  counts: RevisionCounts | null;

  /** Storage key of the IFC file; null once a failed revision's file was removed. */
  @Column({ type: String, length: 512, nullable: true })
  fileKey: string | null;

  @Column({ type: String, length: 512, nullable: true })
  glbKey: string | null;

  @Column({ type: 'datetime', nullable: true })
  finishedAt: Date | null;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'uploadedById' })
  uploadedBy?: User | null;
}
