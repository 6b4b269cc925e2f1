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

  /** The user who wrote it, or for an imported comment the user who imported it; null once that account is deleted. */
  @Column({ type: String, nullable: true })
  authorId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'authorId' })
  author?: User | null;

  /**
   * The author's address when it was written, shown once the account is gone. A BCF file's own author and date are
   * quoted in the text, never stored here.
   */
  @Column({ type: String, length: 254 })
  authorEmail: string;

  @Column({ type: String, length: 4000 })
  text: string;

  /** When it was written (imported comments keep their date). */
  @Column({ type: Date })
  createdAt: Date;
}
