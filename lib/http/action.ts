import "server-only";
import type { z } from "zod";
import { requireUser, type CurrentUser } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { toErrorBody, zodFields } from "./errors";

/** What a form's server action answers; `values` echoes what was typed so nothing is lost on an error. */
export interface FormState {
  ok?: boolean;
  message?: string;
  fields?: Record<string, string>;
  values?: Record<string, string | string[]>;
}

/** FormData -> plain object; a name given more than once becomes an array. Files are left out. */
export function formValues(formData: FormData): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const key of new Set(formData.keys())) {
    if (key.startsWith("$ACTION")) continue;
    const all = formData.getAll(key).filter((v): v is string => typeof v === "string");
    if (all.length === 1 && !key.endsWith("[]")) out[key] = all[0]!;
    else out[key.replace(/\[\]$/, "")] = all;
  }
  return out;
}

/**
 * A server action for a form: the access guard, then zod, then the work.
 * Any error comes back in the one error shape's words, beside the fields it names.
 */
export function formAction<S extends z.ZodType>(
  roles: Role[],
  schema: S,
  work: (data: z.infer<S>, user: CurrentUser) => Promise<string | void>,
) {
  return async (_prev: FormState, formData: FormData): Promise<FormState> => {
    const values = formValues(formData);
    try {
      const user = await requireUser(...roles);
      const parsed = schema.safeParse(values);
      if (!parsed.success) {
        return { ok: false, message: "Some fields need attention.", fields: zodFields(parsed.error), values };
      }
      const message = await work(parsed.data, user);
      return { ok: true, message: message ?? "Saved." };
    } catch (err) {
      const digest = (err as { digest?: unknown } | null)?.digest;
      if (typeof digest === "string" && digest.startsWith("NEXT_")) throw err;
      const { status, body } = toErrorBody(err);
      if (status === 500) console.error("[action] unhandled error", err);
      return { ok: false, message: body.error.message, fields: body.error.fields, values };
    }
  };
}
