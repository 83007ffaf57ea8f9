import { describe, expect, it } from "vitest";
import { EVIDENCE_STATES, JOB_STATES, QUOTE_STATES, evidenceMachine, isJobOverdue, jobMachine, quoteMachine } from "@/lib/jobs";

// The legal moves as PERMISSIONS.md's state table writes them (our own product rules).
const JOB_MOVES = [
  ["open", "quoting"],
  ["quoting", "awarded"],
  ["awarded", "in_workshop"],
  ["in_workshop", "evidence_lodged"],
  ["evidence_lodged", "signed_off"],
  ["signed_off", "closed"],
  ["open", "cancelled"],
  ["quoting", "cancelled"],
  ["awarded", "cancelled"],
  // Rejected evidence sends the work back to the workshop.
  ["evidence_lodged", "in_workshop"],
] as const;

const QUOTE_MOVES = [
  ["draft", "submitted"],
  ["submitted", "returned"],
  ["returned", "submitted"],
  ["submitted", "accepted"],
  ["submitted", "awaiting_finance"],
  ["awaiting_finance", "accepted"],
  ["awaiting_finance", "declined"],
  ["submitted", "declined"],
  ["draft", "withdrawn"],
  ["submitted", "withdrawn"],
  ["returned", "withdrawn"],
] as const;

const EVIDENCE_MOVES = [
  ["lodged", "accepted"],
  ["lodged", "rejected"],
] as const;

function everyPair<S extends string>(states: readonly S[]): [S, S][] {
  return states.flatMap((a) => states.map((b) => [a, b] as [S, S]));
}

describe.each([
  { name: "job", machine: jobMachine, states: JOB_STATES, legal: JOB_MOVES },
  { name: "quote", machine: quoteMachine, states: QUOTE_STATES, legal: QUOTE_MOVES },
  { name: "evidence", machine: evidenceMachine, states: EVIDENCE_STATES, legal: EVIDENCE_MOVES },
] as const)("$name state machine", ({ machine, states, legal }) => {
  const isLegal = (from: string, to: string) => legal.some(([a, b]) => a === from && b === to);

  it("allows exactly the legal moves of the table", () => {
    for (const [from, to] of legal) expect(machine.check(from as never, to as never), `${from} → ${to}`).toEqual({ allowed: true });
    expect(machine.moves).toHaveLength(legal.length);
  });

  it("refuses every other move with a reason in words", () => {
    for (const [from, to] of everyPair(states as readonly string[])) {
      if (isLegal(from, to)) continue;
      const result = machine.check(from as never, to as never);
      expect(result.allowed, `${from} → ${to}`).toBe(false);
      if (!result.allowed) expect(result.reason.length).toBeGreaterThan(10);
    }
  });

  it("refuses names that are not states", () => {
    const result = machine.check("nowhere" as never, states[0] as never);
    expect(result).toMatchObject({ allowed: false, reason: expect.stringContaining("not a") });
  });
});

describe("job machine wording", () => {
  it("says why work in the workshop cannot be cancelled", () => {
    const result = jobMachine.check("in_workshop", "cancelled");
    expect(result).toEqual({ allowed: false, reason: expect.stringContaining("can no longer be cancelled") });
  });

  it("says a closed job is final", () => {
    expect(jobMachine.check("closed", "open")).toEqual({ allowed: false, reason: expect.stringContaining("final") });
  });

  it("names the state it is already in", () => {
    expect(jobMachine.check("open", "open")).toEqual({ allowed: false, reason: "The job is already open" });
  });
});

describe("quote machine wording", () => {
  it("calls decisions final", () => {
    expect(quoteMachine.check("accepted", "declined")).toEqual({ allowed: false, reason: expect.stringContaining("decisions are final") });
  });
});

describe("isJobOverdue", () => {
  const now = new Date("2026-03-10T00:00:00Z");
  it("is overdue only while the work is still open and the due date has passed", () => {
    expect(isJobOverdue("quoting", new Date("2026-03-09T00:00:00Z"), now)).toBe(true);
    expect(isJobOverdue("quoting", new Date("2026-03-11T00:00:00Z"), now)).toBe(false);
    expect(isJobOverdue("signed_off", new Date("2026-03-01T00:00:00Z"), now)).toBe(false);
    expect(isJobOverdue("open", null, now)).toBe(false);
  });
});
