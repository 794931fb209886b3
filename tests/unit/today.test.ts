import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  filterToday,
  foldText,
  groupToday,
  localIsoDate,
  matchesSearch,
  notSyncedLabel,
  promisedLabel,
  type SearchableCard,
} from "@/lib/bench/today";
import type { MachineKind } from "@/lib/tickets/machine";
import { formatTagCode, generateTagCode, isValidTagCode } from "@/lib/trade/tag-code";

// Invented cards (made-up makes, customers and codes). "HAWBR7H" is the app's own example code; the test
// checks that it really checks out so the tag-code cases use a code the scanner would accept.
const card = (over: {
  number: number;
  tagCode: string;
  complaint: string;
  make: string;
  model: string;
  kind: MachineKind;
  first: string;
  last: string;
  sticker?: string | null;
  mine?: boolean;
}): SearchableCard & { id: string } => ({
  id: `t${over.number}`,
  ticket: { number: over.number, tagCode: over.tagCode, complaint: over.complaint },
  machine: { make: over.make, model: over.model, kind: over.kind, stickerCode: over.sticker ?? null },
  customer: { firstName: over.first, lastName: over.last },
  mine: over.mine ?? false,
});

const SAW = card({
  number: 1042,
  tagCode: "HAWBR7H",
  complaint: "Hard to start when warm; bogs under load",
  make: "Brennick",
  model: "BW-19",
  kind: "chain_saw",
  first: "Dana",
  last: "Teasdale",
  mine: true,
});
const MOWER = card({
  number: 1043,
  tagCode: "KXM4P9D",
  complaint: "Pull cord snapped",
  make: "Orlund",
  model: "M21 Deck",
  kind: "walk_mower",
  first: "Renée",
  last: "Ôkafor-Lind",
  sticker: "7CT4XE8",
});
const BLOWER = card({
  number: 1107,
  tagCode: "XYWB3F6",
  complaint: "Surges at full throttle",
  make: "Quillan",
  model: "B4",
  kind: "blower",
  first: "Marcus",
  last: "Hale",
  mine: true,
});
const ALL = [SAW, MOWER, BLOWER];
const ids = (q: string) => filterToday(ALL, q).map((c) => c.id);

describe("searching today's work", () => {
  it("the example tag code is one the scanner accepts [lib/trade/tag-code, ISO/IEC 7064 MOD 37-2]", () => {
    expect(isValidTagCode("HAWBR7H")).toBe(true);
  });

  it("an empty or blank search shows every card, in the order given", () => {
    expect(ids("")).toEqual(["t1042", "t1043", "t1107"]);
    expect(ids("   ")).toEqual(["t1042", "t1043", "t1107"]);
  });

  it("finds a ticket by number, with or without #", () => {
    expect(ids("1042")).toEqual(["t1042"]);
    expect(ids("#1042")).toEqual(["t1042"]);
    expect(ids("#104")).toEqual(["t1042", "t1043"]);
    expect(ids("#11")).toEqual(["t1107"]);
    expect(ids("#42")).toEqual([]); // with "#" the digits must start the number
  });

  it("finds a tag code however it is typed: printed form, any spacing, dashes or case, or one group", () => {
    for (const q of ["HAW-BR7H", "hawbr7h", "haw br7h", " h a w - b r 7 h ", "HAW–BR7H", "br7h", "HAW"]) {
      expect(ids(q), q).toEqual(["t1042"]);
    }
    expect(ids(formatTagCode(BLOWER.ticket.tagCode).toLowerCase())).toEqual(["t1107"]);
  });

  it("a machine's permanent sticker code finds its ticket too", () => {
    expect(ids("7CT-4XE8")).toEqual(["t1043"]);
  });

  it("two characters are too few to look inside tag codes (they would match by chance)", () => {
    expect(ids("br")).toEqual(["t1042"]); // "Brennick", not the tag
    expect(ids("7h")).toEqual([]);
  });

  it("finds make, model, machine kind, customer name and complaint words, ignoring case and accents", () => {
    expect(ids("brennick")).toEqual(["t1042"]);
    expect(ids("bw-19")).toEqual(["t1042"]);
    expect(ids("m21")).toEqual(["t1043"]);
    expect(ids("chain saw")).toEqual(["t1042"]);
    expect(ids("mower")).toEqual(["t1043"]);
    expect(ids("TEASDALE")).toEqual(["t1042"]);
    expect(ids("dana")).toEqual(["t1042"]);
    expect(ids("okafor")).toEqual(["t1043"]);
    expect(ids("renee")).toEqual(["t1043"]);
    expect(ids("pull cord")).toEqual(["t1043"]);
    expect(ids("throttle")).toEqual(["t1107"]);
  });

  it("every word must match somewhere on the same card", () => {
    expect(ids("brennick warm")).toEqual(["t1042"]);
    expect(ids("teasdale   1042")).toEqual(["t1042"]);
    expect(ids("brennick throttle")).toEqual([]);
    expect(ids("zzz")).toEqual([]);
  });

  it("a card without its machine or customer on the phone is still found by number and complaint", () => {
    const bare: SearchableCard = { ticket: { number: 2001, tagCode: "HAWBR7H", complaint: "Will not idle" }, machine: null, customer: null, mine: false };
    expect(matchesSearch(bare, "2001")).toBe(true);
    expect(matchesSearch(bare, "idle")).toBe(true);
    expect(matchesSearch(bare, "brennick")).toBe(false);
  });

  it("property: any generated tag code, typed in any case with the printed dash, finds its own card", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 2 }), fc.boolean(), (seed, lower) => {
        // A small seeded generator (Park–Miller minimal standard, 16807 mod 2^31 − 1; seeds 1 … 2^31 − 2) feeds generateTagCode.
        let x = seed;
        const code = generateTagCode(() => (x = (x * 16807) % 2147483647) / 2147483647);
        const c = { ...MOWER, ticket: { ...MOWER.ticket, tagCode: code } };
        const typed = lower ? formatTagCode(code).toLowerCase() : formatTagCode(code);
        return matchesSearch(c, typed);
      }),
      { numRuns: 200 },
    );
  });
});

describe("grouping", () => {
  it("puts the tech's own tickets first and keeps each group's order", () => {
    const g = groupToday(ALL);
    expect(g.mine.map((c) => c.id)).toEqual(["t1042", "t1107"]);
    expect(g.others.map((c) => c.id)).toEqual(["t1043"]);
  });

  it("search and grouping together: only matching cards in each group", () => {
    const g = groupToday(filterToday(ALL, "#10"));
    expect(g.mine.map((c) => c.id)).toEqual(["t1042"]);
    expect(g.others.map((c) => c.id)).toEqual(["t1043"]);
  });
});

describe("folding text", () => {
  it("drops accents and case and squeezes spaces", () => {
    expect(foldText("  Ôkafor-Lind\t Renée ")).toBe("okafor-lind renee");
  });
});

describe("promised date in words", () => {
  // Weekdays from the Gregorian calendar (checked with GNU `date -d 2026-01-14 +%a` → Wed, 2026-01-12 → Mon).
  it("today, tomorrow, later and overdue", () => {
    expect(promisedLabel("2026-01-12", "2026-01-12")).toEqual({ text: "Promised today", overdue: false, today: true });
    expect(promisedLabel("2026-01-13", "2026-01-12")).toEqual({ text: "Promised tomorrow", overdue: false, today: false });
    expect(promisedLabel("2026-01-14", "2026-01-12")).toEqual({ text: "Promised Wed, Jan 14", overdue: false, today: false });
    expect(promisedLabel("2026-01-12", "2026-01-14")).toEqual({ text: "Overdue: promised Mon, Jan 12", overdue: true, today: false });
  });

  it("counts across month and year ends and leap days [Gregorian calendar: 2024 is a leap year]", () => {
    expect(promisedLabel("2026-01-01", "2025-12-31")?.text).toBe("Promised tomorrow");
    expect(promisedLabel("2024-03-01", "2024-02-29")?.text).toBe("Promised tomorrow");
    expect(promisedLabel("2024-02-29", "2024-02-27")?.text).toBe("Promised Thu, Feb 29"); // `date -d 2024-02-29 +%a` → Thu
  });

  it("answers null for a date that is not YYYY-MM-DD", () => {
    expect(promisedLabel("next week", "2026-01-12")).toBeNull();
    expect(promisedLabel("2026-01-12", "")).toBeNull();
  });

  it("today's date is the device's calendar day", () => {
    expect(localIsoDate(new Date(2026, 0, 5, 23, 59))).toBe("2026-01-05");
    expect(localIsoDate(new Date(2026, 11, 31, 0, 1))).toBe("2026-12-31");
  });
});

describe("not-synced marker", () => {
  it("says how many changes wait, singular and plural", () => {
    expect(notSyncedLabel(1)).toBe("1 change not synced");
    expect(notSyncedLabel(3)).toBe("3 changes not synced");
  });
});
