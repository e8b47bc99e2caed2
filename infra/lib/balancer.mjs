// A small HTTP balancer for `npm run cluster`: one address on loopback in front of several API processes.
// It asks each API's readiness route (`/api/health`) every `checkMs` and sends requests, in turn, only to
// those that answer 200; a request that cannot reach any gets a 503 with Retry-After, as a managed load
// balancer would answer. It never retries a request itself: a write's outcome is unknown once sent, so the
// client retries with its own idempotency key (Roundbook's creates take one).
import http from 'node:http';
import httpProxy from 'http-proxy';

export function startBalancer({ port, host = '127.0.0.1', targets, checkMs = 500 }) {
  const state = targets.map((url) => ({ url, ready: false, sent: 0 }));
  const proxy = httpProxy.createProxyServer({ xfwd: true, proxyTimeout: 30000 });
  let next = 0;

  const unavailable = (res, why) => {
    if (res.headersSent) return res.destroy();
    res.writeHead(503, { 'content-type': 'application/json', 'retry-after': '1' });
    res.end(
      JSON.stringify({
        statusCode: 503,
        code: 'service_unavailable',
        message: `Roundbook is briefly unavailable (${why}); try again in a moment.`,
      }),
    );
  };
  proxy.on('error', (_err, _req, res, target) => {
    const t = state.find((s) => target && String(target.href ?? target).startsWith(s.url));
    if (t) t.ready = false; // until its next readiness check says otherwise
    if (res && typeof res.writeHead === 'function') unavailable(res, 'an API process did not answer');
    else res?.destroy?.();
  });

  const check = async () => {
    await Promise.all(
      state.map(async (t) => {
        try {
          const r = await fetch(`${t.url}/api/health`, { signal: AbortSignal.timeout(2000) });
          t.ready = r.ok;
          await r.arrayBuffer();
        } catch {
          t.ready = false;
        }
      }),
    );
  };
  const timer = setInterval(() => void check(), checkMs);

  const server = http.createServer((req, res) => {
    const ready = state.filter((s) => s.ready);
    if (ready.length === 0) return unavailable(res, 'no API process is ready');
    const t = ready[next++ % ready.length];
    t.sent++;
    proxy.web(req, res, { target: t.url });
  });

  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, async () => {
      await check();
      resolve({
        url: `http://${host}:${port}`,
        state,
        close: () =>
          new Promise((r) => {
            clearInterval(timer);
            proxy.close();
            server.closeAllConnections?.();
            server.close(() => r());
          }),
      });
    });
  });
}
