# Port helpers. Sourced by ./tools/start and ./tools/test.

# free_ports N: prints N distinct free loopback ports, one a line. They are held open together
# while being chosen, so they differ from each other; another program could still take one
# before we bind it, which the wait-for-ready checks then report.
free_ports() {
  node -e '
    const net = require("node:net");
    const n = Number(process.argv[1]);
    const servers = [];
    const next = () => {
      if (servers.length === n) {
        console.log(servers.map((s) => s.address().port).join("\n"));
        servers.forEach((s) => s.close());
        return;
      }
      const s = net.createServer();
      s.listen(0, "127.0.0.1", () => { servers.push(s); next(); });
    };
    next();
  ' "$1"
}

port_in_use() {
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

require_free_port() {
  local port="$1" what="$2"
  if port_in_use "$port"; then
    die "port $port ($what) is already in use on 127.0.0.1 — is another ./tools/start running?"
  fi
}
