"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/client";
import { requireUser } from "@/lib/auth/guard";
import { takeIn, type IntakeResult } from "@/lib/counter/intake";
import { toErrorBody } from "@/lib/http/errors";

/** The intake form's submit: guard, then the same schema as the browser, then one transaction. */
export async function takeInAction(values: unknown): Promise<IntakeResult> {
  try {
    const user = await requireUser("counter", "owner");
    const result = takeIn(getDb(), values, user.id);
    if (result.ok) revalidatePath("/counter");
    return result;
  } catch (err) {
    const { status, body } = toErrorBody(err);
    if (status === 500) console.error("[intake] unhandled error", err);
    return { ok: false, message: body.error.message, fields: body.error.fields ?? {} };
  }
}
