import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A message the built-in fake SMTP server received (development and tests only). */
@Entity({ name: 'outbox_message' })
export class OutboxMessage {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: String, length: 320, default: '' })
  from: string;

  /** Recipients as the SMTP envelope named them, comma-separated. */
  @Column({ type: String, length: 2000 })
  to: string;

  @Column({ type: String, length: 998, default: '' })
  subject: string;

  @Column({ type: 'text', default: '' })
  text: string;

  @Column({ type: 'text', default: '' })
  html: string;

  @Column({ type: Date })
  receivedAt: Date;
}
