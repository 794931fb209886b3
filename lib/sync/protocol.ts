/**
 * The sync protocol between a bench device and the server: zod schemas shared by both sides.
 * Pure TypeScript (zod only): no framework, no database.
 *
 * - A device records named mutations; each carries a client-made UUID (`mutationId`) and the device's
 *   gap-free sequence number (`seq`). The args of each mutation name have their own schema below.
 * - `POST /api/sync/push` takes a batch; `GET /api/sync/pull` hands out changes since a cursor.
 * - The rows a pull hands out ("wire rows") are exactly the rows the device keeps, so a device that
 *   has pulled everything holds the same rows as the server's view of the working set.
 */
import { z } from "zod";
import { TICKET_STATUSES } from "../tickets/status";
import { ENGINE_TYPES, MACHINE_KINDS } from "../tickets/machine";

/** Bumped when the push/pull shapes change in a way an old device cannot follow. */
export const PROTOCOL_VERSION = 1;

/** Largest batch one push may carry. */
export const MAX_PUSH_BATCH = 500;
/** Default and largest page of one pull. */
export const DEFAULT_PULL_LIMIT = 500;
export const MAX_PULL_LIMIT = 2000;
/** Largest photo the server accepts. */
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
export const PHOTO_MIME_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export type PhotoMime = (typeof PHOTO_MIME_TYPES)[number];

/** Ticket statuses a bench device may set; handing a machine back is done at the counter. */
export const BENCH_STATUSES = ["on_bench", "awaiting_ok", "awaiting_parts", "in_repair", "ready"] as const;

const id = z.uuid({ message: "Must be an id made by the app (a UUID)." });
const at = z.iso.datetime({ message: "Must be a UTC time like 2026-05-01T14:30:00.000Z." });
const text = (max: number) => z.string().trim().max(max, { message: `At most ${max} characters.` });
const requiredText = (max: number, what: string) => text(max).min(1, { message: `Enter ${what}.` });

/** A step's recorded value: any JSON (choice, pass/fail, reading…), kept small. */
const stepValue = z.json().refine((v) => JSON.stringify(v).length <= 4000, { message: "The recorded value is too large." });

const partLine = z.strictObject({
  description: requiredText(200, "what the part is"),
  partNumber: text(80).optional(),
  qty: z.number().positive({ message: "Quantity must be more than 0." }).max(1000),
});

const alternative = z.strictObject({
  label: requiredText(120, "a name for this option"),
  parts: z.array(partLine).max(30),
  laborMinutes: z.number().int().min(0).max(6000),
});

const findingFields = {
  stepId: text(80).optional(),
  grade: z.enum(["cause", "due_soon", "advisory"], { message: "Choose a grade: cause, due soon or advisory." }),
  title: requiredText(160, "a short title"),
  note: text(2000),
  photoIds: z.array(id).max(20),
  suggestedParts: z.array(partLine).max(30),
  suggestedLaborMinutes: z.number().int().min(0).max(6000).optional(),
  alternatives: z.array(alternative).max(5).optional(),
};

/** One schema per mutation name. Objects are strict: an unknown field (say, a price) is refused. */
export const mutationSchemas = {
  "bench.entry.recorded": z.strictObject({
    id,
    ticketId: id,
    procedureId: requiredText(80, "the procedure"),
    procedureVersion: z.number().int().min(1),
    stepId: requiredText(80, "the step"),
    value: stepValue,
    note: text(2000).optional(),
    at,
  }),
  "bench.entry.voided": z.strictObject({ id, reason: text(300).optional(), at }),
  "finding.added": z.strictObject({ id, ticketId: id, ...findingFields, at }),
  "finding.changed": z
    .strictObject({
      id,
      grade: findingFields.grade.optional(),
      title: findingFields.title.optional(),
      note: findingFields.note.optional(),
      photoIds: findingFields.photoIds.optional(),
      suggestedParts: findingFields.suggestedParts.optional(),
      suggestedLaborMinutes: findingFields.suggestedLaborMinutes,
      alternatives: findingFields.alternatives,
      /** A finding that turned out wrong is withdrawn, never deleted. */
      withdrawn: z.boolean().optional(),
      at,
    })
    .refine((c) => Object.keys(c).some((k) => k !== "id" && k !== "at"), { message: "Change at least one field." }),
  "tune.recorded": z
    .strictObject({
      id,
      ticketId: id,
      screw: z.enum(["low", "high", "idle"], { message: "Choose a screw: low, high or idle." }),
      kind: z.enum(["baseline", "turn"]),
      direction: z.enum(["cw", "ccw"]).optional(),
      eighths: z.number().int().min(0).max(80),
      baselineKind: z.enum(["seated-then-out", "as-found"]).optional(),
      at,
    })
    .superRefine((t, ctx) => {
      if (t.kind === "turn") {
        if (!t.direction) ctx.addIssue({ code: "custom", path: ["direction"], message: "Choose a direction: in or out." });
        if (t.eighths < 1) ctx.addIssue({ code: "custom", path: ["eighths"], message: "A turn is at least ⅛." });
        if (t.baselineKind) ctx.addIssue({ code: "custom", path: ["baselineKind"], message: "Only a baseline has a baseline kind." });
      } else {
        if (!t.baselineKind) ctx.addIssue({ code: "custom", path: ["baselineKind"], message: "Say how the baseline was found." });
        if (t.direction) ctx.addIssue({ code: "custom", path: ["direction"], message: "A baseline has no direction." });
      }
    }),
  "photo.attached": z.strictObject({
    id,
    ticketId: id,
    sha256: z.string().regex(/^[0-9a-f]{64}$/, { message: "Must be the photo's SHA-256 in lower-case hex." }),
    mime: z.enum(PHOTO_MIME_TYPES, { message: "Photos must be JPEG, PNG or WebP." }),
    bytes: z.number().int().positive().max(MAX_PHOTO_BYTES, { message: "The photo is larger than 8 MB." }),
    width: z.number().int().positive().max(20000).optional(),
    height: z.number().int().positive().max(20000).optional(),
    stepId: text(80).optional(),
    findingId: id.optional(),
    caption: text(300).optional(),
    at,
  }),
  "labor.started": z.strictObject({ id, ticketId: id, startedAt: at }),
  "labor.stopped": z.strictObject({ id, endedAt: at }),
  "ticket.status_changed": z.strictObject({
    ticketId: id,
    status: z.enum(TICKET_STATUSES),
    /** The ticket header version the device saw when the change was made. */
    baseVersion: z.number().int().min(1),
    at,
  }),
  "ticket.note_added": z.strictObject({ id, ticketId: id, text: requiredText(4000, "the note"), at }),
  "parts.used": z.strictObject({
    id,
    ticketId: id,
    description: requiredText(200, "what the part is"),
    partNumber: text(80).optional(),
    qty: z.number().positive({ message: "Quantity must be more than 0." }).max(1000),
    /** Only the counter and the owner may put a price on a part. */
    unitPriceCents: z.number().int().min(0).max(10_000_000).optional(),
    at,
  }),
} as const;

export type MutationName = keyof typeof mutationSchemas;
export const MUTATION_NAMES = Object.keys(mutationSchemas) as MutationName[];
export type MutationArgs<N extends MutationName> = z.infer<(typeof mutationSchemas)[N]>;

/** The tables a device keeps and a pull hands out. */
export const ENTITIES = [
  "ticket",
  "machine",
  "customer",
  "procedure",
  "bench_entry",
  "finding",
  "tune_entry",
  "photo",
  "labor_entry",
  "ticket_note",
  "part_used",
] as const;
export type Entity = (typeof ENTITIES)[number];
/** Facts recorded against a ticket (append-only; a correction voids or supersedes, never overwrites). */
export const FACT_ENTITIES = ["bench_entry", "finding", "tune_entry", "photo", "labor_entry", "ticket_note", "part_used"] as const;
export type FactEntity = (typeof FACT_ENTITIES)[number];

/** Which row a mutation writes. Every mutation touches exactly one row. */
export const MUTATION_ENTITY: Record<MutationName, Entity> = {
  "bench.entry.recorded": "bench_entry",
  "bench.entry.voided": "bench_entry",
  "finding.added": "finding",
  "finding.changed": "finding",
  "tune.recorded": "tune_entry",
  "photo.attached": "photo",
  "labor.started": "labor_entry",
  "labor.stopped": "labor_entry",
  "ticket.status_changed": "ticket",
  "ticket.note_added": "ticket_note",
  "parts.used": "part_used",
};

/** Mutations that create a new row (their args carry the new row's client-made id). */
export const CREATING_MUTATIONS: readonly MutationName[] = [
  "bench.entry.recorded",
  "finding.added",
  "tune.recorded",
  "photo.attached",
  "labor.started",
  "ticket.note_added",
  "parts.used",
];

/** The id of the row a mutation writes. */
export function entityIdOf(name: MutationName, args: Record<string, unknown>): string {
  return String(name === "ticket.status_changed" ? args.ticketId : args.id);
}

// ---------------------------------------------------------------------------------------------
// Wire rows: what a pull hands out and what the device stores (times as ISO strings, absent = null).

const iso = z.string();
const nul = <T extends z.ZodType>(t: T) => t.nullable();

export const wireRowSchemas = {
  ticket: z.object({
    id: z.string(),
    number: z.number().int(),
    tagCode: z.string(),
    machineId: z.string(),
    customerId: z.string(),
    status: z.enum(TICKET_STATUSES),
    complaint: z.string(),
    complaintTags: z.array(z.string()),
    intakeCondition: z.object({ flags: z.array(z.string()), note: z.string() }),
    accessories: z.string(),
    promisedDate: nul(z.string()),
    approvalLimitCents: nul(z.number().int()),
    assignedTechId: nul(z.string()),
    version: z.number().int(),
    createdAt: iso,
    updatedAt: iso,
  }),
  machine: z.object({
    id: z.string(),
    customerId: nul(z.string()),
    kind: z.enum(MACHINE_KINDS),
    engineType: z.enum(ENGINE_TYPES),
    make: z.string(),
    model: z.string(),
    serial: z.string(),
    displacementCc: nul(z.number()),
    stickerCode: nul(z.string()),
    notes: z.string(),
  }),
  /** Name and phone only: a bench device never holds a customer's e-mail or the shop's notes on them. */
  customer: z.object({ id: z.string(), firstName: z.string(), lastName: z.string(), phone: z.string() }),
  procedure: z.object({ id: z.string(), machineKind: z.string(), name: z.string(), version: z.number().int(), definition: z.json() }),
  bench_entry: z.object({
    id: z.string(),
    ticketId: z.string(),
    procedureId: z.string(),
    procedureVersion: z.number().int(),
    stepId: z.string(),
    value: z.json(),
    note: nul(z.string()),
    at: iso,
    recordedBy: z.string(),
    voidedAt: nul(iso),
    voidedBy: nul(z.string()),
    voidReason: nul(z.string()),
  }),
  finding: z.object({
    id: z.string(),
    ticketId: z.string(),
    stepId: nul(z.string()),
    grade: z.enum(["cause", "due_soon", "advisory"]),
    title: z.string(),
    note: z.string(),
    photoIds: z.array(z.string()),
    suggestedParts: z.array(z.object({ description: z.string(), partNumber: nul(z.string()), qty: z.number() })),
    suggestedLaborMinutes: nul(z.number().int()),
    alternatives: nul(
      z.array(
        z.object({
          label: z.string(),
          parts: z.array(z.object({ description: z.string(), partNumber: nul(z.string()), qty: z.number() })),
          laborMinutes: z.number().int(),
        }),
      ),
    ),
    withdrawn: z.boolean(),
    createdBy: z.string(),
    at: iso,
    changedAt: nul(iso),
    changedBy: nul(z.string()),
    revision: z.number().int(),
  }),
  tune_entry: z.object({
    id: z.string(),
    ticketId: z.string(),
    screw: z.enum(["low", "high", "idle"]),
    kind: z.enum(["baseline", "turn"]),
    direction: nul(z.enum(["cw", "ccw"])),
    eighths: z.number().int(),
    baselineKind: nul(z.enum(["seated-then-out", "as-found"])),
    at: iso,
    recordedBy: z.string(),
  }),
  photo: z.object({
    id: z.string(),
    ticketId: z.string(),
    sha256: z.string(),
    mime: z.enum(PHOTO_MIME_TYPES),
    bytes: z.number().int(),
    width: nul(z.number().int()),
    height: nul(z.number().int()),
    stepId: nul(z.string()),
    findingId: nul(z.string()),
    caption: nul(z.string()),
    at: iso,
    takenBy: z.string(),
  }),
  labor_entry: z.object({ id: z.string(), ticketId: z.string(), userId: z.string(), startedAt: iso, endedAt: nul(iso) }),
  ticket_note: z.object({ id: z.string(), ticketId: z.string(), text: z.string(), at: iso, authorId: z.string() }),
  part_used: z.object({
    id: z.string(),
    ticketId: z.string(),
    description: z.string(),
    partNumber: nul(z.string()),
    qty: z.number(),
    unitPriceCents: nul(z.number().int()),
    at: iso,
    recordedBy: z.string(),
  }),
} satisfies Record<Entity, z.ZodType>;

export type WireRows = { [E in Entity]: z.infer<(typeof wireRowSchemas)[E]> };
export type TicketRow = WireRows["ticket"];
export type MachineRow = WireRows["machine"];
export type CustomerRow = WireRows["customer"];
export type ProcedureRow = WireRows["procedure"];
export type BenchEntryRow = WireRows["bench_entry"];
export type FindingRow = WireRows["finding"];
export type TuneEntryRow = WireRows["tune_entry"];
export type PhotoRow = WireRows["photo"];
export type LaborEntryRow = WireRows["labor_entry"];
export type TicketNoteRow = WireRows["ticket_note"];
export type PartUsedRow = WireRows["part_used"];

/** One change in a pull page: the row as it is now, or a tombstone (deleted, or left the working set). */
export const wireChangeSchema = z
  .object({ entity: z.enum(ENTITIES), op: z.enum(["upsert", "delete"]), id: z.string(), row: z.unknown().optional() })
  .superRefine((c, ctx) => {
    if (c.op !== "upsert") return;
    const parsed = wireRowSchemas[c.entity].safeParse(c.row);
    if (!parsed.success) ctx.addIssue({ code: "custom", path: ["row"], message: `Not a valid ${c.entity} row: ${parsed.error.issues[0]?.message}` });
    else if ((c.row as { id?: unknown }).id !== c.id) ctx.addIssue({ code: "custom", path: ["id"], message: "The row's id does not match." });
  }) as unknown as z.ZodType<WireChange>;

export type WireChange =
  | { [E in Entity]: { entity: E; op: "upsert"; id: string; row: WireRows[E] } }[Entity]
  | { entity: Entity; op: "delete"; id: string };

// ---------------------------------------------------------------------------------------------
// Push

/** What the device still holds after this batch (the counter's queue shows it as "unsynced bench work"). */
export const pendingReportSchema = z.strictObject({
  count: z.number().int().min(0),
  tickets: z.array(z.strictObject({ ticketId: z.string().max(64), changes: z.number().int().min(1) })).max(500),
});
export type PendingReport = z.infer<typeof pendingReportSchema>;

export const outboxMutationSchema = z.strictObject({
  mutationId: id,
  seq: z.number().int().min(1),
  /** Checked against the named schema one by one: an unknown name or bad args reject that mutation only. */
  name: z.string().min(1).max(60),
  args: z.record(z.string(), z.unknown()),
  at,
});
export type OutboxMutation = z.infer<typeof outboxMutationSchema>;

export const pushRequestSchema = z
  .strictObject({
    protocolVersion: z.number().int(),
    deviceId: id,
    mutations: z.array(outboxMutationSchema).max(MAX_PUSH_BATCH, { message: `At most ${MAX_PUSH_BATCH} changes in one push.` }),
    pending: pendingReportSchema.optional(),
  })
  .superRefine((req, ctx) => {
    const ids = new Set<string>();
    req.mutations.forEach((m, i) => {
      if (i > 0 && m.seq <= req.mutations[i - 1]!.seq) {
        ctx.addIssue({ code: "custom", path: ["mutations", i, "seq"], message: "Changes must be in increasing sequence order." });
      }
      if (ids.has(m.mutationId)) ctx.addIssue({ code: "custom", path: ["mutations", i, "mutationId"], message: "The same change appears twice." });
      ids.add(m.mutationId);
    });
  });
export type PushRequest = z.infer<typeof pushRequestSchema>;

export const REJECT_CODES = [
  "invalid",
  "forbidden",
  "not_found",
  "closed",
  "conflict",
  "photo_missing",
  "tune_refused",
  "id_taken",
  "seq_reused",
  "mutation_reused",
  "gap",
] as const;
export type RejectCode = (typeof REJECT_CODES)[number];

export const rejectReasonSchema = z.object({
  code: z.enum(REJECT_CODES),
  message: z.string(),
  fields: z.record(z.string(), z.string()).optional(),
  /** Only a gap is worth sending again unchanged (the earlier changes must arrive first). */
  retryable: z.boolean().optional(),
  expectedSeq: z.number().int().optional(),
});
export type RejectReason = z.infer<typeof rejectReasonSchema>;

export const pushResultSchema = z.union([
  z.object({ mutationId: z.string(), seq: z.number().int(), status: z.literal("applied") }),
  z.object({ mutationId: z.string(), seq: z.number().int(), status: z.literal("duplicate") }),
  z.object({
    mutationId: z.string(),
    seq: z.number().int(),
    status: z.literal("rejected"),
    reason: rejectReasonSchema,
    /** The server's row as it stands (the device puts it back in place of its own change). */
    current: wireChangeSchema.optional(),
  }),
]);
export type PushResult = z.infer<typeof pushResultSchema>;

export const pushResponseSchema = z.object({
  protocolVersion: z.number().int(),
  /** The highest sequence number the server has recorded for this device. */
  lastSeq: z.number().int(),
  serverVersion: z.number().int(),
  results: z.array(pushResultSchema),
});
export type PushResponse = z.infer<typeof pushResponseSchema>;

// ---------------------------------------------------------------------------------------------
// Pull

export const pullQuerySchema = z.strictObject({
  v: z.coerce.number().int(),
  deviceId: id,
  cursor: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(MAX_PULL_LIMIT).default(DEFAULT_PULL_LIMIT),
  /** Continuation of a fresh device's first pull (opaque; from the previous page). */
  snapshot: z.string().max(500).optional(),
  /** Outbox size and the tickets with unsynced changes, as "ticketId:count,ticketId:count". */
  pending: z.coerce.number().int().min(0).optional(),
  pendingTickets: z.string().max(20_000).optional(),
});
export type PullQuery = z.infer<typeof pullQuerySchema>;

export const pullResponseSchema = z.object({
  protocolVersion: z.number().int(),
  changes: z.array(wireChangeSchema),
  /** The server version this page brings the device up to (0 while a first pull is still in progress). */
  cursor: z.number().int(),
  /** Present while a fresh device's first pull has pages left. */
  snapshot: z.string().nullable(),
  more: z.boolean(),
  /** Roughly how many changes remain after this page (for a progress bar). */
  remaining: z.number().int(),
});
export type PullResponse = z.infer<typeof pullResponseSchema>;

/** "ticketId:count,…" ⇄ report rows. */
export function encodePendingTickets(tickets: PendingReport["tickets"]): string {
  return tickets.map((t) => `${t.ticketId}:${t.changes}`).join(",");
}
export function decodePendingTickets(s: string | undefined): PendingReport["tickets"] {
  if (!s) return [];
  const out: PendingReport["tickets"] = [];
  for (const part of s.split(",").slice(0, 500)) {
    const [ticketId, n] = part.split(":");
    const changes = Number(n);
    if (ticketId && ticketId.length <= 64 && Number.isInteger(changes) && changes > 0) out.push({ ticketId, changes });
  }
  return out;
}
