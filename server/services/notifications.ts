import crypto from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { notificationKinds, type MailPreferences, type Notification, type NotificationKind } from '@/shared/schemas/notifications';
import type { User } from '../models';
import type { RowChange } from '../models/sheet-rows';
import type { Mailer } from './mailer';

/** Row changes are gathered: one mail per person once the first change waiting for them is this old. */
export const DIGEST_MINUTES = 5;
/** A failed mail is tried again after 30 s, then twice as long each time, up to an hour. */
const RETRY_BASE_SECONDS = 30;
const RETRY_MAX_SECONDS = 3600;
const SEND_BATCH = 20;

/** Kinds mailed at once; the others wait to be gathered into a digest. */
const immediate: ReadonlySet<NotificationKind> = new Set(['baseline_locked', 'study_promoted']);

/** What to tell people: the same title and body for each of them. */
export interface NotificationDraft {
  craftId: string;
  kind: NotificationKind;
  title: string;
  body: string;
  /** Who did it: never told of their own change. */
  actorId: string;
  /** Who to tell. */
  userIds: readonly string[];
}

/** Queues a mail in the outbox, in the caller's transaction; the worker sends it. */
async function enqueueMail(sequelize: Sequelize, transaction: Transaction, to: string, subject: string, text: string): Promise<void> {
  await sequelize.query('INSERT INTO mail_outbox (id, to_address, subject, text) VALUES ($1, $2, $3, $4)', {
    bind: [crypto.randomUUID(), to, subject, text],
    transaction,
  });
}

/**
 * Records a notification for each person (the actor excepted) in the transaction of the change it tells of,
 * so that it exists exactly when the change does. Kinds mailed at once go to the outbox here too, for those
 * who have not turned that mail off; row changes wait for the digest.
 */
export async function notify(sequelize: Sequelize, transaction: Transaction, draft: NotificationDraft): Promise<void> {
  const recipients = [...new Set(draft.userIds)].filter((id) => id !== draft.actorId);
  if (recipients.length === 0) return;
  const people = await sequelize.query<{ id: string; email: string; mail: boolean }>(
    `SELECT u.id, u.email, COALESCE(p.mail, true) AS mail
     FROM users u LEFT JOIN mail_preferences p ON p.user_id = u.id AND p.kind = $2
     WHERE u.id = ANY ($1::uuid[])`,
    { bind: [recipients, draft.kind], type: QueryTypes.SELECT, transaction },
  );
  const now = immediate.has(draft.kind);
  for (const person of people) {
    // A row change waits (mailed_at null) for the digest, unless the person does not want that mail at all.
    const mailedAt = now || !person.mail ? new Date() : null;
    await sequelize.query(
      `INSERT INTO notifications (id, user_id, craft_id, kind, title, body, actor_id, mailed_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
      {
        bind: [crypto.randomUUID(), person.id, draft.craftId, draft.kind, draft.title, draft.body, draft.actorId, mailedAt],
        transaction,
      },
    );
    if (now && person.mail) await enqueueMail(sequelize, transaction, person.email, draft.title, `${draft.body}\n`);
  }
}

/** The subsystem owners of the craft whose subsystems include any of these, for telling them of changes to their rows. */
export async function ownersOfSubsystems(
  sequelize: Sequelize,
  transaction: Transaction,
  craftId: string,
  subsystemIds: readonly string[],
): Promise<string[]> {
  if (subsystemIds.length === 0) return [];
  const owners = await sequelize.query<{ userId: string }>(
    `SELECT user_id AS "userId" FROM memberships
     WHERE craft_id = $1 AND role = 'subsystem_owner' AND subsystem_ids && $2::uuid[]`,
    { bind: [craftId, [...subsystemIds]], type: QueryTypes.SELECT, transaction },
  );
  return owners.map((owner) => owner.userId);
}

/**
 * Tells the owners of the subsystems a baseline or a promotion touched, mailed at once (a lock and a
 * promotion are rare and matter to each owner).
 */
export async function notifySubsystemOwners(
  sequelize: Sequelize,
  transaction: Transaction,
  event: Omit<NotificationDraft, 'userIds'> & { subsystemIds: readonly string[] },
): Promise<void> {
  const { subsystemIds, ...draft } = event;
  await notify(sequelize, transaction, {
    ...draft,
    userIds: await ownersOfSubsystems(sequelize, transaction, draft.craftId, subsystemIds),
  });
}

/** A row as the history holds it, in words: its formula, or its value and unit. */
function rowInWords(row: unknown): string {
  const fields = (row ?? {}) as { formula?: string; value?: number; unit?: string; material?: { id: string; property: string } };
  if (fields.formula !== undefined) return fields.formula;
  if (fields.value !== undefined) return `${fields.value} ${fields.unit ?? ''}`.trim();
  if (fields.material !== undefined) return `${fields.material.id} ${fields.material.property} from the library`;
  return '(none)';
}

/** One history entry of a row change in words, for a notification's body. */
function changeInWords(change: RowChange): string {
  if (change.action === 'create') return `${change.key}: added, ${rowInWords(change.after)}`;
  if (change.action === 'delete') return `${change.key}: deleted (was ${rowInWords(change.before)})`;
  const before = rowInWords(change.before);
  const after = rowInWords(change.after);
  return before === after ? `${change.key}: ${change.action}` : `${change.key}: ${before} → ${after}`;
}

/**
 * Tells the subsystem owners of changed rows (of a craft's working draft) that someone else changed them:
 * one notification per owner and write, gathered into the digest mail.
 */
export async function notifyRowOwners(
  sequelize: Sequelize,
  transaction: Transaction,
  write: {
    craftId: string;
    actor: Pick<User, 'id' | 'name'>;
    changes: readonly RowChange[];
    subsystemOf: Readonly<Record<string, string>>;
  },
): Promise<void> {
  const owners = await ownersOfSubsystems(sequelize, transaction, write.craftId, [...new Set(Object.values(write.subsystemOf))]);
  if (owners.length === 0) return;
  const [craft] = await sequelize.query<{ name: string }>('SELECT name FROM crafts WHERE id = $1', {
    bind: [write.craftId],
    type: QueryTypes.SELECT,
    transaction,
  });
  const keys = [...new Set(write.changes.map((change) => change.key))];
  await notify(sequelize, transaction, {
    craftId: write.craftId,
    kind: 'row_changed',
    title: `${write.actor.name} changed ${keys.join(', ')} on ${craft?.name ?? 'a craft'}`,
    body: write.changes.map(changeInWords).join('\n'),
    actorId: write.actor.id,
    userIds: owners,
  });
}

/**
 * Gathers the row changes waiting for each person into one mail, once the oldest has waited `DIGEST_MINUTES`
 * (so a burst of edits makes one mail, not one per keystroke). Returns how many digests were queued.
 */
export async function collectDigests(sequelize: Sequelize, now = new Date()): Promise<number> {
  const due = await sequelize.query<{ userId: string }>(
    `SELECT user_id AS "userId" FROM notifications WHERE mailed_at IS NULL
     GROUP BY user_id HAVING min(created_at) <= $1::timestamptz - make_interval(mins => $2)`,
    { bind: [now.toISOString(), DIGEST_MINUTES], type: QueryTypes.SELECT },
  );
  let queued = 0;
  for (const { userId } of due) {
    await sequelize.transaction(async (transaction) => {
      // SKIP LOCKED: two API processes running the worker never gather the same notifications twice.
      const waiting = await sequelize.query<{ id: string; title: string; body: string; email: string }>(
        `SELECT n.id, n.title, n.body, u.email FROM notifications n JOIN users u ON u.id = n.user_id
         WHERE n.user_id = $1 AND n.mailed_at IS NULL ORDER BY n.created_at FOR UPDATE OF n SKIP LOCKED`,
        { bind: [userId], type: QueryTypes.SELECT, transaction },
      );
      const first = waiting[0];
      if (first === undefined) return;
      const subject = waiting.length === 1 ? first.title : `${waiting.length} changes to rows you own`;
      const text = waiting.map((entry) => `${entry.title}\n${entry.body}`).join('\n\n');
      await enqueueMail(sequelize, transaction, first.email, subject, `${text}\n`);
      await sequelize.query('UPDATE notifications SET mailed_at = now() WHERE id = ANY ($1::uuid[])', {
        bind: [waiting.map((entry) => entry.id)],
        transaction,
      });
      queued += 1;
    });
  }
  return queued;
}

/**
 * Sends the outbox's due mail. A mail the server refuses, or a server that is down, leaves the mail in the
 * outbox for a later try (30 s, then doubling up to an hour); nothing is lost. Returns how many were sent.
 */
export async function sendDueMail(sequelize: Sequelize, mailer: Mailer): Promise<number> {
  return sequelize.transaction(async (transaction) => {
    const due = await sequelize.query<{ id: string; to: string; subject: string; text: string; attempts: number }>(
      `SELECT id, to_address AS "to", subject, text, attempts FROM mail_outbox
       WHERE sent_at IS NULL AND next_attempt_at <= now() ORDER BY created_at LIMIT $1 FOR UPDATE SKIP LOCKED`,
      { bind: [SEND_BATCH], type: QueryTypes.SELECT, transaction },
    );
    let sent = 0;
    for (const mail of due) {
      try {
        await mailer.send({ to: mail.to, subject: mail.subject, text: mail.text });
        await sequelize.query('UPDATE mail_outbox SET sent_at = now(), attempts = attempts + 1 WHERE id = $1', {
          bind: [mail.id],
          transaction,
        });
        sent += 1;
      } catch (error) {
        const wait = Math.min(RETRY_BASE_SECONDS * 2 ** mail.attempts, RETRY_MAX_SECONDS);
        await sequelize.query(
          `UPDATE mail_outbox SET attempts = attempts + 1, last_error = $2, next_attempt_at = now() + make_interval(secs => $3)
           WHERE id = $1`,
          { bind: [mail.id, error instanceof Error ? error.message.slice(0, 500) : String(error), wait], transaction },
        );
      }
    }
    return sent;
  });
}

/** Runs the digest and the outbox every `intervalMs` until stopped; a failing round is logged and the next one runs. */
export function startNotificationWorker(sequelize: Sequelize, mailer: Mailer, intervalMs = 15_000): { stop(): Promise<void> } {
  let running: Promise<void> = Promise.resolve();
  const round = async () => {
    try {
      await collectDigests(sequelize);
      await sendDueMail(sequelize, mailer);
    } catch (error) {
      console.error('[trimsheet] notification worker:', error instanceof Error ? error.message : error);
    }
  };
  const timer = setInterval(() => {
    running = running.then(round);
  }, intervalMs);
  return {
    stop: async () => {
      clearInterval(timer);
      await running;
    },
  };
}

/** The person's latest notifications, newest first, and how many of all theirs are unread. */
export async function listNotifications(sequelize: Sequelize, user: User): Promise<{ notifications: Notification[]; unread: number }> {
  const rows = await sequelize.query<{
    id: string;
    kind: NotificationKind;
    craftId: string | null;
    title: string;
    body: string;
    actorId: string | null;
    actorName: string | null;
    createdAt: Date;
    readAt: Date | null;
  }>(
    `SELECT n.id, n.kind, n.craft_id AS "craftId", n.title, n.body, n.actor_id AS "actorId", a.name AS "actorName",
            n.created_at AS "createdAt", n.read_at AS "readAt"
     FROM notifications n LEFT JOIN users a ON a.id = n.actor_id
     WHERE n.user_id = $1 ORDER BY n.created_at DESC LIMIT 50`,
    { bind: [user.id], type: QueryTypes.SELECT },
  );
  const [count] = await sequelize.query<{ unread: number }>(
    'SELECT count(*)::int AS unread FROM notifications WHERE user_id = $1 AND read_at IS NULL',
    { bind: [user.id], type: QueryTypes.SELECT },
  );
  return {
    notifications: rows.map((row) => ({
      id: row.id,
      kind: row.kind,
      craftId: row.craftId,
      title: row.title,
      body: row.body,
      actor: row.actorId !== null && row.actorName !== null ? { id: row.actorId, name: row.actorName } : null,
      createdAt: row.createdAt.toISOString(),
      readAt: row.readAt === null ? null : row.readAt.toISOString(),
    })),
    unread: count?.unread ?? 0,
  };
}

/** Marks the person's notifications read: these ids (others' ids are ignored), or all of them. */
export async function markNotificationsRead(sequelize: Sequelize, user: User, ids: readonly string[] | undefined): Promise<void> {
  await sequelize.query(
    `UPDATE notifications SET read_at = now() WHERE user_id = $1 AND read_at IS NULL AND ($2::uuid[] IS NULL OR id = ANY ($2::uuid[]))`,
    { bind: [user.id, ids === undefined ? null : [...ids]] },
  );
}

/** Which kinds of notification the person also receives by mail. */
export async function getMailPreferences(sequelize: Sequelize, user: User): Promise<MailPreferences> {
  const rows = await sequelize.query<{ kind: NotificationKind; mail: boolean }>(
    'SELECT kind, mail FROM mail_preferences WHERE user_id = $1',
    {
      bind: [user.id],
      type: QueryTypes.SELECT,
    },
  );
  const chosen = new Map(rows.map((row) => [row.kind, row.mail]));
  const mail = Object.fromEntries(notificationKinds.map((kind) => [kind, chosen.get(kind) ?? true])) as MailPreferences['mail'];
  return { mail };
}

/** Saves which kinds of notification the person receives by mail. */
export async function setMailPreferences(sequelize: Sequelize, user: User, preferences: MailPreferences): Promise<MailPreferences> {
  await sequelize.transaction(async (transaction) => {
    for (const kind of notificationKinds) {
      await sequelize.query(
        `INSERT INTO mail_preferences (user_id, kind, mail) VALUES ($1, $2, $3)
         ON CONFLICT (user_id, kind) DO UPDATE SET mail = EXCLUDED.mail`,
        { bind: [user.id, kind, preferences.mail[kind]], transaction },
      );
    }
  });
  return preferences;
}
