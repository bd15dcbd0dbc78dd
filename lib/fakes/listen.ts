import type { Server } from "node:net";
import type { AddressInfo } from "node:net";

/**
 * Starts a fake's server on `port` (0: any free port) and host, and gives the port it got;
 * an error while binding (the port is taken) rejects instead of crashing the process.
 */
export async function listenOn(server: Pick<Server, "once" | "off" | "listen" | "address">, port: number, host: string): Promise<number> {
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
  return (server.address() as AddressInfo).port;
}
