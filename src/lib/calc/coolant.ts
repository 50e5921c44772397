import { EG_DENSITY, EG_FREEZING, EG_LN_VISCOSITY, EG_SPECIFIC_HEAT, EG_T_BASE, EG_X_BASE } from './data/melinder-eg';
import { heatCapacities, liquidDensity } from './properties/iapws95';
import { P0 } from './properties/water';
import { waterViscosity } from './properties/viscosity';

/** `glycol50` is the earlier name of a 50 % by volume mix, kept as an alias of `glycol` at that mass fraction. */
export type Coolant = 'water' | 'glycol' | 'glycol50';

export interface CoolantProps {
  density_kgm3: number;
  cp_JkgK: number;
  viscosity_Pas: number;
}

/** Mass-fraction range of Melinder's ethylene glycol correlation. */
export const GLYCOL_FRACTION_MAX = 0.6;
/** Mass fraction used for `glycol` when none is given. */
export const GLYCOL_FRACTION_DEFAULT = 0.5;
/**
 * A 50 % by volume mix as a mass fraction: 0.5·ρ_EG/(0.5·ρ_EG + 0.5·ρ_w) with pure ethylene glycol 1113 kg/m³ and
 * water 998 kg/m³ at 20 °C (derived; the glycol density is from memory of the CRC Handbook), ignoring the small
 * volume contraction on mixing.
 */
export const GLYCOL50_MASS_FRACTION = 0.527;
/** Upper temperature of the coolant correlations used here, °C. */
const T_MAX = 99;

/** Melinder's double polynomial in (x − x_m) and (t − t_m), x in mass percent. */
function melinder(c: readonly (readonly number[])[], xPercent: number, tC: number): number {
  const dx = xPercent - EG_X_BASE;
  const dt = tC - EG_T_BASE;
  let sum = 0;
  let xi = 1;
  for (const row of c) {
    let tj = 1;
    for (const v of row) {
      sum += v * xi * tj;
      tj *= dt;
    }
    xi *= dx;
  }
  return sum;
}

/** Freezing point of an ethylene glycol–water mix, °C (Melinder 2010). */
export function glycolFreezingPoint(massFraction: number): number {
  return melinder([...EG_FREEZING.map((v) => [v])], massFraction * 100, EG_T_BASE);
}

/** Ethylene glycol–water properties by mass fraction (0–0.6), Melinder (2010). */
export function glycolProperties(massFraction: number, tempC: number): CoolantProps {
  const x = massFraction * 100;
  return {
    density_kgm3: melinder(EG_DENSITY, x, tempC),
    cp_JkgK: melinder(EG_SPECIFIC_HEAT, x, tempC),
    viscosity_Pas: Math.exp(melinder(EG_LN_VISCOSITY, x, tempC)) * 1e-3,
  };
}

/** Glycol mass fraction a coolant choice stands for (0 for water). */
export function glycolFractionOf(coolant: Coolant, given?: number): number {
  if (coolant === 'water') return 0;
  if (coolant === 'glycol50') return GLYCOL50_MASS_FRACTION;
  return given ?? GLYCOL_FRACTION_DEFAULT;
}

/** Temperature span, °C, over which the coolant's properties are defined here. */
export function coolantRange(coolant: Coolant, massFraction: number): [number, number] {
  // liquid water at 0.101325 MPa; the mix from its freezing point
  if (coolant === 'water') return [0.01, T_MAX];
  return [Math.min(0, glycolFreezingPoint(massFraction)), T_MAX];
}

/** Properties of a coolant; `glycolFraction` (mass) applies to `glycol` only (see glycolFractionOf). */
export function coolantProperties(coolant: Coolant, tempC: number, glycolFraction?: number): CoolantProps {
  if (coolant === 'water') {
    const T = tempC + 273.15;
    const rho = liquidDensity(T, P0);
    return { density_kgm3: rho, cp_JkgK: heatCapacities(T, rho).cp, viscosity_Pas: waterViscosity(T, rho) };
  }
  return glycolProperties(glycolFractionOf(coolant, glycolFraction), tempC);
}
