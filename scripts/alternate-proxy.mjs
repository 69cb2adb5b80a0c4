// The end-to-end run's front door when two API processes share one database: each request
// goes to the next process in turn (round robin), so a browser session signs in on one
// process and carries on on the other. Every answer names the process that gave it in an
// `X-Served-By` header (test infrastructure only; the app never sends it). Loopback only.
// usage: node scripts/alternate-proxy.mjs LISTEN_PORT NAME=PORT NAME=PORT …
import http from 'node:http';

const [listenPort, ...specs] = process.argv.slice(2);
const targets = specs.map((spec) => {
  const [name, port] = spec.split('=');
  return { name, port: Number(port) };
});
if (!listenPort || targets.length === 0 || targets.some((t) => !t.name || !t.port)) {
  process.stderr.write('usage: alternate-proxy.mjs LISTEN_PORT NAME=PORT [NAME=PORT …]\n');
  process.exit(2);
}

const agent = new http.Agent({ keepAlive: true });
let next = 0;

const server = http.createServer((req, res) => {
  const target = targets[next];
  next = (next + 1) % targets.length;
  const upstream = http.request(
    {
      host: '127.0.0.1',
      port: target.port,
      method: req.method,
      path: req.url,
      headers: req.headers,
      agent,
    },
    (answer) => {
      res.writeHead(answer.statusCode ?? 502, { ...answer.headers, 'x-served-by': target.name });
      answer.pipe(res);
    },
  );
  upstream.on('error', (error) => {
    if (!res.headersSent) res.writeHead(502, { 'content-type': 'text/plain' });
    res.end(`proxy: ${target.name} did not answer (${error.message})`);
  });
  req.pipe(upstream);
});

server.listen(Number(listenPort), '127.0.0.1', () => {
  process.stdout.write(
    `[basinwright] alternating between ${targets.map((t) => `${t.name} (:${t.port})`).join(' and ')} on 127.0.0.1:${listenPort}\n`,
  );
});
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    server.close();
    agent.destroy();
    process.exit(0);
  });
}
