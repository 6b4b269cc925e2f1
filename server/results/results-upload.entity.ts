import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { RESULTS_FILE_KINDS, type ResultsFileKind } from './results-api-types';

/** A results file uploaded for preview and mapping; importing it makes a result set that keeps the same file. */
@Entity({ name: 'results_upload' })
export class ResultsUpload {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ type: String })
  projectId: string;

  @Column({ type: String, length: 255 })
  fileName: string;

  @Column({ type: 'simple-enum', enum: RESULTS_FILE_KINDS })
  format: ResultsFileKind;

  @Column({ type: 'integer' })
  sizeBytes: number;

  @Column({ type: String, length: 64 })
  sha256: string;

  /** Storage key of the file as uploaded. */
  @Column({ type: String, length: 512 })
  fileKey: string;

  /** XLSX worksheet names in tab order; null for CSV. */
  @Column({ type: 'simple-json', nullable: true })
  sheets: string[] | null;

  @Column({ type: String, nullable: true })
  createdById: string | null;

  @CreateDateColumn()
  createdAt: Date;

  @ManyToOne(() => Project, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'projectId' })
  project?: Project;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'createdById' })
  createdBy?: User | null;
}
