/**
 * Small network helpers shared by the stand-ins' launcher: is a port free, find a free one,
 * and wait until a service answers. Plain Node; the stand-ins never import the app's code.
 */
import net from "node:net";

/** True when nothing listens on host:port (we try to bind it ourselves and let go at once). */
export function isPortFree(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once("error", (err: NodeJS.ErrnoException) => {
      if (err.code === "EADDRINUSE" || err.code === "EACCES") resolve(false);
      else reject(err);
    });
    probe.listen({ port, host, exclusive: true }, () => probe.close(() => resolve(true)));
  });
}

/**
 * A port the OS considers free right now. Only for programs that cannot report the port they
 * bound themselves (maildev); there is a small window in which another process could take it.
 */
export function findFreePort(host = "127.0.0.1"): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once("error", reject);
    probe.listen({ port: 0, host }, () => {
      const address = probe.address();
      const port = typeof address === "object" && address ? address.port : 0;
      probe.close(() => (port ? resolve(port) : reject(new Error("could not obtain a free port"))));
    });
  });
}

/** True when a TCP connection to host:port is accepted. */
export function tcpAnswers(host: string, port: number, timeoutMs = 1000): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host, port });
    const done = (ok: boolean) => {
      socket.destroy();
      resolve(ok);
    };
    socket.setTimeout(timeoutMs, () => done(false));
    socket.once("connect", () => done(true));
    socket.once("error", () => done(false));
  });
}

/** True when any HTTP response (whatever its status) comes back from url. */
export async function httpAnswers(url: string, timeoutMs = 1000): Promise<boolean> {
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(timeoutMs) });
    await res.body?.cancel();
    return true;
  } catch {
    return false;
  }
}

/** Polls check() until it returns true; rejects naming `what` after timeoutMs. */
export async function waitUntil(
  check: () => Promise<boolean>,
  what: string,
  { timeoutMs = 20_000, intervalMs = 100, abort }: { timeoutMs?: number; intervalMs?: number; abort?: () => string | undefined } = {},
): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const reason = abort?.();
    if (reason) throw new Error(`${what}: ${reason}`);
    if (await check()) return;
    if (Date.now() > deadline) throw new Error(`${what}: no answer after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}
