import { describe, expect, it } from "vitest";
import { checkPhone, normalizeSerial } from "@/lib/counter/contact";
import { addDays, dateIn, daysBetween, formatDate, isCalendarDate, timeIn, zonedTimeToInstant } from "@/lib/counter/dates";
import { EMPTY_INTAKE, intakeSchema, parseApprovalLimit, type IntakeValues } from "@/lib/counter/intake-schema";

const TODAY = "2026-12-01";
const CUSTOMER = "00000000-0000-4000-8100-000000000001";

/** A complete new-customer, new-machine intake; each test breaks one thing. */
const good = (over: Partial<IntakeValues> = {}): IntakeValues => ({
  ...EMPTY_INTAKE,
  firstName: "Wendeline",
  lastName: "Aspinall",
  phone: "555-0131",
  email: "wendeline@example.org",
  contactPreference: "text",
  emailConsent: true,
  kind: "chain_saw",
  engineType: "two_stroke",
  make: "Tarnwick",
  model: "TW-40",
  serial: "TW40-0099",
  complaintPicks: ["wont_start"],
  promisedDate: "2026-12-04",
  approvalLimit: "150",
  ...over,
});

function fieldErrors(values: IntakeValues, today = TODAY): Record<string, string> {
  const r = intakeSchema(today).safeParse(values);
  if (r.success) return {};
  return Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
}

describe("phone numbers", () => {
  it.each([
    ["555-0142", "555-0142"], // [NANPA, memory] 555-0100…0199 are set aside for fictional use; 7-digit local form
    ["(312) 555-0142", "(312) 555-0142"], // [NANPA, memory] 10 digits: 3-digit area code + 7-digit number
    ["+1 312 555 0142", "+1 312 555 0142"], // [ITU-T E.164] country code 1 + national number
    ["+44 20 7946 0958", "+44 20 7946 0958"], // [Ofcom, memory] 020 7946 0000–0999 reserved for drama use
    ["  555   0142 ", "555 0142"],
  ])("takes %s", (input, stored) => {
    expect(checkPhone(input)).toEqual({ ok: true, value: stored });
  });

  it("refuses letters, too few and too many digits, with a reason", () => {
    expect(checkPhone("555-CALL")).toMatchObject({ ok: false, message: expect.stringMatching(/digits only/) });
    expect(checkPhone("12ab")).toMatchObject({ ok: false, message: expect.stringMatching(/digits only/) });
    expect(checkPhone("555-014")).toMatchObject({ ok: false, message: expect.stringMatching(/6 digits; .* at least 7/) });
    // [ITU-T E.164; memory for the clause] an international number has at most 15 digits
    expect(checkPhone("+123 456 789 012 345").ok).toBe(true);
    expect(checkPhone("+123 456 789 012 3456")).toMatchObject({ ok: false, message: expect.stringMatching(/16 digits; .* at most 15/) });
    expect(checkPhone("555+0142").ok).toBe(false); // "+" only leads
  });
});

describe("calendar dates and the shop's time zone", () => {
  it("knows which days exist", () => {
    // [Gregorian calendar rule] leap years: divisible by 4, except centuries not divisible by 400
    expect(isCalendarDate("2028-02-29")).toBe(true);
    expect(isCalendarDate("2026-02-29")).toBe(false);
    expect(isCalendarDate("2000-02-29")).toBe(true);
    expect(isCalendarDate("1900-02-29")).toBe(false);
    expect(isCalendarDate("2026-04-31")).toBe(false);
    expect(isCalendarDate("2026-13-01")).toBe(false);
    expect(isCalendarDate("12/05/2026")).toBe(false);
  });

  it("reads today's date in the shop's zone, not the server's", () => {
    // [IANA tz database; 15 U.S.C. §260a, memory for the section] Chicago is UTC−6 in winter, UTC−5 from the second Sunday of March
    expect(dateIn("America/Chicago", Date.UTC(2026, 0, 15, 5, 30))).toBe("2026-01-14");
    expect(dateIn("America/Chicago", Date.UTC(2026, 0, 15, 6, 0))).toBe("2026-01-15");
    expect(dateIn("America/Chicago", Date.UTC(2026, 2, 10, 4, 59))).toBe("2026-03-09");
    expect(dateIn("America/Chicago", Date.UTC(2026, 2, 10, 5, 0))).toBe("2026-03-10");
    expect(dateIn("Europe/Berlin", Date.UTC(2026, 6, 1, 22, 0))).toBe("2026-07-02"); // [IANA tz] CEST = UTC+2
  });

  it("turns a wall-clock time in the zone into an instant, across daylight-saving changes", () => {
    // [IANA tz database] Chicago: CDT (UTC−5) in July, CST (UTC−6) in January
    expect(zonedTimeToInstant("2026-07-01", "12:00", "America/Chicago")).toEqual({ ok: true, value: Date.UTC(2026, 6, 1, 17, 0) });
    expect(zonedTimeToInstant("2026-01-15", "12:00", "America/Chicago")).toEqual({ ok: true, value: Date.UTC(2026, 0, 15, 18, 0) });
    // [15 U.S.C. §260a, memory for the section] 2026-03-08 (second Sunday of March): 02:00 jumps to 03:00, so 02:30 never happens
    expect(zonedTimeToInstant("2026-03-08", "02:30", "America/Chicago")).toMatchObject({ ok: false });
    // 2026-11-01 (first Sunday of November): 01:30 happens twice; the first (still CDT) is taken
    expect(zonedTimeToInstant("2026-11-01", "01:30", "America/Chicago")).toEqual({ ok: true, value: Date.UTC(2026, 10, 1, 6, 30) });
    expect(zonedTimeToInstant("2026-11-01", "25:00", "America/Chicago")).toMatchObject({ ok: false });
    const back = Date.UTC(2026, 6, 1, 17, 0);
    expect([dateIn("America/Chicago", back), timeIn("America/Chicago", back)]).toEqual(["2026-07-01", "12:00"]);
  });

  it("counts days and names them", () => {
    expect(daysBetween("2026-12-30", "2027-01-02")).toBe(3);
    expect(daysBetween("2028-02-28", "2028-03-01")).toBe(2); // [Gregorian] 2028 is a leap year
    expect(addDays("2026-12-31", 1)).toBe("2027-01-01");
    expect(formatDate("2026-12-01")).toBe("Tue 1 Dec 2026"); // [Python datetime, checked outside the project] 1 Dec 2026 is a Tuesday
  });
});

describe("approval limit ('call before going over $N')", () => {
  it("parses dollars into whole cents", () => {
    // [31 U.S.C. §5101, memory for the section] the dollar is divided into 100 cents
    expect(parseApprovalLimit("150")).toEqual({ ok: true, value: 15_000 });
    expect(parseApprovalLimit("$1,234.56")).toEqual({ ok: true, value: 123_456 });
    expect(parseApprovalLimit("75.5")).toEqual({ ok: true, value: 7_550 });
    expect(parseApprovalLimit("0")).toEqual({ ok: true, value: 0 });
    expect(parseApprovalLimit("  ")).toEqual({ ok: true, value: null });
  });

  it("refuses what is not an amount of whole cents, negatives and absurd amounts", () => {
    expect(parseApprovalLimit("12.345")).toMatchObject({ ok: false, message: expect.stringMatching(/whole cents/) });
    expect(parseApprovalLimit("-5")).toMatchObject({ ok: false, message: expect.stringMatching(/negative/) });
    expect(parseApprovalLimit("about 100")).toMatchObject({ ok: false });
    expect(parseApprovalLimit("100000.01")).toMatchObject({ ok: false, message: expect.stringMatching(/over \$100,000/) });
  });
});

describe("the intake schema", () => {
  it("accepts a complete intake and shapes it for the database", () => {
    const r = intakeSchema(TODAY).parse(good());
    expect(r.customer).toEqual({ id: null, firstName: "Wendeline", lastName: "Aspinall", phone: "555-0131", email: "wendeline@example.org", contactPreference: "text", emailConsent: true });
    expect(r.machine).toMatchObject({ id: null, kind: "chain_saw", make: "Tarnwick", serial: "TW40-0099", serialIsDifferent: false });
    expect(r).toMatchObject({ promisedDate: "2026-12-04", approvalLimitCents: 15_000, assignedTechId: null });
  });

  it("puts each error on the field it is about", () => {
    expect(fieldErrors(good({ phone: "12ab" }))).toEqual({ phone: expect.stringMatching(/digits only/) });
    expect(fieldErrors(good({ email: "wendeline@" }))).toEqual({ email: expect.stringMatching(/valid e-mail/) });
    expect(fieldErrors(good({ email: "wendeline example.org" }))).toHaveProperty("email");
    // [RFC 5322 §3.4.1, memory for the section] addr-spec = local-part "@" domain: one "@" outside quotes
    expect(fieldErrors(good({ email: "wendeline@@example.org" }))).toHaveProperty("email");
    expect(fieldErrors(good({ lastName: "  " }))).toEqual({ lastName: "Enter the customer's last name." });
    expect(fieldErrors(good({ approvalLimit: "12.345" }))).toEqual({ approvalLimit: expect.stringMatching(/whole cents/) });
    expect(fieldErrors(good({ complaintPicks: [], complaint: "" }))).toEqual({ complaint: expect.stringMatching(/Pick what is wrong/) });
    expect(fieldErrors(good({ kind: "", engineType: "", make: "" }))).toEqual({
      kind: expect.any(String),
      engineType: expect.any(String),
      make: "Enter the make.",
    });
  });

  it("refuses promised dates that have passed, do not exist or are over a year out", () => {
    expect(fieldErrors(good({ promisedDate: "2026-11-30" }))).toEqual({ promisedDate: expect.stringMatching(/has passed/) });
    expect(fieldErrors(good({ promisedDate: "2027-02-29" }))).toEqual({ promisedDate: expect.stringMatching(/real date/) }); // [Gregorian] 2027 is not a leap year
    expect(fieldErrors(good({ promisedDate: "5 Dec" }))).toEqual({ promisedDate: expect.stringMatching(/real date/) });
    expect(fieldErrors(good({ promisedDate: "2027-12-02" }))).toEqual({ promisedDate: expect.stringMatching(/more than a year/) });
    expect(fieldErrors(good({ promisedDate: TODAY }))).toEqual({});
    expect(fieldErrors(good({ promisedDate: "" }))).toEqual({});
  });

  it("needs a way to reach the customer that matches their preference", () => {
    expect(fieldErrors(good({ phone: "", email: "" , emailConsent: false }))).toEqual({ phone: expect.stringMatching(/phone number or an e-mail/) });
    expect(fieldErrors(good({ phone: "", contactPreference: "text" }))).toEqual({ phone: expect.stringMatching(/number to text/) });
    expect(fieldErrors(good({ email: "", emailConsent: false, contactPreference: "email" }))).toEqual({ email: expect.stringMatching(/Enter the e-mail/) });
    expect(fieldErrors(good({ email: "", emailConsent: true }))).toEqual({ email: "Enter the e-mail address they agreed to." });
  });

  it("needs no machine details when an existing machine is chosen, and no name rules beyond the last name", () => {
    const v = good({ customerId: CUSTOMER, machineId: "00000000-0000-4000-8200-000000000001", kind: "", engineType: "", make: "" });
    expect(fieldErrors(v)).toEqual({});
    expect(fieldErrors({ ...v, machineId: "not-a-uuid" })).toEqual({ machineId: "Choose the machine again." });
  });

  it("refuses quick picks and condition flags it does not know", () => {
    expect(fieldErrors(good({ complaintPicks: ["exploded"] }))).toHaveProperty(["complaintPicks.0"]);
    expect(fieldErrors(good({ conditionFlags: ["fuel_in_tank", "on_fire"] }))).toHaveProperty(["conditionFlags.1"]);
  });
});

describe("serial numbers", () => {
  it("compare without case, spaces, dashes, dots or slashes", () => {
    expect(normalizeSerial(" vh451-20931 ")).toBe("VH45120931");
    expect(normalizeSerial("VH451 209.31/")).toBe("VH45120931");
  });
});
