// Ethylene glycol–water: coefficients of Melinder's correlation
//   f(x, t) = Σ c_ij (x − x_m)^i (t − t_m)^j,  x mass percent, t °C,  x_m = 30.8462 %, t_m = 31.728 °C,
// for density (kg/m³), specific heat (J/(kg·K)), ln of dynamic viscosity (mPa·s) and, with j = 0 only, the
// freezing point (°C). Source: Å. Melinder (2010), "Properties of Secondary Working Fluids for Indirect Systems",
// IIR, ethylene glycol table; as transcribed in the SecondaryCoolantProps library (scp/ethylene_glycol.py).
// (published) Rows are i = 0…5; row i holds j = 0…(3, 3, 3, 2, 1, 0).

export const EG_X_BASE = 30.8462;
export const EG_T_BASE = 31.728;

export const EG_DENSITY = [
  [1.034e3, -4.781e-1, -2.692e-3, 4.725e-6],
  [1.311, -6.876e-3, 4.805e-5, 1.69e-8],
  [7.49e-5, 7.855e-5, -3.995e-7, 4.982e-9],
  [-1.062e-4, 1.229e-6, -1.153e-8],
  [-9.623e-7, -7.211e-8],
  [4.891e-8],
];

export const EG_SPECIFIC_HEAT = [
  [3.737e3, 2.93, -4.675e-3, -1.389e-5],
  [-1.799e1, 1.046e-1, -4.147e-4, 1.847e-7],
  [-9.933e-2, 3.516e-4, 5.109e-6, -7.138e-8],
  [2.61e-3, -1.189e-6, -1.643e-7],
  [1.537e-5, -4.272e-7],
  [-1.618e-6],
];

export const EG_LN_VISCOSITY = [
  [4.705e-1, -2.55e-2, 1.782e-4, -7.669e-7],
  [2.471e-2, -1.171e-4, 1.052e-6, -1.634e-8],
  [3.328e-6, 1.086e-6, 1.051e-8, -6.475e-10],
  [1.659e-6, 3.157e-9, 4.063e-10],
  [3.089e-8, 1.831e-10],
  [-1.865e-9],
];

/** Freezing point, °C: the j = 0 column of Melinder's freezing-point table. */
export const EG_FREEZING = [-1.525e1, -8.08e-1, -1.334e-2, -7.293e-5, 1.006e-6, 1.14e-9];
