import { POST as pushRoute } from "@/app/api/sync/push/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { GET as photoGet, PUT as photoPut } from "@/app/api/photos/[sha256]/route";
import { PROTOCOL_VERSION } from "@/lib/sync/protocol";
import { withUser, type TestUser } from "./auth-session";

export * from "./sync-fixtures";

export async function push(user: TestUser | null, body: unknown, raw?: string): Promise<{ status: number; body: any }> {
  const req = new Request("http://test/api/sync/push", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: raw ?? JSON.stringify(body),
  });
  const res = await withUser(user, () => pushRoute(req, undefined));
  return { status: res.status, body: await res.json() };
}

export async function pull(user: TestUser | null, params: Record<string, string | number>): Promise<{ status: number; body: any }> {
  const q = new URLSearchParams({ v: String(PROTOCOL_VERSION), ...Object.fromEntries(Object.entries(params).map(([k, v]) => [k, String(v)])) });
  const res = await withUser(user, () => pullRoute(new Request(`http://test/api/sync/pull?${q}`), undefined));
  return { status: res.status, body: await res.json() };
}

export async function putPhoto(user: TestUser | null, sha256: string, bytes: Uint8Array, headers: Record<string, string> = {}) {
  const req = new Request(`http://test/api/photos/${sha256}`, { method: "PUT", body: new Uint8Array(bytes), headers });
  const res = await withUser(user, () => photoPut(req, { params: Promise.resolve({ sha256 }) }));
  return { status: res.status, body: await res.json() };
}

export async function getPhoto(user: TestUser | null, sha256: string) {
  const res = await withUser(user, () => photoGet(new Request(`http://test/api/photos/${sha256}`), { params: Promise.resolve({ sha256 }) }));
  return res;
}

