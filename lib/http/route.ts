import "server-only";
import { NextResponse } from "next/server";
import { AppError, toErrorBody } from "./errors";
import type { z } from "zod";

type Handler<C> = (req: Request, ctx: C) => Promise<Response> | Response;

/**
 * Wraps a route handler: whatever it throws leaves as the one error shape.
 * Errors other than AppError and ZodError are logged: a 500 is a bug.
 */
export function route<C = unknown>(handler: Handler<C>): Handler<C> {
  return async (req, ctx) => {
    try {
      return await handler(req, ctx);
    } catch (err) {
      if (isNextControlFlow(err)) throw err;
      const { status, body, headers } = toErrorBody(err);
      if (status === 500) console.error("[api] unhandled error", req.method, new URL(req.url).pathname, err);
      return NextResponse.json(body, { status, headers });
    }
  };
}

/** Reads a JSON body and validates it; bad JSON is a validation error, never a 500. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  let raw: unknown;
  try {
    raw = await req.json();
  } catch {
    throw new AppError("validation", "The request body is not valid JSON.");
  }
  return schema.parse(raw);
}

/** Validates URL search parameters against a schema. */
export function readQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const params = Object.fromEntries(new URL(req.url).searchParams.entries());
  return schema.parse(params);
}

function isNextControlFlow(err: unknown): boolean {
  // redirect(), notFound(), forbidden() throw errors carrying a digest Next handles itself.
  const digest = (err as { digest?: unknown } | null)?.digest;
  return typeof digest === "string" && (digest.startsWith("NEXT_") || digest.startsWith("NEXT_HTTP_ERROR_FALLBACK"));
}
