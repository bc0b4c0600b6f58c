import { Client } from 'pg';
import type { Transaction, Sequelize } from 'sequelize';
import { z } from 'zod';
import { sheetEventSchema, type SheetEvent } from '@/shared/schemas/revisions';

/** The PostgreSQL channel sheet changes are announced on. */
const CHANNEL = 'trimsheet_sheet_events';
/** NOTIFY payloads are limited to 8000 bytes; a larger announcement drops its keys ("refetch everything"). */
const MAX_PAYLOAD = 7500;
const RECONNECT_MS = 1000;

/**
 * What travels through NOTIFY: the public event plus each changed key's subsystem, so that a partner's
 * stream names only the rows shared with them. The subsystem map never leaves the server.
 */
const announcementSchema = z.object({ event: sheetEventSchema, subsystemOf: z.record(z.string(), z.string()) });
type Announcement = z.infer<typeof announcementSchema>;

/** A listener of one craft's events; `visibleSubsystems` undefined means the whole sheet. */
export interface SheetEventSubscriber {
  craftId: string;
  visibleSubsystems: ReadonlySet<string> | undefined;
  send(event: SheetEvent): void;
  /** Called when the hub closes (shutdown): end the stream. */
  end(): void;
}

/** One API process's listener of sheet events, shared by every open stream of that process. */
export interface SheetEvents {
  subscribe(subscriber: SheetEventSubscriber): () => void;
  /** Resolves once LISTEN is in place (tests wait for it before writing). */
  ready(): Promise<void>;
  close(): Promise<void>;
}

/**
 * Announces a change inside the write's transaction: PostgreSQL delivers it at commit, to every API process
 * listening, and never for a write that rolls back.
 */
export async function announce(
  sequelize: Sequelize,
  transaction: Transaction,
  event: SheetEvent,
  subsystemOf: Readonly<Record<string, string>> = {},
): Promise<void> {
  let payload = JSON.stringify({ event, subsystemOf } satisfies Announcement);
  if (payload.length > MAX_PAYLOAD) payload = JSON.stringify({ event: { ...event, keys: [] }, subsystemOf: {} } satisfies Announcement);
  await sequelize.query('SELECT pg_notify($1, $2)', { bind: [CHANNEL, payload], transaction });
}

/** What a subscriber may learn of the event: partners hear only the keys of rows shared with them. */
function eventFor(subscriber: SheetEventSubscriber, { event, subsystemOf }: Announcement): SheetEvent {
  const visible = subscriber.visibleSubsystems;
  if (visible === undefined) return event;
  return { ...event, keys: event.keys.filter((key) => visible.has(subsystemOf[key] ?? '')) };
}

/**
 * Listens on a dedicated `pg` client (a pooled connection would be handed to other queries), reconnecting
 * after an error, and fans each announcement out to the subscribers of its craft.
 */
export function createSheetEvents(databaseUrl: string): SheetEvents {
  const subscribers = new Set<SheetEventSubscriber>();
  let client: Client | undefined;
  let closed = false;
  let reconnectTimer: ReturnType<typeof setTimeout> | undefined;
  let markReady: () => void = () => undefined;
  let listening = new Promise<void>((resolve) => (markReady = resolve));

  const deliver = (payload: string | undefined) => {
    let data: unknown;
    try {
      data = JSON.parse(payload ?? '');
    } catch {
      return;
    }
    const parsed = announcementSchema.safeParse(data);
    if (!parsed.success) return;
    for (const subscriber of subscribers) {
      if (subscriber.craftId === parsed.data.event.craftId) subscriber.send(eventFor(subscriber, parsed.data));
    }
  };

  const connect = async () => {
    const next = new Client({ connectionString: databaseUrl });
    client = next;
    next.on('notification', (message) => deliver(message.payload));
    next.on('error', () => retry(next));
    next.on('end', () => retry(next));
    try {
      await next.connect();
      await next.query(`LISTEN ${CHANNEL}`);
      markReady();
    } catch {
      retry(next);
    }
  };

  const retry = (failed: Client) => {
    if (closed || client !== failed) return;
    client = undefined;
    failed.end().catch(() => undefined);
    listening = new Promise<void>((resolve) => (markReady = resolve));
    reconnectTimer = setTimeout(() => void connect(), RECONNECT_MS);
  };

  void connect();

  return {
    subscribe(subscriber) {
      subscribers.add(subscriber);
      return () => subscribers.delete(subscriber);
    },
    ready: () => listening,
    async close() {
      closed = true;
      clearTimeout(reconnectTimer);
      for (const subscriber of subscribers) subscriber.end();
      subscribers.clear();
      await client?.end().catch(() => undefined);
    },
  };
}
