// Stand-ins for a service that is down, for fault tests.
import net from "node:net";
import type { AddressInfo } from "node:net";

/** A port nothing listens on: connections are refused at once. */
export async function closedPort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((r) => s.listen(0, "127.0.0.1", r));
  const port = (s.address() as AddressInfo).port;
  await new Promise<void>((r) => s.close(() => r()));
  return port;
}

/** A server that takes connections and never says a word, as a hung service does. */
export async function startSilentServer(): Promise<{ port: number; close(): Promise<void> }> {
  const sockets: net.Socket[] = [];
  const server = net.createServer((s) => sockets.push(s));
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  return {
    port: (server.address() as AddressInfo).port,
    close: async () => {
      for (const s of sockets) s.destroy();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}
