// A relay in front of the tests' payment fake: a real HTTP hop the tests can cut (a real outage for
// every process that talks to Stripe through it) or use to run a fault at an exact moment of a call.
import http from 'node:http';
import type { Socket } from 'node:net';

export interface StripeRelay {
  /** Point STRIPE_API_URL here. */
  url: string;
  /** Every connection, open or new, is dropped until `restore`. */
  cut(): void;
  restore(): void;
  /**
   * Once: when the fake has answered the next request `matches` accepts, runs `fault` before the
   * answer goes back to the caller (so the call succeeded at Stripe, and the caller learns it after).
   */
  afterNextAnswer(matches: (method: string, path: string) => boolean, fault: (answer: Buffer) => void | Promise<void>): void;
  close(): Promise<void>;
}

const hopByHop = new Set(['connection', 'keep-alive', 'transfer-encoding', 'content-length']);

export async function startStripeRelay(target: string): Promise<StripeRelay> {
  const upstream = new URL(target);
  const sockets = new Set<Socket>();
  let down = false;
  let pending: { matches: (method: string, path: string) => boolean; fault: (answer: Buffer) => void | Promise<void> } | undefined;

  const server = http.createServer((req, res) => {
    if (down) return void req.socket.destroy();
    const sent: Buffer[] = [];
    req.on('data', (chunk: Buffer) => sent.push(chunk));
    req.on('end', () => {
      const forward = http.request(
        { host: upstream.hostname, port: upstream.port, method: req.method, path: req.url, headers: { ...req.headers, host: upstream.host } },
        (answer) => {
          const received: Buffer[] = [];
          answer.on('data', (chunk: Buffer) => received.push(chunk));
          answer.on('end', () => {
            const body = Buffer.concat(received);
            const hook = pending?.matches(req.method ?? '', req.url ?? '') ? pending : undefined;
            if (hook) pending = undefined;
            void Promise.resolve(hook?.fault(body)).then(() => {
              if (down) return void req.socket.destroy();
              const headers = Object.fromEntries(Object.entries(answer.headers).filter(([name]) => !hopByHop.has(name)));
              res.writeHead(answer.statusCode ?? 502, { ...headers, 'content-length': body.length });
              res.end(body);
            });
          });
        },
      );
      forward.on('error', () => req.socket.destroy());
      forward.end(Buffer.concat(sent));
    });
  });
  server.on('connection', (socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;

  return {
    url: `http://127.0.0.1:${port}`,
    cut() {
      down = true;
      for (const socket of sockets) socket.destroy();
    },
    restore() {
      down = false;
    },
    afterNextAnswer(matches, fault) {
      pending = { matches, fault };
    },
    close() {
      for (const socket of sockets) socket.destroy();
      return new Promise((resolve) => server.close(() => resolve()));
    },
  };
}
