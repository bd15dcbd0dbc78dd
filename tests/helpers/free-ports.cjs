// Free TCP ports for servers a test run starts, chosen *below* the kernel's ephemeral range.
//
// A port that the kernel hands out with listen(0) comes from the ephemeral range, the same
// range every outgoing connection takes its local port from. Between choosing it and the
// server binding it, a client socket (a database connection, a browser) can take it, and the
// server then fails with EADDRINUSE. Ports below that range are never given to clients, so a
// port checked free here stays free until the server binds it.
//
//   node tests/helpers/free-ports.cjs 6      prints six free ports, space-separated
//   require("./free-ports.cjs").freePorts(6) resolves to the same, as numbers
const fs = require("node:fs");
const net = require("node:net");

function ephemeralRange() {
  try {
    const [lo, hi] = fs.readFileSync("/proc/sys/net/ipv4/ip_local_port_range", "utf8").trim().split(/\s+/).map(Number);
    if (lo > 0 && hi >= lo) return [lo, hi];
  } catch {
    // Not Linux: the range IANA suggests.
  }
  return [49152, 65535];
}

/** Whether a server can bind `port` on every address, as `next start` does, and on loopback. */
function canBind(port, host) {
  return new Promise((resolve) => {
    const s = net.createServer();
    s.once("error", () => resolve(false));
    s.listen({ port, host, exclusive: true }, () => s.close(() => resolve(true)));
  });
}

async function freePorts(count) {
  const [lo] = ephemeralRange();
  const floor = 20000;
  const ceiling = lo > floor + 1000 ? lo - 1 : 65535;
  const picked = new Set();
  for (let tries = 0; picked.size < count; tries++) {
    if (tries > 5000) throw new Error(`no ${count} free ports between ${floor} and ${ceiling}`);
    const port = floor + Math.floor(Math.random() * (ceiling - floor + 1));
    if (picked.has(port)) continue;
    if ((await canBind(port, "127.0.0.1")) && (await canBind(port, undefined))) picked.add(port);
  }
  return [...picked];
}

module.exports = { freePorts, freePort: async () => (await freePorts(1))[0] };

if (require.main === module) {
  freePorts(Number(process.argv[2] ?? 1)).then(
    (ports) => console.log(ports.join(" ")),
    (err) => {
      console.error(err.message);
      process.exit(1);
    },
  );
}
