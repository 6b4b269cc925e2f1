import { Column, Entity, JoinColumn, OneToOne, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import { User } from '../users/user.entity';

/** Which finding e-mails a user wants; a user without a row gets all of them. */
@Entity({ name: 'notification_preference' })
export class NotificationPreference {
  @PrimaryColumn({ type: String })
  userId: string;

  @OneToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user?: User;

  @Column({ type: Boolean, default: true })
  assigned: boolean;

  @Column({ type: Boolean, default: true })
  statusChanged: boolean;

  @Column({ type: Boolean, default: true })
  mentioned: boolean;

  @UpdateDateColumn()
  updatedAt: Date;
}
