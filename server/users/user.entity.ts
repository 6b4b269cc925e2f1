import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

@Entity({ name: 'app_user' })
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-case; compared lower-case. */
  @Index({ unique: true })
  @Column({ type: String, length: 254 })
  email: string;

  @Column({ type: String, length: 120 })
  name: string;

  /** bcrypt hash. */
  @Column({ type: String, length: 100 })
  passwordHash: string;

  @Column({ type: Boolean, default: false })
  isAdmin: boolean;

  @Column({ type: Boolean, default: true })
  active: boolean;

  /** Sessions remember the value they were created with; raising it ends them all. */
  @Column({ type: Number, default: 0 })
  sessionVersion: number;

  @CreateDateColumn()
  createdAt: Date;

  @Column({ type: Date, nullable: true })
  lastSignInAt: Date | null;
}
