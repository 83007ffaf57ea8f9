import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import {
  DEFECT_MOVES,
  DEFECT_STATES,
  allowedMoves,
  canReceiveMerge,
  closeNeedsReason,
  defectMove,
  type DefectMove,
  type DefectMoveKind,
  type DefectState,
} from "@/lib/defects";

// The states and moves are Rigline's own, set out in the permission table's "States" section:
// reported → triaged → in repair (linked job) → resolved → closed; reported / triaged → closed
// (with reason); → merged into another. No external source.

const sample: Record<DefectMoveKind, DefectMove> = {
  triage: { kind: "triage" },
  start_repair: { kind: "start_repair", jobId: "job-1" },
  resolve: { kind: "resolve" },
  close: { kind: "close", reason: "Not a fault: tyre was let down for sand" },
  merge: { kind: "merge", intoId: "defect-2" },
};

const LEGAL: [DefectState, DefectMoveKind, DefectState][] = [
  ["reported", "triage", "triaged"],
  ["reported", "close", "closed"],
  ["reported", "merge", "merged"],
  ["triaged", "start_repair", "in_repair"],
  ["triaged", "close", "closed"],
  ["triaged", "merge", "merged"],
  ["in_repair", "resolve", "resolved"],
  ["resolved", "close", "closed"],
];

describe("defect state machine", () => {
  it.each(LEGAL)("%s --%s--> %s", (from, move, to) => {
    expect(defectMove(from, sample[move])).toEqual({ ok: true, to });
  });

  it("refuses every move not in the table, with a reason in words", () => {
    const legal = new Set(LEGAL.map(([f, m]) => `${f}:${m}`));
    let refused = 0;
    for (const from of DEFECT_STATES) {
      for (const move of DEFECT_MOVES) {
        if (legal.has(`${from}:${move}`)) continue;
        const outcome = defectMove(from, sample[move]);
        expect(outcome.ok, `${from} ${move}`).toBe(false);
        if (!outcome.ok) expect(outcome.reason.length).toBeGreaterThan(10);
        refused++;
      }
    }
    // 6 states × 5 moves = 30 pairs, 8 of them legal.
    expect(refused).toBe(22);
  });

  it("lists exactly the legal moves of each state", () => {
    expect(allowedMoves("reported")).toEqual(["triage", "close", "merge"]);
    expect(allowedMoves("triaged")).toEqual(["start_repair", "close", "merge"]);
    expect(allowedMoves("in_repair")).toEqual(["resolve"]);
    expect(allowedMoves("resolved")).toEqual(["close"]);
    expect(allowedMoves("closed")).toEqual([]);
    expect(allowedMoves("merged")).toEqual([]);
  });

  it("needs a reason to close a defect that was never repaired, not one that was", () => {
    expect(closeNeedsReason("reported")).toBe(true);
    expect(closeNeedsReason("triaged")).toBe(true);
    expect(closeNeedsReason("resolved")).toBe(false);
    expect(defectMove("reported", { kind: "close" })).toEqual({ ok: false, reason: "Say why it is closed without a repair." });
    expect(defectMove("triaged", { kind: "close", reason: "  " })).toMatchObject({ ok: false });
    expect(defectMove("resolved", { kind: "close" })).toEqual({ ok: true, to: "closed" });
  });

  it("needs a job to start a repair and a target to merge into", () => {
    expect(defectMove("triaged", { kind: "start_repair", jobId: " " })).toMatchObject({ ok: false, reason: "Name the job that will repair it." });
    expect(defectMove("reported", { kind: "merge", intoId: "" })).toMatchObject({ ok: false });
  });

  it("says why a reported defect cannot go straight into repair", () => {
    const outcome = defectMove("reported", sample.start_repair);
    expect(outcome).toEqual({ ok: false, reason: "It is reported: triage it before linking a repair job." });
  });

  it("treats closed and merged as final", () => {
    for (const from of ["closed", "merged"] as const) {
      for (const move of DEFECT_MOVES) {
        const outcome = defectMove(from, sample[move]);
        expect(outcome.ok).toBe(false);
        if (!outcome.ok) expect(outcome.reason).toContain("cannot change any more");
      }
    }
  });

  it("takes merged reports only into one still open", () => {
    expect(DEFECT_STATES.filter(canReceiveMerge)).toEqual(["reported", "triaged", "in_repair"]);
  });

  it("throws InputError for a state or move that does not exist", () => {
    expect(() => defectMove("lost" as DefectState, sample.triage)).toThrow(InputError);
    expect(() => defectMove("reported", { kind: "fix" } as unknown as DefectMove)).toThrow(InputError);
    expect(() => allowedMoves("" as DefectState)).toThrow(InputError);
  });

  it("never leaves the known states, whatever sequence of moves is tried (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...DEFECT_MOVES), { maxLength: 12 }), (moves) => {
        let state: DefectState = "reported";
        const seen: DefectState[] = [state];
        for (const m of moves) {
          const outcome = defectMove(state, sample[m]);
          if (outcome.ok) {
            state = outcome.to;
            seen.push(state);
          }
        }
        expect(DEFECT_STATES).toContain(state);
        // Once final, always final.
        const finalAt = seen.findIndex((s) => s === "closed" || s === "merged");
        if (finalAt >= 0) expect(seen.length).toBe(finalAt + 1);
      }),
    );
  });
});
