/**
 * npm run bench:queue — how long the queue board's API work takes with thousands of tickets, on this
 * machine. Speed targets live here, never in the tests. Run with the react-server condition so the
 * server-only data modules load in plain Node:  tsx --conditions=react-server tests/bench/queue.ts
 *
 * Prints one line per case and, last, one JSON object. Exits 1 when a target is missed.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase } from "../../db/client";
import { shopSettings, users } from "../../db/schema";
import { queuePage, queueQuerySchema } from "../../lib/counter/queue";
import { seedQueue } from "../fixtures/queue-data";

/** Target: one board page (three queries and the shaping) in at most this many ms, median. */
const TARGET_MEDIAN_MS = 50;
const RUNS = 25;
/** Worst case: 5,000 tickets nearly all open. A shop's years: 20,000 tickets of which about 1,000 are open. */
const SHAPES: Array<{ tickets: number; closedShare: number }> = [
  { tickets: 5_000, closedShare: 0.1 },
  { tickets: 20_000, closedShare: 0.95 },
];
const NOW = Date.UTC(2026, 11, 1, 21, 0);
const TECHS = ["00000000-0000-4000-9000-00000000000a", "00000000-0000-4000-9000-00000000000b"];

const CASES: Array<[string, Record<string, string>]> = [
  ["first page, default sort", {}],
  ["one status", { status: "awaiting_parts" }],
  ["tech + overdue", { tech: TECHS[0]!, overdue: "1" }],
  ["search a surname", { q: "fen" }],
  ["sort by customer, page 10", { sort: "customer", page: "10" }],
];

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

const results: Array<{ tickets: number; openShare: number; case: string; medianMs: number; maxMs: number }> = [];
let missed = 0;
for (const { tickets: n, closedShare } of SHAPES) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "benchwright-bench-"));
  const db = openDatabase(path.join(dir, "bench.sqlite"));
  db.insert(shopSettings).values({ id: 1, name: "Bench shop", timezone: "America/Chicago" }).run();
  TECHS.forEach((id, i) => db.insert(users).values({ id, email: `t${i}@bench.test`, name: `Tech ${i}`, role: "tech", passwordHash: "x" }).run());
  const seedStart = performance.now();
  seedQueue(db, { tickets: n, customers: Math.ceil(n / 8), techIds: [...TECHS, null], now: NOW, timezone: "America/Chicago", closedShare });
  db.$client.exec("analyze");
  console.log(`[bench:queue] seeded ${n} tickets (${Math.round((1 - closedShare) * 100)} % open) in ${(performance.now() - seedStart).toFixed(0)} ms`);
  // Raw yardstick on the same machine in the same run: one indexed count.
  const rawStart = performance.now();
  for (let i = 0; i < RUNS; i++) db.$client.prepare("select count(*) from tickets where status = 'on_bench'").get();
  console.log(`[bench:queue] raw indexed count: ${((performance.now() - rawStart) / RUNS).toFixed(2)} ms`);
  for (const [name, params] of CASES) {
    const q = queueQuerySchema.parse(params);
    const times: number[] = [];
    queuePage(db, q, NOW); // warm the statement cache
    for (let i = 0; i < RUNS; i++) {
      const t = performance.now();
      queuePage(db, q, NOW);
      times.push(performance.now() - t);
    }
    const m = median(times);
    if (m > TARGET_MEDIAN_MS) missed++;
    results.push({ tickets: n, openShare: 1 - closedShare, case: name, medianMs: Number(m.toFixed(2)), maxMs: Number(Math.max(...times).toFixed(2)) });
    console.log(`[bench:queue] ${String(n).padStart(6)} tickets · ${name.padEnd(28)} median ${m.toFixed(2)} ms${m > TARGET_MEDIAN_MS ? "  OVER TARGET" : ""}`);
  }
  db.$client.close();
  fs.rmSync(dir, { recursive: true, force: true });
}
console.log(JSON.stringify({ bench: "queue", targetMedianMs: TARGET_MEDIAN_MS, runs: RUNS, missed, results }));
process.exit(missed ? 1 : 0);
