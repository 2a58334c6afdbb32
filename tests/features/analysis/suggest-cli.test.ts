import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { rectangularCover } from "./core/fixtures";

// `npm run suggest -- request.json` as a real process (tsx scripts/suggest.ts): the ranked
// candidates with their key numbers and the cautions, the blocking rule when nothing qualifies,
// every problem of a bad request on stderr, and its exit codes.
const run = promisify(execFile);
const dir = mkdtempSync(path.join(tmpdir(), "sealpitch-suggest-"));
const M = (...names: string[]) =>
  names.map((designation) => ({ designation, threadSeries: "metric-coarse" as const }));

async function suggest(body: unknown, ...flags: string[]) {
  const file = path.join(dir, `request-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, typeof body === "string" ? body : JSON.stringify(body));
  try {
    const { stdout, stderr } = await run(
      path.join("node_modules", ".bin", "tsx"),
      ["scripts/suggest.ts", "--", file, ...flags],
      { cwd: process.cwd() },
    );
    return { code: 0, stdout, stderr };
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string };
    return { code: err.code, stdout: err.stdout, stderr: err.stderr };
  }
}

const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });

describe("npm run suggest", () => {
  it("prints the ranked candidates with count, size, seating margin and governing rule, then the cautions", async () => {
    const out = await suggest({ design, sizes: M("M12", "M16", "M24") });
    expect(out.code).toBe(0);
    expect(out.stdout).toMatch(/^\d+ suggested patterns, best first \(\d+ analyses over 3 combinations/);
    expect(out.stdout).toMatch(/\n#\s+bolts\s+size\s+material/);
    expect(out.stdout).toMatch(/\n1\s+\d+\s+M(12|16|24)\s+ISO 898-1/);
    expect(out.stdout).toContain(
      "Caution: Results are engineering estimates, not a design code calculation.",
    );
    expect(out.stderr).toContain("searched 3 of 3 combinations");
  }, 60_000);

  it("--json prints the search's result", async () => {
    const out = await suggest({ design, sizes: M("M16") }, "--json");
    expect(out.code).toBe(0);
    const result = JSON.parse(out.stdout);
    expect(result.candidates[0].rank).toBe(1);
    expect(result.candidates[0].designation).toBe("M16");
  }, 60_000);

  it("names the blocking rule when nothing qualifies (exit 3)", async () => {
    const soft = structuredClone(design);
    soft.gasket.material = { ...soft.gasket.material, qMinMpa: 150 };
    const out = await suggest({ design: soft, sizes: M("M20", "M24", "M30", "M36") });
    expect(out.code).toBe(3);
    expect(out.stdout).toMatch(/No size up to M36 seats the gasket at \d+(\.\d)? mm pitch/);
  }, 60_000);

  it("lists every problem of a bad request on stderr (exit 1), and a usage line without a file (exit 2)", async () => {
    const bad = await suggest({ design, sizes: M("M17"), fixedBoltIds: ["b99"] });
    expect(bad.code).toBe(1);
    expect(bad.stderr).toContain("the search cannot run on this request");
    expect(bad.stderr).toMatch(/sizes\[0\]: no metric-coarse thread "M17"/);
    expect(bad.stderr).toMatch(/fixedBoltIds\[0\]: no bolt "b99"/);
    const typo = await suggest({ design, maxAnalysis: 5 });
    expect(typo.code).toBe(1);
    expect(typo.stderr).toMatch(/maxAnalysis/);
    expect((await suggest("{not json")).stderr).toMatch(/not valid JSON/);
    const usage = await run(path.join("node_modules", ".bin", "tsx"), ["scripts/suggest.ts"]).catch(
      (e: { code: number; stderr: string }) => e,
    );
    expect((usage as { code: number }).code).toBe(2);
  }, 60_000);
});
