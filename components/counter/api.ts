"use client";

/** An API answer in the one error shape, thrown so TanStack Query and forms can show its words. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

export async function apiJson<T>(url: string, init?: RequestInit): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { ...init, headers: { "content-type": "application/json", ...init?.headers }, cache: "no-store" });
  } catch {
    throw new ApiError(0, "offline", "The server cannot be reached. Check the network; nothing was changed.");
  }
  const body = (await res.json().catch(() => null)) as { error?: { code: string; message: string; fields?: Record<string, string> } } | null;
  if (!res.ok) {
    const e = body?.error;
    throw new ApiError(res.status, e?.code ?? "internal", e?.message ?? `The server answered ${res.status}.`, e?.fields);
  }
  return body as T;
}

export const postJson = <T,>(url: string, data: unknown) => apiJson<T>(url, { method: "POST", body: JSON.stringify(data) });
