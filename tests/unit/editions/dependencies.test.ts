import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { EditionCycleError, validateDependencies } from "@/lib/editions";
import { line } from "../variance/fixtures";

// Rigline rules: a line depends only on lines of its own edition, and never on itself through
// any chain; the build order puts every line after what it depends on.

const bar = line({ id: "l-bar", code: "PR-01", title: "Front protection bar", dependsOn: ["l-eng"] });
const winch = line({ id: "l-winch", code: "RC-02", title: "Winch", dependsOn: ["l-bar"] });
const eng = line({ id: "l-eng", code: "EN-01", title: "Engineering advice", dependsOn: [] });
const springs = line({ id: "l-springs", code: "SU-01", title: "Rear springs", dependsOn: ["l-winch", "l-bar"] });

describe("validateDependencies", () => {
  it("gives an order with every line after the lines it depends on", () => {
    // Rigline rule.
    // l-bar needs l-eng; l-winch needs l-bar; l-springs needs both → eng, bar, winch, springs.
    expect(validateDependencies([bar, winch, eng, springs]).order).toEqual(["l-eng", "l-bar", "l-winch", "l-springs"]);
    expect(validateDependencies([]).order).toEqual([]);
  });

  it("refuses a 3-line cycle and names the lines, by code and title, in cycle order", () => {
    // Rigline rule.
    // bar → eng → winch → bar: each needs the next.
    const engInCircle = { ...eng, dependsOn: ["l-winch"] };
    const lines = [springs, bar, winch, engInCircle];
    expect(() => validateDependencies(lines)).toThrow(EditionCycleError);
    try {
      validateDependencies(lines);
    } catch (e) {
      const err = e as EditionCycleError;
      expect(err).toBeInstanceOf(InputError);
      // Starts at the cycle's line listed first in the edition (PR-01 at index 1).
      expect(err.cycle.map((l) => l.code)).toEqual(["PR-01", "EN-01", "RC-02"]);
      expect(err.field).toBe("lines.1.dependsOn");
      expect(err.message).toContain(
        'PR-01 "Front protection bar" → EN-01 "Engineering advice" → RC-02 "Winch" → PR-01 "Front protection bar"',
      );
    }
  });

  it("refuses a line that depends on itself", () => {
    // Rigline rule.
    const selfish = line({ id: "l-self", code: "ST-09", title: "Drawer", dependsOn: ["l-self"] });
    expect(() => validateDependencies([selfish])).toThrow(/ST-09 "Drawer" → ST-09 "Drawer"/);
  });

  it("refuses an unknown dependency id, naming the line", () => {
    // Rigline rule.
    const lost = line({ id: "l-lost", code: "EL-04", title: "Dual battery", dependsOn: ["no-such-line"] });
    try {
      validateDependencies([eng, lost]);
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe("lines.1.dependsOn.0");
      expect((e as InputError).message).toBe('Line EL-04 "Dual battery" depends on an unknown line (no-such-line).');
    }
  });

  it("refuses a dependency on a line of another edition, naming both", () => {
    // Rigline rule.
    const crossing = line({ id: "l-x", code: "EL-04", title: "Dual battery", dependsOn: ["old-7"] });
    const other = [{ id: "old-7", code: "EL-01", title: "Isolator" }];
    expect(() => validateDependencies([crossing], { otherEditionLines: other })).toThrow(
      'Line EL-04 "Dual battery" depends on EL-01 "Isolator", a line of another edition; a line may depend only on lines of its own edition.',
    );
  });

  it("handles a long chain without overflowing the stack", () => {
    // Rigline rule.
    // 20 000 lines, each depending on the one before: order is the chain itself.
    const chain = Array.from({ length: 20_000 }, (_, i) => line({ id: `c${i}`, dependsOn: i === 0 ? [] : [`c${i - 1}`] }));
    const order = validateDependencies([...chain].reverse()).order;
    expect(order).toHaveLength(20_000);
    expect(order[0]).toBe("c0");
    expect(order[19_999]).toBe("c19999");
  });
});
