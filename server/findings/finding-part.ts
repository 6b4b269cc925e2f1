import { Column, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { Finding } from './finding.entity';

/** The columns of every row that belongs to one finding (comments, history): removed with the finding. */
export abstract class FindingPart {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ type: String })
  findingId: string;

  @ManyToOne(() => Finding, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'findingId' })
  finding?: Finding;
}
