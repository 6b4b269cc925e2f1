import { Column, CreateDateColumn, Index } from 'typeorm';

/**
 * The columns every e-mailed single-use link shares (invitations, password resets). Only the
 * token's SHA-256 is stored.
 */
export abstract class LinkTokenRecord {
  @Index({ unique: true })
  @Column({ type: String, length: 64 })
  tokenHash: string;

  @Column({ type: Date })
  expiresAt: Date;

  @Column({ type: Date, nullable: true })
  usedAt: Date | null;

  @CreateDateColumn()
  createdAt: Date;
}
