import { z } from 'zod';
import { idSchema } from './common';

/** What a person is told about: a baseline locked, a study promoted, a row of theirs changed by someone else. */
export const notificationKinds = ['baseline_locked', 'study_promoted', 'row_changed'] as const;
export const notificationKindSchema = z.enum(notificationKinds);
export type NotificationKind = z.infer<typeof notificationKindSchema>;

/** One notification of the in-app list. */
export const notificationSchema = z.object({
  id: idSchema,
  kind: notificationKindSchema,
  craftId: idSchema.nullable(),
  title: z.string(),
  body: z.string(),
  actor: z.object({ id: idSchema, name: z.string() }).nullable(),
  createdAt: z.string(),
  readAt: z.string().nullable(),
});
export type Notification = z.infer<typeof notificationSchema>;

/** GET /api/notifications: the latest notifications, newest first, and how many are unread. */
export const notificationListSchema = z.object({ notifications: z.array(notificationSchema), unread: z.number().int().min(0) });

/** POST /api/notifications/read: marks these notifications read, or all of the person's when `ids` is absent. */
export const markReadBodySchema = z.object({ ids: z.array(idSchema).max(500).optional() });

/** Which kinds of notification also come by mail (all do unless turned off). */
export const mailPreferencesSchema = z.object({
  mail: z.object({ baseline_locked: z.boolean(), study_promoted: z.boolean(), row_changed: z.boolean() }),
});
export type MailPreferences = z.infer<typeof mailPreferencesSchema>;
