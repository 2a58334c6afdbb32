/**
 * Parser of CalculiX `.dat` output (`*NODE PRINT`, `*EL PRINT`, `*CONTACT PRINT` blocks). Each
 * block starts with a header such as
 *   " displacements (vx,vy,vz) for set NALL and time  0.1000000E+01"
 *   " total force (fx,fy,fz) for set NBEARBOT and time  0.1000000E+01"
 *   " stresses (elem, integ.pnt.,sxx,syy,szz,sxy,sxz,syz) for set ELAYER and time  0.1E+01"
 * followed by numeric rows (a node with a *TRANSFORM prints its values in the local system and
 * ends the row with "L"). Pure: takes the file text.
 */

export interface DatBlock {
  /** The quantity as CalculiX names it: "displacements", "forces", "total force", "stresses", … */
  quantity: string;
  set: string;
  time: number;
  /** Numeric rows as printed (node or element id first, then integration point for element output). */
  rows: number[][];
}

const HEADER = /^\s*([a-z][a-z .]*?)\s*\(([^)]*)\)\s*for set\s+(\S+)\s+and time\s+(\S+)/i;

export function parseDat(text: string): DatBlock[] {
  const blocks: DatBlock[] = [];
  let cur: DatBlock | null = null;
  for (const line of text.split(/\r?\n/)) {
    const h = HEADER.exec(line);
    if (h) {
      cur = { quantity: h[1].trim().toLowerCase(), set: h[3].toUpperCase(), time: Number(h[4]), rows: [] };
      blocks.push(cur);
      continue;
    }
    if (!cur) continue;
    // A node printed in a local system (*TRANSFORM) ends its row with "L".
    const t = line.trim().replace(/\s+L$/, "");
    if (t === "") continue;
    const nums = t.split(/\s+/).map(Number);
    if (nums.some((v) => !Number.isFinite(v))) {
      cur = null;
      continue;
    }
    cur.rows.push(nums);
  }
  return blocks;
}

/** The last block of a quantity for a set (the final time of the step). */
export function findBlock(blocks: DatBlock[], quantity: string, set: string): DatBlock {
  const want = set.toUpperCase();
  for (let i = blocks.length - 1; i >= 0; i--)
    if (blocks[i].quantity === quantity && blocks[i].set === want) return blocks[i];
  throw new Error(`CalculiX output has no "${quantity}" block for set ${want}`);
}

/** Node id → vector from a node block (displacements, forces). */
export function nodeVectors(block: DatBlock): Map<number, number[]> {
  const m = new Map<number, number[]>();
  for (const r of block.rows) m.set(r[0], r.slice(1));
  return m;
}

/** Element id → mean of each component over its integration points (element stresses). */
export function elementMeans(block: DatBlock): Map<number, number[]> {
  const sums = new Map<number, { n: number; v: number[] }>();
  for (const r of block.rows) {
    const vals = r.slice(2);
    const s = sums.get(r[0]);
    if (!s) sums.set(r[0], { n: 1, v: vals.slice() });
    else {
      s.n++;
      vals.forEach((x, k) => (s.v[k] += x));
    }
  }
  const out = new Map<number, number[]>();
  for (const [id, s] of sums)
    out.set(
      id,
      s.v.map((x) => x / s.n),
    );
  return out;
}
