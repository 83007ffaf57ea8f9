import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import {
  buildOrder,
  canAward,
  dependencyCycleError,
  DependencyCycleError,
  detectCycles,
  type SequenceLine,
} from "@/lib/sequence";

// The algorithm reference for the staged order: Kahn (1962), Topological sorting of large
// networks, CACM 5(11). Every expected order below is worked by hand from that algorithm.

function line(id: string, dependsOn: string[] = [], extra: Partial<SequenceLine> = {}): SequenceLine {
  return { id, label: `Line ${id}`, category: "protection", dependsOn, met: false, ...extra };
}

function stageIds(lines: SequenceLine[]): string[][] {
  return buildOrder(lines).stages.map((stage) => stage.lines.map((planned) => planned.id));
}

describe("buildOrder", () => {
  it("orders a diamond: one decision, two lines that need it, one line that needs both", () => {
    // Kahn (1962), Topological sorting of large networks, CACM 5(11): layers [A] [B C] [D] (hand-worked)
    const lines = [line("D", ["B", "C"]), line("B", ["A"]), line("C", ["A"]), line("A", [], { kind: "decision" })];
    expect(stageIds(lines)).toEqual([["A"], ["B", "C"], ["D"]]);
    const d = buildOrder(lines).stages[2]?.lines[0];
    expect(d?.blocked).toBe(true);
    expect(d?.blockedBy.map((ref) => ref.label)).toEqual(["Line B", "Line C"]);
  });

  it("orders a chain one line per stage", () => {
    // Kahn (1962), CACM 5(11): a chain has one line per layer (hand-worked)
    const lines = [line("A"), line("B", ["A"]), line("C", ["B"]), line("D", ["C"])];
    expect(stageIds(lines)).toEqual([["A"], ["B"], ["C"], ["D"]]);
    expect(buildOrder(lines).stages[0]?.lines[0]?.blocked).toBe(false);
  });

  it("runs two independent components side by side", () => {
    // Kahn (1962), CACM 5(11): [A C] [B D] [E] (hand-worked)
    const lines = [line("A"), line("B", ["A"]), line("C"), line("D", ["C"]), line("E", ["D"])];
    expect(stageIds(lines)).toEqual([
      ["A", "C"],
      ["B", "D"],
      ["E"],
    ]);
  });

  it("a met prerequisite does not block, and met lines are not planned again", () => {
    // Kahn (1962), CACM 5(11), over the remaining lines only: B and C start at once (hand-worked)
    const lines = [line("A", [], { met: true }), line("B", ["A"]), line("C", ["A", "B"])];
    const order = buildOrder(lines);
    expect(order.stages.map((stage) => stage.lines.map((planned) => planned.id))).toEqual([["B"], ["C"]]);
    expect(order.stages[0]?.lines[0]).toMatchObject({ id: "B", blocked: false, blockedBy: [] });
    expect(order.stages[1]?.lines[0]?.blockedBy.map((ref) => ref.id)).toEqual(["B"]);
    expect(order.metOutOfOrder).toEqual([]);
  });

  it("engineering sign-off gates the lines after it, directly and through other open lines", () => {
    const lines = [
      line("eng", [], { label: "Engineer's advice on the lift", category: "engineering", kind: "engineering" }),
      line("lift", ["eng"], { label: "Suspension lift", category: "suspension" }),
      line("align", ["lift"], { label: "Wheel alignment", category: "suspension", kind: "alignment" }),
      line("bar", [], { label: "Rear bar" }),
    ];
    const order = buildOrder(lines);
    // Kahn (1962), CACM 5(11): [eng bar] [lift] [align] (hand-worked)
    expect(order.stages.map((stage) => stage.lines.map((planned) => planned.id))).toEqual([
      ["eng", "bar"],
      ["lift"],
      ["align"],
    ]);
    const align = order.stages[2]?.lines[0];
    expect(align?.awaitingSignOff.map((ref) => ref.label)).toEqual(["Engineer's advice on the lift"]);
    expect(order.stages[0]?.lines[1]?.awaitingSignOff).toEqual([]);
    // Once signed off, nothing waits on it
    const signedOff = buildOrder(lines.map((l) => (l.id === "eng" ? { ...l, met: true } : l)));
    expect(signedOff.stages.flatMap((stage) => stage.lines).every((planned) => planned.awaitingSignOff.length === 0)).toBe(
      true,
    );
  });

  it("reports a line met before its prerequisite", () => {
    const lines = [line("A"), line("B", ["A"], { met: true })];
    expect(buildOrder(lines).metOutOfOrder).toEqual([
      { id: "B", label: "Line B", unmetPrerequisites: [{ id: "A", label: "Line A", kind: "fitting" }] },
    ]);
  });

  it("refuses unknown dependency ids and duplicate ids, naming the field", () => {
    expect(() => buildOrder([line("A"), line("B", ["A", "Z"])])).toThrow(
      expect.objectContaining({ name: "InputError", field: "lines.1.dependsOn.1" }),
    );
    expect(() => buildOrder([line("A"), line("A")])).toThrow(expect.objectContaining({ field: "lines.1.id" }));
  });
});

describe("detectCycles", () => {
  it("finds a line that depends on itself", () => {
    const lines = [line("A"), line("B", ["B"], { label: "Snorkel" })];
    expect(detectCycles(lines)).toEqual([{ ids: ["B"], labels: ["Snorkel"] }]);
    expect(() => buildOrder(lines)).toThrow(DependencyCycleError);
  });

  it("names the lines of a three-line cycle in order", () => {
    const lines = [
      line("tyres", ["lift"], { label: "Tyres" }),
      line("lift", ["springs"], { label: "Lift" }),
      line("springs", ["tyres"], { label: "Springs" }),
      line("bar", [], { label: "Bar" }),
    ];
    expect(detectCycles(lines)).toEqual([{ ids: ["tyres", "lift", "springs"], labels: ["Tyres", "Lift", "Springs"] }]);
    const error = dependencyCycleError(lines);
    expect(error).toBeInstanceOf(DependencyCycleError);
    expect(error).toBeInstanceOf(InputError);
    expect(error?.field).toBe("lines.0.dependsOn");
    expect(error?.message).toContain("Tyres → Lift → Springs → Tyres");
    expect(() => buildOrder(lines)).toThrow(/Tyres → Lift → Springs → Tyres/);
  });

  it("reports each separate cycle once", () => {
    const lines = [line("A", ["B"]), line("B", ["A"]), line("C"), line("D", ["E"]), line("E", ["D", "C"])];
    expect(detectCycles(lines).map((cycle) => cycle.ids)).toEqual([
      ["A", "B"],
      ["D", "E"],
    ]);
  });

  it("finds nothing in an acyclic standard", () => {
    expect(detectCycles([line("A"), line("B", ["A"])])).toEqual([]);
    expect(dependencyCycleError([line("A"), line("B", ["A"])])).toBeNull();
  });
});

/** A random acyclic standard: line i may depend only on lines before it, then shuffled. */
const acyclicLines = fc.integer({ min: 1, max: 14 }).chain((n) =>
  fc
    .tuple(
      fc.array(fc.array(fc.boolean(), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }),
      fc.array(fc.boolean(), { minLength: n, maxLength: n }),
      fc.shuffledSubarray(
        Array.from({ length: n }, (_, i) => i),
        { minLength: n, maxLength: n },
      ),
    )
    .map(([edges, met, order]) =>
      order.map(
        (i): SequenceLine => ({
          id: `L${i}`,
          label: `Line ${i}`,
          category: "storage",
          dependsOn: Array.from({ length: i }, (_, j) => j)
            .filter((j) => edges[i]?.[j] === true)
            .map((j) => `L${j}`),
          met: met[i] === true,
        }),
      ),
    ),
);

describe("buildOrder properties", () => {
  it("every open line comes after all its open prerequisites, exactly once", () => {
    fc.assert(
      fc.property(acyclicLines, (lines) => {
        const byId = new Map(lines.map((l) => [l.id, l]));
        const stageOf = new Map<string, number>();
        for (const stage of buildOrder(lines).stages) {
          for (const planned of stage.lines) {
            expect(stageOf.has(planned.id)).toBe(false);
            stageOf.set(planned.id, stage.index);
          }
        }
        expect([...stageOf.keys()].sort()).toEqual(lines.filter((l) => !l.met).map((l) => l.id).sort());
        for (const [id, stage] of stageOf) {
          for (const prerequisite of byId.get(id)!.dependsOn) {
            if (!byId.get(prerequisite)!.met) expect(stageOf.get(prerequisite)!).toBeLessThan(stage);
          }
        }
      }),
    );
  });

  it("stages are minimal: each line after stage 0 waits on a line of the stage just before", () => {
    fc.assert(
      fc.property(acyclicLines, (lines) => {
        const order = buildOrder(lines);
        const stageOf = new Map(order.stages.flatMap((stage) => stage.lines.map((p) => [p.id, stage.index] as const)));
        for (const stage of order.stages) {
          expect(stage.lines.length).toBeGreaterThan(0);
          for (const planned of stage.lines) {
            expect(planned.blocked).toBe(stage.index > 0);
            if (stage.index > 0) {
              expect(planned.blockedBy.some((ref) => stageOf.get(ref.id) === stage.index - 1)).toBe(true);
            }
          }
        }
      }),
    );
  });

  it("an acyclic standard has no cycle, and a self-dependency always makes one", () => {
    fc.assert(
      fc.property(acyclicLines, fc.nat(), (lines, pick) => {
        expect(detectCycles(lines)).toEqual([]);
        const target = lines[pick % lines.length]!;
        const looped = lines.map((l) => (l.id === target.id ? { ...l, dependsOn: [...l.dependsOn, l.id] } : l));
        expect(detectCycles(looped)).toEqual([{ ids: [target.id], labels: [target.label] }]);
      }),
    );
  });

  it("without engineering lines, every open line can be awarded together, and never one without its open prerequisites", () => {
    fc.assert(
      fc.property(acyclicLines, (lines) => {
        const open = lines.filter((l) => !l.met);
        if (open.length === 0) return;
        expect(canAward(open.map((l) => l.id), lines).ok).toBe(true);
        for (const planned of buildOrder(lines).stages.flatMap((stage) => stage.lines)) {
          expect(canAward([planned.id], lines).ok).toBe(!planned.blocked);
        }
      }),
    );
  });
});
