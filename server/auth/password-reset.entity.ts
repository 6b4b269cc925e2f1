import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../users/user.entity';

/** An e-mailed, single-use link to choose a new password; only the token's hash is stored. */
@Entity({ name: 'password_reset' })
export class PasswordReset {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ type: String })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: User;

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
