import autocannon from 'autocannon';
import { quantile } from './statistics';

/** The anonymous senders of the hostile-body benchmark, and how long they send. */
const SENDERS = { connections: 4, duration: 10 } as const;

/** A 1 MB JSON body nested as deep as it goes: `[[[…]]]`, what costs a JSON parser the most per byte. */
const deeplyNested = (bytes: number) => '['.repeat(bytes / 2) + ']'.repeat(bytes / 2);

/** Medians of GET /api/health, one request at a time, for as long as `running` says. */
async function healthMedian(appUrl: string, running: () => boolean): Promise<number> {
  const samples: number[] = [];
  do {
    const start = performance.now();
    const response = await fetch(`${appUrl}/api/health`);
    await response.arrayBuffer();
    if (!response.ok) throw new Error(`GET /api/health: ${response.status}`);
    samples.push(performance.now() - start);
    await new Promise((resolve) => setTimeout(resolve, 10));
  } while (running());
  return quantile(samples, 0.5);
}

/**
 * What anonymous senders of big, deeply nested JSON bodies cost everyone else: the health check's median alone
 * (200 requests), then while four connections post 1 MB nested arrays to `POST /api/crafts` without signing in
 * for 10 s. A server that reads bodies only after sign-in is checked refuses them without parsing a byte.
 */
export async function benchHealthUnderHostileBodies(appUrl: string): Promise<{ alone: number; underAttack: number; answers: string }> {
  let quietSamples = 0;
  const alone = await healthMedian(appUrl, () => (quietSamples += 1) < 200);
  let attacking = true;
  // autocannon's answer is a thenable without finally: make it a promise.
  const attack = Promise.resolve(
    autocannon({
      url: `${appUrl}/api/crafts`,
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: deeplyNested(1 << 20),
      connections: SENDERS.connections,
      duration: SENDERS.duration,
    }),
  ).finally(() => {
    attacking = false;
  });
  const underAttack = await healthMedian(appUrl, () => attacking);
  const result = await attack;
  const answers = Object.entries(result.statusCodeStats ?? {})
    .map(([status, { count }]) => `${count} x ${status}`)
    .join(', ');
  return { alone, underAttack, answers: `${result.requests.total} bodies sent; answers: ${answers || 'none'}` };
}
