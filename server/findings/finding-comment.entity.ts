import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { User } from '../users/user.entity';
import { FindingPart } from './finding-part';

/** A comment on a finding, written in Taulens or brought in by a BCF import. */
@Entity({ name: 'finding_comment' })
export class FindingComment extends FindingPart {
  /** BCF comment GUID, lower-case; an import adds only comments whose GUID is new. */
  @Index({ unique: true })
  @Column({ type: String, length: 36 })
  guid: string;

  /** Null when an imported comment's author is not a Taulens user. */
  @Column({ type: String, nullable: true })
  authorId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'authorId' })
  author?: User | null;

  /** The author as BCF names them (an e-mail address), kept for imported comments. */
  @Column({ type: String, length: 254 })
  authorEmail: string;

  @Column({ type: String, length: 4000 })
  text: string;

  /** When it was written (imported comments keep their date). */
  @Column({ type: Date })
  createdAt: Date;
}
