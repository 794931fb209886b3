/**
 * A random UUID (version 4, RFC 9562 §5.4). `crypto.randomUUID` exists only in secure contexts
 * (https or localhost); a shop that opens the app at http://192.168.x.x still gets ids from
 * `crypto.getRandomValues`, which every context has.
 */
export function uuid(): string {
  const c = globalThis.crypto;
  if (typeof c?.randomUUID === "function") return c.randomUUID();
  const b = c.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}
