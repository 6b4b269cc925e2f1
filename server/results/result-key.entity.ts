import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { Point3_mm } from '../ifc/model-read-result';
import { ResultSet } from './result-set.entity';

/** One distinct member key of a result set (an analysis member), with its end points when the file gives them. */
@Entity({ name: 'result_key' })
@Index(['resultSetId', 'memberKey'], { unique: true })
@Index(['memberKey'])
export class ResultKey {
  @PrimaryColumn({ type: String })
  resultSetId: string;

  /** Order of first appearance in the file. */
  @PrimaryColumn({ type: 'integer' })
  keyIndex: number;

  @Column({ type: 'text' })
  memberKey: string;

  @Column({ type: 'integer' })
  rowCount: number;

  @Column({ type: 'integer' })
  firstRow: number;

  /** [end 1, end 2] in millimetres of the file's coordinates; null when the mapping has no coordinates. */
  @Column({ type: 'simple-json', nullable: true })
  ends: [Point3_mm, Point3_mm] | null;

  @ManyToOne(() => ResultSet, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'resultSetId' })
  resultSet?: ResultSet;
}
