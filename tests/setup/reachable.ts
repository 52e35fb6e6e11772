import net from "node:net";

/** True when something accepts a TCP connection at host:port within `ms` (Redis, PostgreSQL). */
export function answers(host: string, port: number, ms = 500): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host, port });
    const done = (ok: boolean) => {
      socket.destroy();
      resolve(ok);
    };
    socket.setTimeout(ms, () => done(false));
    socket.once("connect", () => done(true));
    socket.once("error", () => done(false));
  });
}
