import type { Response } from 'express';
import { mayOnCraft } from '@/shared/access/permissions';
import type { SheetEvent } from '@/shared/schemas/revisions';
import type { User } from '../models';
import { authorizeCraft } from './craft-access';
import type { SheetEvents } from './sheet-events';

/** A comment line every so often keeps proxies and browsers from closing an idle stream. */
const HEARTBEAT_MS = 15_000;

/**
 * Streams the craft's sheet events to one person as server-sent events (one `data:` line of SheetEvent
 * JSON each) until they disconnect or the server shuts down. Checked once, when the stream opens.
 */
export async function streamSheetEvents(events: SheetEvents, user: User, craftId: string, res: Response): Promise<void> {
  const access = await authorizeCraft(user, craftId, 'viewCraft');
  res.writeHead(200, {
    'Content-Type': 'text/event-stream; charset=utf-8',
    'Cache-Control': 'no-cache, no-transform',
    Connection: 'keep-alive',
    // Proxies such as nginx must pass each event on at once instead of buffering the response.
    'X-Accel-Buffering': 'no',
  });
  res.write('retry: 3000\n: connected\n\n');
  const heartbeat = setInterval(() => res.write(': heartbeat\n\n'), HEARTBEAT_MS);
  const unsubscribe = events.subscribe({
    craftId,
    visibleSubsystems: mayOnCraft('viewWholeSheet', access) ? undefined : new Set(access.subsystemIds),
    send: (event: SheetEvent) => res.write(`data: ${JSON.stringify(event)}\n\n`),
    end: () => res.end(),
  });
  res.on('close', () => {
    clearInterval(heartbeat);
    unsubscribe();
  });
}
