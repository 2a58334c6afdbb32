import { describe, expect, it } from "vitest";
import {
  canonicalJson,
  computeContentHash,
  describeIntegrity,
  verifySnapshot,
} from "@/features/analysis/content-hash";
import {
  decideTransition,
  type ReviewActor,
  type RevisionFacts,
} from "@/features/reviews/model/review-states";
import {
  checksNeedingJustification,
  missingJustifications,
  readChecks,
} from "@/features/reviews/model/review-checks";
import { diffDocuments, listCheckChanges } from "@/features/reviews/model/compare-revisions";

const dana: ReviewActor = { userId: "dana", roles: ["designer"] };
const arlo: ReviewActor = { userId: "arlo", roles: ["approver"] };
const piet: ReviewActor = { userId: "piet", roles: ["designer", "approver"] };
const facts = (over: Partial<RevisionFacts> = {}): RevisionFacts => ({
  status: "draft",
  createdBy: "dana",
  lastEditedBy: "dana",
  submittedBy: null,
  editorIds: ["dana"],
  isWorking: true,
  ...over,
});

describe("review state machine (pure)", () => {
  it("walks draft → in review → returned → in review → approved → new draft", () => {
    expect(decideTransition("submit", dana, facts())).toEqual({ allowed: true, to: "in_review" });
    const inReview = facts({ status: "in_review", submittedBy: "dana" });
    expect(decideTransition("return", arlo, inReview)).toEqual({ allowed: true, to: "returned" });
    expect(decideTransition("submit", dana, facts({ status: "returned", submittedBy: "dana" }))).toEqual({
      allowed: true,
      to: "in_review",
    });
    expect(decideTransition("approve", arlo, inReview)).toEqual({ allowed: true, to: "approved" });
    expect(decideTransition("start-new-revision", dana, facts({ status: "approved" }))).toEqual({
      allowed: true,
      to: "draft",
    });
  });

  it("refuses approving a draft, approving or returning your own, and the wrong roles", () => {
    expect(decideTransition("approve", arlo, facts()).allowed).toBe(false);
    expect(
      decideTransition("approve", dana, facts({ status: "in_review", submittedBy: "dana" })).allowed,
    ).toBe(false);
    const piets = facts({
      status: "in_review",
      createdBy: "piet",
      lastEditedBy: "piet",
      submittedBy: "piet",
    });
    const own = decideTransition("approve", piet, piets);
    expect(own).toMatchObject({ allowed: false, reason: expect.stringContaining("four-eyes") });
    expect(decideTransition("return", piet, piets).allowed).toBe(false);
    // last edited by the approver, created and submitted by someone else: still not independent
    expect(
      decideTransition(
        "approve",
        piet,
        facts({ status: "in_review", lastEditedBy: "piet", submittedBy: "dana" }),
      ).allowed,
    ).toBe(false);
    // saved once by the approver between two saves of the designer: neither last editor nor
    // submitter, but an editor all the same
    const savedInBetween = facts({ status: "in_review", submittedBy: "dana", editorIds: ["dana", "piet"] });
    expect(decideTransition("approve", piet, savedInBetween)).toMatchObject({
      allowed: false,
      reason: expect.stringContaining("four-eyes"),
    });
    expect(decideTransition("return", piet, savedInBetween).allowed).toBe(false);
    expect(decideTransition("approve", arlo, savedInBetween).allowed).toBe(true);
    expect(decideTransition("submit", arlo, facts()).allowed).toBe(false);
    expect(decideTransition("submit", dana, facts({ status: "in_review" })).allowed).toBe(false);
    expect(decideTransition("submit", dana, facts({ status: "approved" })).allowed).toBe(false);
    expect(
      decideTransition("start-new-revision", dana, facts({ status: "approved", isWorking: false })).allowed,
    ).toBe(false);
    expect(decideTransition("start-new-revision", dana, facts({ status: "in_review" })).allowed).toBe(false);
  });
});

describe("content hash (canonical JSON, sha-256)", () => {
  it("sorts keys at every depth, keeps array order and drops undefined members", () => {
    expect(canonicalJson({ b: 1, a: [2, { d: 0, c: null }], u: undefined })).toBe(
      '{"a":[2,{"c":null,"d":0}],"b":1}',
    );
    expect(canonicalJson([undefined, Number.NaN])).toBe("[null,null]");
  });

  it("hashes equal snapshots equally whatever the key order, and differently after any change", () => {
    const a = computeContentHash({
      document: { x: 1, y: [1, 2] },
      result: { checks: [] },
      coreVersion: "1.0.0",
    });
    const b = computeContentHash({
      document: { y: [1, 2], x: 1 },
      result: { checks: [] },
      coreVersion: "1.0.0",
    });
    expect(a).toMatch(/^[0-9a-f]{64}$/);
    expect(b).toBe(a);
    expect(
      computeContentHash({ document: { x: 1, y: [2, 1] }, result: { checks: [] }, coreVersion: "1.0.0" }),
    ).not.toBe(a);
    expect(
      computeContentHash({ document: { x: 1, y: [1, 2] }, result: { checks: [] }, coreVersion: "1.0.1" }),
    ).not.toBe(a);
  });

  it("reports a mismatch with both hashes in the sentence shown on screen", () => {
    const stored = { document: { x: 1 }, result: { v: 2 }, coreVersion: "1.0.0" };
    const hash = computeContentHash(stored);
    expect(verifySnapshot({ ...stored, contentHash: hash })).toEqual({ state: "intact", storedHash: hash });
    const tampered = verifySnapshot({ ...stored, result: { v: 3 }, contentHash: hash });
    expect(tampered.state).toBe("mismatch");
    expect(describeIntegrity(tampered)).toMatch(
      new RegExp(`^Snapshot integrity: hash mismatch — stored ${hash}, recomputed [0-9a-f]{64}\\.$`),
    );
  });
});

describe("checks and comparison", () => {
  const result = (statuses: Record<string, string>) => ({
    checks: Object.entries(statuses).map(([id, status]) => ({
      id,
      title: `Check ${id}`,
      status,
      value: 1,
      limit: 2,
      unit: "mm",
      source: "s",
      note: "",
      subject: ["b1", "b2"],
    })),
  });

  it("needs a justification for every warn and fail, and treats an unknown status as a fail", () => {
    const checks = readChecks(result({ a: "pass", b: "warn", c: "fail", d: "not-applicable", e: "bogus" }));
    expect(checks.map((c) => c.status)).toEqual(["pass", "warn", "fail", "not-applicable", "fail"]);
    expect(checks[0]!.boltIds).toEqual(["b1", "b2"]);
    expect(checksNeedingJustification(checks).map((c) => c.id)).toEqual(["b", "c", "e"]);
    expect(missingJustifications(checks, { b: "accepted: hydrotest", c: "   " })).toEqual(["c", "e"]);
  });

  it("diffs documents by field path, matching bolts by id", () => {
    const before = {
      gasket: { yMpa: 20 },
      bolts: [
        { id: "b1", sMm: 0 },
        { id: "b2", sMm: 100 },
        { id: "b3", sMm: 200 },
      ],
    };
    const after = {
      gasket: { yMpa: 25 },
      bolts: [
        { id: "b1", sMm: 0 },
        { id: "b3", sMm: 210 },
      ],
    };
    expect(diffDocuments(before, after)).toEqual([
      { path: "bolts[b2]", before: { id: "b2", sMm: 100 }, after: null },
      { path: "bolts[b3].sMm", before: 200, after: 210 },
      { path: "gasket.yMpa", before: 20, after: 25 },
    ]);
  });

  it("lists checks whose status changed, including added and removed ones", () => {
    expect(
      listCheckChanges(
        result({ a: "pass", b: "fail", c: "pass" }),
        result({ a: "pass", b: "pass", d: "warn" }),
      ),
    ).toEqual([
      { checkId: "b", title: "Check b", before: "fail", after: "pass" },
      { checkId: "c", title: "Check c", before: "pass", after: null },
      { checkId: "d", title: "Check d", before: null, after: "warn" },
    ]);
  });
});
