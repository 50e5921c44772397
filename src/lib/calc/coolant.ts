import {
  EG50_CP_C,
  EG50_CP_KJKGK,
  EG50_DENSITY_F,
  EG50_DENSITY_LBFT3,
  EG50_VISC_C,
  EG50_VISC_CP,
  LBFT3_TO_KGM3,
} from './data/glycol';
import { interp } from './numeric';
import { heatCapacities, liquidDensity } from './properties/iapws95';
import { P0 } from './properties/water';
import { waterViscosity } from './properties/viscosity';

export type Coolant = 'water' | 'glycol50';

export interface CoolantProps {
  density_kgm3: number;
  cp_JkgK: number;
  viscosity_Pas: number;
}

/** Temperature span over which each coolant's properties are defined here (°C). */
export const COOLANT_RANGE: Record<Coolant, [number, number]> = {
  // liquid water at 0.101325 MPa
  water: [0.01, 99],
  // span of the density table, −20 … 220 °F
  glycol50: [-28.8, 104.4],
};

export function coolantProperties(coolant: Coolant, tempC: number): CoolantProps {
  if (coolant === 'water') {
    const T = tempC + 273.15;
    const rho = liquidDensity(T, P0);
    return { density_kgm3: rho, cp_JkgK: heatCapacities(T, rho).cp, viscosity_Pas: waterViscosity(T, rho) };
  }
  const tF = tempC * 1.8 + 32;
  const rho = interp(tF, EG50_DENSITY_F, EG50_DENSITY_LBFT3) * LBFT3_TO_KGM3;
  const cp = interp(tempC, EG50_CP_C, EG50_CP_KJKGK) * 1000;
  const lnMu = interp(tempC, EG50_VISC_C, EG50_VISC_CP.map(Math.log));
  return { density_kgm3: rho, cp_JkgK: cp, viscosity_Pas: Math.exp(lnMu) * 1e-3 };
}
