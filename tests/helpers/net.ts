// Ports for tests that start their own servers next to the shared stand-ins.
import { createServer, type Server } from "node:net";

/** Listens on 127.0.0.1:`port` (0: a port the kernel picks). */
export function listenOn(port: number): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve(server));
  });
}

/** A TCP port nobody listens on right now. */
export async function freePort(): Promise<number> {
  const server = await listenOn(0);
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return port;
}
