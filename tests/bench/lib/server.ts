/**
 * For the browser benchmarks: serve the current production build with a fresh demo shop in tests/.tmp, and sign
 * in through next-auth's own endpoints.
 */
import { spawn, type ChildProcess } from "node:child_process";

export const DEMO_PASSWORD = "benchwright-demo";
export const LOGINS = {
  tech: "tech@demo.benchwright.test",
  counter: "counter@demo.benchwright.test",
  owner: "owner@demo.benchwright.test",
} as const;
export type Role = keyof typeof LOGINS;

/** Starts scripts/e2e-server.ts (the build is reused: call buildIfNeeded() first) and waits for /api/health. */
export async function startServer(port: number, dataDir: string): Promise<ChildProcess> {
  const base = `http://localhost:${port}`;
  const server = spawn("npx", ["tsx", "scripts/e2e-server.ts"], {
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
    env: {
      ...process.env,
      PORT: String(port),
      DATA_DIR: dataDir,
      AUTH_SECRET: "bench-only-secret-not-for-production-0123456789",
      SKIP_BUILD: "1",
      BCRYPT_COST: "8",
    },
  });
  let output = "";
  server.stdout?.on("data", (d) => (output += d));
  server.stderr?.on("data", (d) => (output += d));
  for (let i = 0; i < 240; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return server;
    } catch {
      // not up yet
    }
    if (server.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 500));
  }
  stopServer(server);
  throw new Error(`the server on ${base} did not start:\n${output}`);
}

export function stopServer(server: ChildProcess) {
  // Our own process group only (started detached above).
  if (server.pid) {
    try {
      process.kill(-server.pid, "SIGTERM");
    } catch {
      // already gone
    }
  }
}

/** Signs in through next-auth's own endpoints and returns the session cookie. */
export async function sessionCookie(base: string, role: Role): Promise<{ name: string; value: string }> {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const jar = csrfRes.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar },
    body: new URLSearchParams({ csrfToken, email: LOGINS[role], password: DEMO_PASSWORD }),
  });
  const session = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0]!)
    .find((c) => /session-token=/.test(c));
  if (!session) throw new Error(`could not sign in as ${role} (status ${res.status})`);
  const eq = session.indexOf("=");
  return { name: session.slice(0, eq), value: session.slice(eq + 1) };
}

export const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
};

/** The p-th percentile (nearest rank). */
export const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))]!;
};
