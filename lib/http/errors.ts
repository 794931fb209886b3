import { ZodError } from "zod";

/** The one error shape every failing API answer uses. */
export const ERROR_STATUS = {
  validation: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  upgrade_required: 426,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: Record<string, string> };
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: Record<string, string>;
  readonly headers?: Record<string, string>;

  constructor(code: ErrorCode, message: string, options: { fields?: Record<string, string>; headers?: Record<string, string> } = {}) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.fields = options.fields;
    this.headers = options.headers;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

/** Field path -> first message, for showing each error beside its field. */
export function zodFields(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/** Turns anything thrown into the one error shape; unknown errors become "internal" (a bug). */
export function toErrorBody(err: unknown): { status: number; body: ErrorBody; headers?: Record<string, string> } {
  if (err instanceof AppError) {
    const body: ErrorBody = { error: { code: err.code, message: err.message } };
    if (err.fields) body.error.fields = err.fields;
    return { status: err.status, body, headers: err.headers };
  }
  if (err instanceof ZodError) {
    return {
      status: 400,
      body: { error: { code: "validation", message: "Some fields need attention.", fields: zodFields(err) } },
    };
  }
  return { status: 500, body: { error: { code: "internal", message: "Something went wrong on the server." } } };
}
