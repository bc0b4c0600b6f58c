import net from 'node:net';
import type http from 'node:http';
import { createHttpServer } from '@/server/http-server';

/** A server answering 200 "ok" to every request, with the given limits. */
async function serverWith(limits: { headersTimeoutMs: number; requestTimeoutMs: number; maxConnections: number }) {
  const server = createHttpServer(
    { server: limits },
    (_req, res) => res.end('ok'),
    () => false,
  );
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, port: (server.address() as net.AddressInfo).port };
}

const close = (server: http.Server) =>
  new Promise<void>((resolve) => {
    server.closeAllConnections();
    server.close(() => resolve());
  });

/** Connects, writes `text`, and resolves with everything the server sent once it closes the connection. */
function exchange(port: number, text: string): Promise<{ answer: string; afterMs: number }> {
  return new Promise((resolve, reject) => {
    const start = Date.now();
    const socket = net.connect(port, '127.0.0.1', () => socket.write(text));
    let answer = '';
    socket.on('data', (chunk) => (answer += chunk.toString()));
    socket.on('error', reject);
    socket.on('close', () => resolve({ answer, afterMs: Date.now() - start }));
  });
}

describe('the HTTP server', () => {
  it('answers 408 and hangs up on a client that never finishes its headers', async () => {
    const { server, port } = await serverWith({ headersTimeoutMs: 400, requestTimeoutMs: 800, maxConnections: 10 });
    try {
      const { answer, afterMs } = await exchange(port, 'GET / HTTP/1.1\r\nHost: x\r\nX-Slow: ');
      expect(answer).toMatch(/^HTTP\/1\.1 408/);
      expect(afterMs).toBeLessThan(5_000);
    } finally {
      await close(server);
    }
  });

  it('answers 408 and hangs up on a body that never arrives in full', async () => {
    const { server, port } = await serverWith({ headersTimeoutMs: 400, requestTimeoutMs: 800, maxConnections: 10 });
    try {
      const { answer } = await exchange(port, 'POST / HTTP/1.1\r\nHost: x\r\nContent-Length: 100\r\n\r\nonly a little');
      // The app answers as soon as it is called; what matters is that the connection does not stay open.
      expect(answer).toMatch(/^HTTP\/1\.1 (200|408)/);
    } finally {
      await close(server);
    }
  });

  it('closes connections beyond its limit on arrival and serves those within it', async () => {
    const { server, port } = await serverWith({ headersTimeoutMs: 10_000, requestTimeoutMs: 20_000, maxConnections: 1 });
    const held = net.connect(port, '127.0.0.1');
    try {
      await new Promise<void>((resolve) => held.once('connect', () => resolve()));
      await new Promise((resolve) => setTimeout(resolve, 100));
      const refused = await exchange(port, 'GET / HTTP/1.1\r\nHost: x\r\n\r\n');
      expect(refused.answer).toBe('');
      held.destroy();
      await new Promise((resolve) => setTimeout(resolve, 100));
      const served = await exchange(port, 'GET / HTTP/1.1\r\nHost: x\r\nConnection: close\r\n\r\n');
      expect(served.answer).toMatch(/^HTTP\/1\.1 200/);
    } finally {
      held.destroy();
      await close(server);
    }
  });
});
