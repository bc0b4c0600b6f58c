import http from 'node:http';
import type { Config } from './env';

/**
 * The HTTP server around the app, with the limits that keep slow or numerous clients from holding it: the
 * headers must arrive within `headersTimeoutMs` and the whole request within `requestTimeoutMs` (a slow sender
 * gets 408 and a closed connection), and at most `maxConnections` are open at once (more are closed on arrival).
 * Responses are not timed: an event stream stays open as long as its reader. Once `closing()` says so, a request
 * on a kept-alive connection gets 503 and a closed connection instead of reaching a database pool that is closing.
 */
export function createHttpServer(config: Pick<Config, 'server'>, app: http.RequestListener, closing: () => boolean): http.Server {
  const server = http.createServer(
    {
      headersTimeout: config.server.headersTimeoutMs,
      requestTimeout: config.server.requestTimeoutMs,
      // Node enforces both timeouts when it checks its connections (every 30 s by default): check often enough
      // that a slow sender is cut within a quarter of the headers' timeout of it.
      connectionsCheckingInterval: Math.min(30_000, config.server.headersTimeoutMs / 4),
    },
    (req, res) => {
      if (!closing()) return void app(req, res);
      res.writeHead(503, { Connection: 'close', 'Retry-After': '5' }).end();
    },
  );
  server.maxConnections = config.server.maxConnections;
  return server;
}
