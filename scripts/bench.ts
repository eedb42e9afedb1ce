// `npm run bench`: prints latency figures for the main reads and the cost of the shared
// computations. Needs the demo database (run `npm start` once, or `npm run db:migrate && npm run db:seed`).
// Figures only; nothing here passes or fails.
import { performance } from 'node:perf_hooks';
import type { AddressInfo } from 'node:net';
import { createApp } from '../server/app';
import { createSequelize } from '../server/db';
import { initModels } from '../server/models';
import { computeImpact } from '../shared/domain/impact';
import { startDatabase } from './stack';

function stats(ms: number[]) {
  const s = [...ms].sort((a, b) => a - b);
  const at = (p: number) => s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))]!;
  return `p50 ${at(50).toFixed(1)} ms · p95 ${at(95).toFixed(1)} ms · max ${s[s.length - 1]!.toFixed(1)} ms · ${(1000 / (s.reduce((a, b) => a + b, 0) / s.length)).toFixed(0)} req/s sequential`;
}

async function timeGet(base: string, path: string, cookie: string, n = 200) {
  const ms: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = performance.now();
    const r = await fetch(base + path, { headers: { cookie } });
    await r.arrayBuffer();
    if (!r.ok) throw new Error(`${path}: HTTP ${r.status}`);
    ms.push(performance.now() - t);
  }
  console.log(`GET ${path.replace(/[0-9a-f-]{36}/, ":id").padEnd(28)} ${stats(ms)}`);
}

function benchImpact() {
  // A family tool with 40 parts, 200 products and 800 bill lines; 20 cut items.
  const tool = { id: 't', code: 'KB-T-9999', currentRevision: 3 };
  const parts = Array.from({ length: 40 }, (_, i) => ({ id: `p${i}`, toolId: 't', name: `Part ${i}` }));
  const products = Array.from({ length: 200 }, (_, i) => ({ id: `x${i}`, sku: `SKU-${i}`, name: `Product ${i}`, status: 'in_line' as const, plannedUnits: 1000 }));
  const billOfParts = products.flatMap((p, i) => [0, 1, 2, 3].map((k) => ({ productId: p.id, partId: `p${(i + k * 7) % 40}`, toolId: 't', revision: 3, quantityPerUnit: 1 })));
  const items = Array.from({ length: 20 }, (_, i) => ({ partId: `p${i * 2}`, effect: 'gains_plastic' as const, method: 'cut' as const }));
  const ms: number[] = [];
  for (let i = 0; i < 300; i++) {
    const t = performance.now();
    computeImpact({ tool, parts, products, billOfParts, items, movedProductIds: [] });
    ms.push(performance.now() - t);
  }
  console.log(`computeImpact (40 parts, 200 products, 20 items)  ${stats(ms).split(' · ').slice(0, 3).join(' · ')}`);
}

async function main() {
  startDatabase();
  const sequelize = createSequelize();
  initModels(sequelize);
  const app = createApp({ sequelize, logLevel: 'silent', signInLimitPerIp: 10_000 });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@kestrelbay.example', password: 'toolgate-demo' }),
  });
  if (!signIn.ok) throw new Error('sign-in failed: is the demo data seeded? (npm run db:migrate && npm run db:seed)');
  const cookie = `tg_session=${((await signIn.json()) as { token: string }).token}`;
  const firstTool = ((await (await fetch(`${base}/api/tools?limit=1`, { headers: { cookie } })).json()) as { data: { id: string }[] }).data[0];
  const firstRequest = ((await (await fetch(`${base}/api/requests?limit=1`, { headers: { cookie } })).json()) as { data: { id: string }[] }).data[0];

  console.log(`Toolgate benchmarks (${new Date().toISOString()}, Node ${process.version})`);
  await timeGet(base, '/api/me', cookie);
  await timeGet(base, '/api/tools?limit=25', cookie);
  await timeGet(base, '/api/tools?q=head', cookie);
  if (firstTool) await timeGet(base, `/api/tools/${firstTool.id}`, cookie);
  await timeGet(base, '/api/requests?limit=25', cookie);
  if (firstRequest) await timeGet(base, `/api/requests/${firstRequest.id}`, cookie);
  benchImpact();
  server.close();
  await sequelize.close();
}

main().catch((err: Error) => {
  console.error(err.message);
  process.exit(1);
});
