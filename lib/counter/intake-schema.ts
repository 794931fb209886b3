/**
 * The intake form's one schema, used by the form in the browser (react-hook-form) and again by the
 * server action. Flat fields, so each error lands beside the field it names. Pure: zod only.
 */
import { z } from "zod";
import { parseDollars } from "../money/format";
import { ENGINE_TYPES, MACHINE_KINDS } from "../tickets/machine";
import { COMPLAINT_PICKS, CONDITION_FLAGS, CONTACT_PREFERENCES } from "../tickets/intake";
import { checkPhone } from "./contact";
import { addDays, isCalendarDate } from "./dates";

/** Photos taken at intake: uploaded to the photo store first (PUT /api/photos/<sha256>), then named here. */
export const INTAKE_PHOTOS_MAX = 6;
export interface IntakePhoto {
  sha256: string;
  mime: "image/jpeg" | "image/png" | "image/webp";
  bytes: number;
  width: number | null;
  height: number | null;
}
const intakePhotoSchema = z.object({
  sha256: z.string().regex(/^[0-9a-f]{64}$/, "A photo's reference is not valid: take it again."),
  mime: z.enum(["image/jpeg", "image/png", "image/webp"]),
  bytes: z.number().int().positive().max(8 * 1024 * 1024),
  width: z.number().int().positive().nullable(),
  height: z.number().int().positive().nullable(),
});

/** The largest "call before going over" amount we take: $100,000. */
export const APPROVAL_LIMIT_MAX_CENTS = 10_000_000;
/** How far ahead a promised date may be. */
export const PROMISE_MAX_DAYS_AHEAD = 365;

const uuidOrEmpty = (message: string) => z.union([z.literal(""), z.uuid(message)]);
const text = (max: number) => z.string().trim().max(max, `Keep this under ${max} characters.`);

export interface IntakeValues {
  customerId: string;
  firstName: string;
  lastName: string;
  phone: string;
  email: string;
  contactPreference: string;
  emailConsent: boolean;
  machineId: string;
  kind: string;
  engineType: string;
  make: string;
  model: string;
  serial: string;
  serialIsDifferent: boolean;
  complaintPicks: string[];
  complaint: string;
  conditionFlags: string[];
  conditionNote: string;
  accessories: string;
  promisedDate: string;
  approvalLimit: string;
  assignedTechId: string;
  photos: IntakePhoto[];
}

export const EMPTY_INTAKE: IntakeValues = {
  customerId: "",
  firstName: "",
  lastName: "",
  phone: "",
  email: "",
  contactPreference: "phone",
  emailConsent: false,
  machineId: "",
  kind: "",
  engineType: "",
  make: "",
  model: "",
  serial: "",
  serialIsDifferent: false,
  complaintPicks: [],
  complaint: "",
  conditionFlags: [],
  conditionNote: "",
  accessories: "",
  promisedDate: "",
  approvalLimit: "",
  assignedTechId: "",
  photos: [],
};

/** "call before going over $N": "" → no limit (null); otherwise whole cents, never negative. */
export function parseApprovalLimit(input: string): { ok: true; value: number | null } | { ok: false; message: string } {
  if (input.trim() === "") return { ok: true, value: null };
  const r = parseDollars(input);
  if (!r.ok) return r;
  if (r.value < 0) return { ok: false, message: "The limit cannot be negative. Leave it empty for no limit." };
  if (r.value > APPROVAL_LIMIT_MAX_CENTS) return { ok: false, message: "That is over $100,000: check the amount." };
  return r;
}

/**
 * The schema for a given "today" in the shop's time zone (YYYY-MM-DD): a promised date must be a real
 * calendar date, not before today and at most a year ahead.
 */
export function intakeSchema(today: string) {
  return z
    .object({
      customerId: uuidOrEmpty("Choose the customer again."),
      firstName: text(60),
      lastName: text(80),
      phone: text(40),
      email: text(254),
      contactPreference: z.enum(CONTACT_PREFERENCES, { message: "Choose how to reach them." }),
      emailConsent: z.boolean(),
      machineId: uuidOrEmpty("Choose the machine again."),
      kind: z.union([z.literal(""), z.enum(MACHINE_KINDS)]),
      engineType: z.union([z.literal(""), z.enum(ENGINE_TYPES)]),
      make: text(60),
      model: text(60),
      serial: text(60),
      serialIsDifferent: z.boolean(),
      complaintPicks: z.array(z.enum(COMPLAINT_PICKS)).max(COMPLAINT_PICKS.length),
      complaint: text(2000),
      conditionFlags: z.array(z.enum(CONDITION_FLAGS)).max(CONDITION_FLAGS.length),
      conditionNote: text(1000),
      accessories: text(500),
      promisedDate: z.string().trim(),
      approvalLimit: z.string().trim(),
      assignedTechId: uuidOrEmpty("Choose a technician from the list."),
      photos: z.array(intakePhotoSchema).max(INTAKE_PHOTOS_MAX, `Keep it to ${INTAKE_PHOTOS_MAX} photos.`).default([]),
    })
    .superRefine((v, ctx) => {
      const issue = (path: keyof IntakeValues, message: string) => ctx.addIssue({ code: "custom", path: [path], message });

      if (!v.lastName) issue("lastName", "Enter the customer's last name.");
      if (v.phone) {
        const p = checkPhone(v.phone);
        if (!p.ok) issue("phone", p.message);
      }
      if (v.email && !z.email().safeParse(v.email).success) issue("email", "Enter a valid e-mail address, e.g. name@example.com.");
      if (!v.phone && !v.email) issue("phone", "Enter a phone number or an e-mail address, so the shop can reach them.");
      if ((v.contactPreference === "phone" || v.contactPreference === "text") && !v.phone && v.email) {
        issue("phone", `Enter the number to ${v.contactPreference === "text" ? "text" : "call"}, or choose e-mail.`);
      }
      if (v.contactPreference === "email" && !v.email) issue("email", "Enter the e-mail address, or choose another way to reach them.");
      if (v.emailConsent && !v.email) issue("email", "Enter the e-mail address they agreed to.");

      if (!v.machineId) {
        if (!v.kind) issue("kind", "Choose what kind of machine it is.");
        if (!v.engineType) issue("engineType", "Choose the engine type.");
        if (!v.make) issue("make", "Enter the make.");
      }

      if (v.complaintPicks.length === 0 && v.complaint.length < 3) {
        issue("complaint", "Pick what is wrong or describe it in a few words.");
      }

      if (v.promisedDate) {
        if (!isCalendarDate(v.promisedDate)) issue("promisedDate", "Enter a real date, e.g. 2026-12-05.");
        else if (v.promisedDate < today) issue("promisedDate", "That date has passed. Promise today or a later day.");
        else if (v.promisedDate > addDays(today, PROMISE_MAX_DAYS_AHEAD)) issue("promisedDate", "That is more than a year away: check the year.");
      }

      const limit = parseApprovalLimit(v.approvalLimit);
      if (!limit.ok) issue("approvalLimit", limit.message);
    })
    .transform((v) => ({
      customer: {
        id: v.customerId || null,
        firstName: v.firstName,
        lastName: v.lastName,
        phone: v.phone ? (checkPhone(v.phone) as { ok: true; value: string }).value : "",
        email: v.email,
        contactPreference: v.contactPreference,
        emailConsent: v.emailConsent && v.email !== "",
      },
      machine: v.machineId
        ? ({ id: v.machineId } as const)
        : ({
            id: null,
            kind: v.kind as Exclude<typeof v.kind, "">,
            engineType: v.engineType as Exclude<typeof v.engineType, "">,
            make: v.make,
            model: v.model,
            serial: v.serial,
            serialIsDifferent: v.serialIsDifferent,
          } as const),
      complaintPicks: v.complaintPicks,
      complaint: v.complaint,
      condition: { flags: v.conditionFlags, note: v.conditionNote },
      accessories: v.accessories,
      promisedDate: v.promisedDate || null,
      approvalLimitCents: (parseApprovalLimit(v.approvalLimit) as { ok: true; value: number | null }).value,
      assignedTechId: v.assignedTechId || null,
      photos: v.photos,
    }));
}

export type IntakeInput = z.output<ReturnType<typeof intakeSchema>>;
