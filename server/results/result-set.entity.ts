import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { FORCE_UNITS, type ForceUnit } from '../engine/units';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import type { ColumnMapping } from './column-mapping';
import type { MatchingSummary } from './matching-summary';
import type { GeometryMatchOptions } from './member-matching';
import { RESULTS_FILE_KINDS, type ResultsFileKind } from './results-api-types';

/**
 * An imported results file: never changed after the import, so a check run can name it by its hash. The governing
 * shear per member key and combination is kept in a compact file (governing-file.ts), the keys in result_key.
 */
@Entity({ name: 'result_set' })
@Index(['projectId', 'createdAt'])
export class ResultSet {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String })
  projectId: string;

  /** The revision the results were imported for; matching may be shown against others. */
  @Column({ type: String })
  modelRevisionId: string;

  @Column({ type: String, length: 200 })
  name: string;

  @Column({ type: String, length: 255 })
  fileName: string;

  @Column({ type: 'simple-enum', enum: RESULTS_FILE_KINDS })
  format: ResultsFileKind;

  @Column({ type: String, length: 255, nullable: true })
  sheet: string | null;

  @Column({ type: String, length: 64 })
  sha256: string;

  /** Storage key of the file as uploaded. */
  @Column({ type: String, length: 512 })
  fileKey: string;

  /** Storage key of the governing-shear file. */
  @Column({ type: String, length: 512 })
  governingKey: string;

  @Column({ type: 'simple-json' })
  mapping: ColumnMapping;

  /** How analysis end points are compared with the model's axes; null when the mapping has no coordinates. */
  @Column({ type: 'simple-json', nullable: true })
  geometry: GeometryMatchOptions | null;

  @Column({ type: 'integer' })
  rowCount: number;

  @Column({ type: 'integer' })
  memberKeyCount: number;

  @Column({ type: 'simple-json' })
  combinations: string[];

  @Column({ type: 'simple-enum', enum: FORCE_UNITS })
  forceUnit: ForceUnit;

  /** Matching against modelRevisionId, refreshed when a manual match of one of its keys changes. */
  @Column({ type: 'simple-json' })
  matching: MatchingSummary;

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
