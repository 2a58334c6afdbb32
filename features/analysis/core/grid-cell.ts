/**
 * The marker of the gasket stress grid's cells that are not gasket material, on its own so the
 * heat map's painter can read it without loading the grid computation.
 */

/** Value stored in cells that are not gasket material (outside, bore, bolt holes). */
export const OUTSIDE_GASKET = -1;
