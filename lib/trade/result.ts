/**
 * Result type for inputs a person can get wrong. User errors never throw:
 * they come back as `{ ok: false, message }` so the caller can show the message
 * next to the field and keep everything already entered.
 */
export type Ok<T> = { ok: true; value: T };
export type Err = { ok: false; message: string };
export type Result<T> = Ok<T> | Err;

export const ok = <T>(value: T): Ok<T> => ({ ok: true, value });
export const err = (message: string): Err => ({ ok: false, message });
