import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import {
  coverageText,
  groupByRule,
  justificationsByRule,
  ruleOf,
  rulesNeedingJustification,
} from "@/features/analysis/rule-groups";

const check = (
  id: string,
  status: string,
  value: number | null,
  limit: number | null,
  boltIds: string[] = [],
) => ({
  id,
  title: `Title of ${ruleOf(id)}`,
  status,
  value,
  limit,
  boltIds,
});

describe("rule rows (checks grouped by rule)", () => {
  it("takes the rule from the id before the colon, for any rule id", () => {
    expect(ruleOf("spacing.max-pitch:b1-b2")).toBe("spacing.max-pitch");
    expect(ruleOf("flange.hub-stress")).toBe("flange.hub-stress");
    expect(ruleOf("flange.cover:ug-34:x")).toBe("flange.cover");
  });

  it("keeps one row per rule with the worst check by status, then by use of a ceiling", () => {
    const rows = groupByRule([
      check("spacing.max-pitch:b1-b2", "warn", 90, 81.6, ["b1", "b2"]),
      check("spacing.max-pitch:b2-b3", "warn", 94.8, 81.6, ["b2", "b3"]),
      check("spacing.max-pitch:b3-b4", "pass", 70, 81.6, ["b3", "b4"]),
      check("gasket.seating", "pass", 120, 69),
      check("flange.new-rule:b1", "fail", 5, 10, ["b1"]),
    ]);
    expect(rows.map((r) => r.rule)).toEqual(["flange.new-rule", "spacing.max-pitch", "gasket.seating"]);
    const pitch = rows[1]!;
    expect(pitch.worst.id).toBe("spacing.max-pitch:b2-b3");
    expect(pitch.counts).toEqual({ pass: 1, warn: 2, fail: 0, "not-applicable": 0, "accepted-by-rating": 0 });
    expect(pitch.sense).toBe("at-most");
    expect(pitch.use).toBeCloseTo(94.8 / 81.6, 9);
    expect(pitch.subject).toBe("pair");
    expect(pitch.boltIds).toEqual(["b1", "b2", "b3"]);
    expect(coverageText(pitch)).toBe("Covers 2 pairs that warn.");
    // A floor: a pass above the limit tells the direction; the use is limit over value.
    expect(rows[2]!.sense).toBe("at-least");
    expect(rows[2]!.use).toBeCloseTo(69 / 120, 9);
    expect(rows[0]!.subject).toBe("bolt");
    expect(coverageText(rows[0]!)).toBe("Covers 1 bolt that fails.");
  });

  it("asks one justification per rule on a real 12-bolt result, and maps old per-pair ones to their rule", () => {
    const design = JSON.parse(
      readFileSync("examples/pipe-flange-nps6-spiral-wound.json", "utf8"),
    ) as JointDesign;
    const result = analyzeJoint(design);
    const checks = result.checks.map((c) => ({ ...c, boltIds: c.boltIds ?? c.subject ?? [] }));
    const rows = groupByRule(checks);
    expect(rows.length).toBe(new Set(checks.map((c) => ruleOf(c.id))).size);
    expect(rows.length).toBeLessThan(checks.length);
    const needing = rulesNeedingJustification(checks);
    const open = checks.filter((c) => c.status === "warn" || c.status === "fail");
    expect(needing.reduce((n, r) => n + r.open.length, 0)).toBe(open.length);
    expect(needing.length).toBe(new Set(open.map((c) => ruleOf(c.id))).size);
    const old = justificationsByRule([
      { checkId: "spacing.max-pitch:b1-b2", text: "a" },
      { checkId: "spacing.max-pitch:b2-b3", text: "b" },
      { checkId: "gasket.seating", text: "c" },
    ]);
    expect(old.get("spacing.max-pitch")?.map((j) => j.text)).toEqual(["a", "b"]);
    expect(old.get("gasket.seating")?.length).toBe(1);
  });
});
