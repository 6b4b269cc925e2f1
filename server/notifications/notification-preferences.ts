import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { NotificationPreference } from './notification-preference.entity';

/** The finding e-mails a user can switch off, each on its own. */
export const NOTIFICATION_KINDS = ['assigned', 'statusChanged', 'mentioned'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];
export type NotificationSettings = Record<NotificationKind, boolean>;

/** Everything on until the user says otherwise. */
export const DEFAULT_NOTIFICATION_SETTINGS: Readonly<NotificationSettings> = { assigned: true, statusChanged: true, mentioned: true };

function settingsOf(row: NotificationPreference | null): NotificationSettings {
  if (!row) return { ...DEFAULT_NOTIFICATION_SETTINGS };
  return { assigned: row.assigned, statusChanged: row.statusChanged, mentioned: row.mentioned };
}

export class NotificationPreferences {
  constructor(private readonly dataSource: DataSource) {}

  async get(userId: string): Promise<NotificationSettings> {
    return settingsOf(await this.dataSource.getRepository(NotificationPreference).findOneBy({ userId }));
  }

  async set(userId: string, settings: NotificationSettings): Promise<NotificationSettings> {
    await this.dataSource.getRepository(NotificationPreference).upsert({ userId, ...settings }, ['userId']);
    return this.get(userId);
  }

  /** Whether each of the users wants this kind of e-mail. */
  async wanting(userIds: readonly string[], kind: NotificationKind): Promise<Set<string>> {
    const rows = await this.dataSource.getRepository(NotificationPreference).findBy({ userId: In([...userIds]) });
    const byUser = new Map(rows.map((row) => [row.userId, row]));
    return new Set(userIds.filter((id) => settingsOf(byUser.get(id) ?? null)[kind]));
  }
}
