import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from "drizzle-orm/sqlite-core";
import { ENGINE_TYPES, MACHINE_KINDS } from "../../lib/tickets/machine";
import { ROLES } from "../../lib/auth/roles";
import { TICKET_STATUSES } from "../../lib/tickets/status";

/** Milliseconds since the epoch, stored as an integer. */
const stamp = (name: string) => integer(name, { mode: "timestamp_ms" });
const now = sql`(cast(unixepoch('subsecond') * 1000 as integer))`;

/** One row (id = 1): the shop's own settings, edited by the owner. */
export const shopSettings = sqliteTable("shop_settings", {
  id: integer("id").primaryKey(),
  name: text("name").notNull(),
  phone: text("phone").notNull().default(""),
  email: text("email").notNull().default(""),
  address: text("address").notNull().default(""),
  timezone: text("timezone").notNull().default("America/Chicago"),
  currency: text("currency").notNull().default("USD"),
  laborRateCentsPerHour: integer("labor_rate_cents_per_hour").notNull().default(9000),
  laborIncrementMinutes: integer("labor_increment_minutes").notNull().default(6),
  taxRatePpm: integer("tax_rate_ppm").notNull().default(0),
  laborTaxable: integer("labor_taxable", { mode: "boolean" }).notNull().default(false),
  taxRounding: text("tax_rounding", { enum: ["line", "invoice"] }).notNull().default("invoice"),
  shopSuppliesBp: integer("shop_supplies_bp").notNull().default(0),
  shopSuppliesCapCents: integer("shop_supplies_cap_cents").notNull().default(0),
  comebackWindowDays: integer("comeback_window_days").notNull().default(30),
  nextTicketNumber: integer("next_ticket_number").notNull().default(1001),
  updatedAt: stamp("updated_at").notNull().default(now),
});

export const users = sqliteTable(
  "users",
  {
    id: text("id").primaryKey(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    passwordHash: text("password_hash").notNull(),
    /** Bumped to end every session of this user (deactivation, password reset). */
    sessionVersion: integer("session_version").notNull().default(1),
    createdAt: stamp("created_at").notNull().default(now),
    updatedAt: stamp("updated_at").notNull().default(now),
  },
  (t) => [uniqueIndex("users_email_unique").on(t.email)],
);

export const customers = sqliteTable(
  "customers",
  {
    id: text("id").primaryKey(),
    firstName: text("first_name").notNull().default(""),
    lastName: text("last_name").notNull(),
    phone: text("phone").notNull().default(""),
    email: text("email").notNull().default(""),
    contactPreference: text("contact_preference", { enum: ["phone", "text", "email"] }).notNull().default("phone"),
    emailConsent: integer("email_consent", { mode: "boolean" }).notNull().default(false),
    notes: text("notes").notNull().default(""),
    createdAt: stamp("created_at").notNull().default(now),
    updatedAt: stamp("updated_at").notNull().default(now),
  },
  (t) => [index("customers_last_name_idx").on(t.lastName), index("customers_phone_idx").on(t.phone)],
);

export const machines = sqliteTable(
  "machines",
  {
    id: text("id").primaryKey(),
    customerId: text("customer_id").references(() => customers.id),
    kind: text("kind", { enum: MACHINE_KINDS }).notNull(),
    engineType: text("engine_type", { enum: ENGINE_TYPES }).notNull(),
    make: text("make").notNull(),
    model: text("model").notNull().default(""),
    serial: text("serial").notNull().default(""),
    displacementCc: integer("displacement_cc"),
    /** Optional permanent sticker on the machine itself (same code system as repair tags). */
    stickerCode: text("sticker_code"),
    notes: text("notes").notNull().default(""),
    createdAt: stamp("created_at").notNull().default(now),
    updatedAt: stamp("updated_at").notNull().default(now),
  },
  (t) => [
    index("machines_serial_idx").on(t.serial),
    index("machines_customer_idx").on(t.customerId),
    uniqueIndex("machines_sticker_code_unique").on(t.stickerCode),
  ],
);

export const tickets = sqliteTable(
  "tickets",
  {
    id: text("id").primaryKey(),
    number: integer("number").notNull(),
    /** The printed repair tag for this visit. */
    tagCode: text("tag_code").notNull(),
    machineId: text("machine_id")
      .notNull()
      .references(() => machines.id),
    customerId: text("customer_id")
      .notNull()
      .references(() => customers.id),
    complaint: text("complaint").notNull(),
    /** Quick-pick complaint keys, JSON array of strings. */
    complaintTags: text("complaint_tags", { mode: "json" }).$type<string[]>().notNull().default(sql`'[]'`),
    /** Condition at intake: JSON { flags: string[], note: string }. */
    intakeCondition: text("intake_condition", { mode: "json" })
      .$type<{ flags: string[]; note: string }>()
      .notNull()
      .default(sql`'{"flags":[],"note":""}'`),
    accessories: text("accessories").notNull().default(""),
    status: text("status", { enum: TICKET_STATUSES }).notNull().default("taken_in"),
    /** Calendar date promised to the customer, YYYY-MM-DD in the shop's time zone. */
    promisedDate: text("promised_date"),
    /** "Call before going over": null means no limit was given. */
    approvalLimitCents: integer("approval_limit_cents"),
    assignedTechId: text("assigned_tech_id").references(() => users.id),
    createdById: text("created_by_id").references(() => users.id),
    /** Set at intake when the machine came back within the comeback window after this earlier ticket's hand-back. */
    comebackOfTicketId: text("comeback_of_ticket_id").references((): AnySQLiteColumn => tickets.id),
    /** Header version for optimistic concurrency (device edits carry the version they were made from). */
    version: integer("version").notNull().default(1),
    createdAt: stamp("created_at").notNull().default(now),
    updatedAt: stamp("updated_at").notNull().default(now),
    closedAt: stamp("closed_at"),
  },
  (t) => [
    uniqueIndex("tickets_number_unique").on(t.number),
    uniqueIndex("tickets_tag_code_unique").on(t.tagCode),
    index("tickets_status_idx").on(t.status),
    index("tickets_machine_idx").on(t.machineId),
    index("tickets_customer_idx").on(t.customerId),
    index("tickets_tech_idx").on(t.assignedTechId),
    index("tickets_status_promised_idx").on(t.status, t.promisedDate),
  ],
);

export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: stamp("at").notNull().default(now),
    actorId: text("actor_id").references(() => users.id),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id").notNull(),
    details: text("details", { mode: "json" }).$type<Record<string, unknown>>().notNull().default(sql`'{}'`),
  },
  (t) => [index("audit_entity_idx").on(t.entity, t.entityId), index("audit_at_idx").on(t.at)],
);

/** Failed sign-in counters, per account ("acct:<email>") and per address ("addr:<ip>"). */
export const signInAttempts = sqliteTable("sign_in_attempts", {
  key: text("key").primaryKey(),
  failures: integer("failures").notNull().default(0),
  windowStartedAt: integer("window_started_at").notNull(),
  lockedUntil: integer("locked_until").notNull().default(0),
});
