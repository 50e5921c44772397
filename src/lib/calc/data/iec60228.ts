// IEC 60228:2004 "Conductors of insulated cables": maximum resistance of plain annealed copper conductors at 20 °C,
// Ω/km, by nominal cross-section in mm². (published; as reproduced in cable makers' conductor tables of the
// standard, e.g. Cembre catalogue "IEC 60228:2004-11 conductor tables")

/** Table 1, class 1 (solid) conductors, plain copper. */
export const IEC60228_CLASS1: readonly (readonly [number, number])[] = [
  [0.5, 36.0],
  [0.75, 24.5],
  [1, 18.1],
  [1.5, 12.1],
  [2.5, 7.41],
  [4, 4.61],
  [6, 3.08],
  [10, 1.83],
  [16, 1.15],
  [25, 0.727],
  [35, 0.524],
  [50, 0.387],
  [70, 0.268],
  [95, 0.193],
  [120, 0.153],
  [150, 0.124],
  [185, 0.101],
  [240, 0.0775],
  [300, 0.062],
  [400, 0.0465],
];

/** Table 2, class 2 (stranded) conductors, plain copper wires. */
export const IEC60228_CLASS2: readonly (readonly [number, number])[] = [
  [0.5, 36.0],
  [0.75, 24.5],
  [1, 18.1],
  [1.5, 12.1],
  [2.5, 7.41],
  [4, 4.61],
  [6, 3.08],
  [10, 1.83],
  [16, 1.15],
  [25, 0.727],
  [35, 0.524],
  [50, 0.387],
  [70, 0.268],
  [95, 0.193],
  [120, 0.153],
  [150, 0.124],
  [185, 0.0991],
  [240, 0.0754],
  [300, 0.0601],
  [400, 0.047],
  [500, 0.0366],
  [630, 0.0283],
];
