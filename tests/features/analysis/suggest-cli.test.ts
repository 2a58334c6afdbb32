import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { circularFlange, rectangularCover } from "./core/fixtures";

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

  describe("--bolting: stocked bolting from the Stockroom's export", () => {
    // Invented Stockroom rows (our demo data): a low-yield stud stock in two size ranges.
    const csv = [
      "name,modulus_mpa,max_diameter_mm,proof_mpa,yield_mpa,tensile_mpa,allowable_mpa,source,edition",
      "Halden Creek yard stud stock,200000,24,,250,420,,Kestrel Ridge stores certificate KR-0042,2026",
      "Halden Creek yard stud stock,200000,48,,240,410,,Kestrel Ridge stores certificate KR-0042,2026",
    ].join("\n");
    const flange = circularFlange({ boltCount: 8, flangeThicknessMm: 40 });
    const request = {
      design: flange,
      sizes: [{ designation: "3/4", threadSeries: "unc" }],
      allowLayoutWarnings: true,
    };
    const write = (name: string, text: string) => {
      const f = path.join(dir, name);
      writeFileSync(f, text);
      return f;
    };

    it("a stocked CSV's weaker grade fails the bolt stress check that B7 passes (exit 3, the rule named)", async () => {
      expect((await suggest(request)).code).toBe(0);
      const out = await suggest(request, "--bolting", write("stockroom-bolting.csv", csv), "--json");
      expect(out.code).toBe(3);
      const result = JSON.parse(out.stdout);
      expect(result.blocked.map((b: { rule: string; materialId: string }) => [b.rule, b.materialId])).toEqual(
        [["bolt.assembly-stress-max", "csv:2"]],
      );
      expect(result.message).toMatch(/Assembly bolt stress at maximum preload/);
    }, 60_000);

    it("reads the Stockroom listing's JSON: built-in rows as catalogue materials, our own rows with their values", async () => {
      const listing = {
        rows: [
          {
            id: "builtin:astm-a193-b7",
            origin: "builtin",
            rowId: "astm-a193-b7",
            name: "ASTM A193 B7",
            modulusMpa: 205000,
            ranges: [
              { maxDiameterMm: 64, proofMpa: null, yieldMpa: 724, tensileMpa: 862, allowableMpa: 172 },
            ],
            source: "catalogue",
            edition: "",
            hidden: false,
          },
          {
            id: "org:00000000-0000-4000-8000-000000000042",
            origin: "organization",
            rowId: "00000000-0000-4000-8000-000000000042",
            name: "Halden Creek yard stud stock",
            modulusMpa: 200000,
            ranges: [
              { maxDiameterMm: 48, proofMpa: null, yieldMpa: 250, tensileMpa: 420, allowableMpa: null },
            ],
            source: "Kestrel Ridge stores certificate KR-0042",
            edition: "2026",
            confidence: "organisation",
          },
        ],
      };
      const out = await suggest(
        request,
        "--bolting",
        write("bolting.json", JSON.stringify(listing)),
        "--json",
      );
      expect(out.code).toBe(0);
      const result = JSON.parse(out.stdout);
      expect(result.combinations).toBe(2);
      expect(new Set(result.candidates.map((c: { materialId: string }) => c.materialId))).toEqual(
        new Set(["astm-a193-b7"]),
      );
      expect(result.blocked[0].materialId).toBe("org:00000000-0000-4000-8000-000000000042");
    }, 60_000);

    it("a bad bolting file is refused with its line (exit 1), a missing file name is a usage error (exit 2)", async () => {
      const bad = await suggest(
        request,
        "--bolting",
        write("bad-bolting.csv", csv.replace(",250,420,", ",250,120,")),
      );
      expect(bad.code).toBe(1);
      expect(bad.stderr).toMatch(/Row 2, field tensile_mpa: must not be below the yield strength/);
      expect((await suggest(request, "--bolting")).code).toBe(2);
    }, 60_000);
  });
});
