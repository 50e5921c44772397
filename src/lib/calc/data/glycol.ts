// Properties of a 50 % by volume ethylene glycol / water coolant (the usual "50/50" mix).
// Tables are kept in their published units and converted on use.

/**
 * Density, lb/ft³, at −20 … 220 °F in 10 °F steps, 50 % by volume column.
 * Source: ASHRAE Handbook—Fundamentals, ch. 31 "Physical Properties of Secondary Coolants (Brines)",
 * density of aqueous ethylene glycol solutions, as reproduced in Viega Design Manual IM-PR 566442 1114,
 * Table 5-16 ("Density of ethylene glycol solutions", concentration by volume). (published)
 */
export const EG50_DENSITY_F = [-20, -10, 0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100, 110, 120, 130, 140, 150, 160, 170, 180, 190, 200, 210, 220];
export const EG50_DENSITY_LBFT3 = [
  68.05, 67.98, 67.9, 67.8, 67.7, 67.59, 67.47, 67.34, 67.2, 67.05, 66.9, 66.73, 66.55, 66.37, 66.17, 65.97, 65.75, 65.53, 65.3,
  65.05, 64.8, 64.54, 64.27, 63.99, 63.7,
];

/**
 * Specific heat, kJ/(kg·K), by °C. (memory) — from recollection of the ASHRAE / glycol-supplier tables for a
 * 50 % by volume mix, not re-checked against the printed table; uncertainty about ±3 %. Replace with the
 * coolant supplier's datasheet when you have it.
 */
export const EG50_CP_C = [-20, 0, 20, 40, 60, 80, 100];
export const EG50_CP_KJKGK = [3.06, 3.14, 3.22, 3.31, 3.39, 3.47, 3.55];

/**
 * Dynamic viscosity, centipoise (mPa·s), 50 % by volume.
 * Source: The Engineering ToolBox, "Ethylene Glycol Heat-Transfer Fluid", dynamic-viscosity table
 * (0, 40, 80, 120, 160, 200 °F = −17.8, 4.4, 26.7, 48.9, 71.1, 93.3 °C). (published; interpolate ln μ in T)
 */
export const EG50_VISC_C = [-17.8, 4.4, 26.7, 48.9, 71.1, 93.3];
export const EG50_VISC_CP = [22, 6.5, 2.8, 1.5, 0.95, 0.7];

export const LBFT3_TO_KGM3 = 16.01846337;
