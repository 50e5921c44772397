import type { Source } from './types';

// Full citations, kept in one place so every calculator names them the same way.

export const SRC_ITTC_WATER: Source = {
  citation:
    'ITTC (2011), "Fresh Water and Seawater Properties", ITTC Recommended Procedures and Guidelines 7.5-02-01-03, Rev. 02 (basis: IAPWS-95, IAPWS 2008 viscosity, TEOS-10 seawater at S_A 35.16504 g/kg).',
  use: 'Density and kinematic viscosity of fresh water and seawater; check values at 15 and 20 °C.',
};
export const SRC_IAPWS95: Source = {
  citation:
    'IAPWS R6-95(2018), "Revised Release on the IAPWS Formulation 1995 for the Thermodynamic Properties of Ordinary Water Substance for General and Scientific Use"; W. Wagner & A. Pruß (2002), J. Phys. Chem. Ref. Data 31(2), 387–535, Tables 1–2 and 6–7.',
  use: 'Pure-water density and specific heat capacity at 0.101325 MPa.',
};
export const SRC_IAPWS08_VISC: Source = {
  citation:
    'IAPWS R12-08 (2008), "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water Substance"; M.L. Huber et al. (2009), J. Phys. Chem. Ref. Data 38(2), 101–125.',
  use: 'Dynamic viscosity of pure water.',
};
export const SRC_IAPWS08_SEA: Source = {
  citation:
    'IAPWS R13-08 (2008), "Release on the IAPWS Formulation 2008 for the Thermodynamic Properties of Seawater"; R. Feistel (2008), Deep-Sea Research I 55, 1639–1671, Table 2.',
  use: 'Saline part of the seawater Gibbs function (seawater density).',
};
export const SRC_SHARQAWY: Source = {
  citation:
    'M.H. Sharqawy, J.H. Lienhard V & S.M. Zubair (2010), "Thermophysical properties of seawater: a review of existing correlations and data", Desalination and Water Treatment 16, 354–380, Eq. 22.',
  use: 'Seawater viscosity relative to pure water.',
};
export const SRC_OOSTERVELD: Source = {
  citation:
    'M.W.C. Oosterveld & P. van Oossanen (1975), "Further computer-analyzed data of the Wageningen B-screw series", International Shipbuilding Progress 22(251), 251–262, Table 5 (K_T, K_Q polynomials at Rn = 2·10⁶) and Table 6 (Reynolds corrections, not applied below 2·10⁶).',
  use: 'Open-water thrust and torque coefficients of B-series propellers.',
};
export const SRC_BERNITSAS: Source = {
  citation:
    'M.M. Bernitsas, D. Ray & P. Kinley (1981), "K_T, K_Q and efficiency curves for the Wageningen B-series propellers", Report 237, Dept. of Naval Architecture and Marine Engineering, University of Michigan, Table 1.',
  use: 'Independent transcription of the B-series coefficients.',
};
export const SRC_HELMA: Source = {
  citation:
    'S. Helma (2020), "Surprising behaviour of the Wageningen B-screw series polynomials", J. Mar. Sci. Eng. 8(3), 211.',
  use: 'Behaviour of the polynomials near and beyond their range.',
};
export const SRC_ITTC57: Source = {
  citation:
    '8th ITTC (1957), model-ship correlation line; J.B. Hadler (1958), "Coefficients for International Towing Tank Conference 1957 model-ship correlation line", DTMB Report 1185; A. Morrall (1970), "1957 ITTC model-ship correlation line values of frictional resistance coefficient", NPL Ship Report 142.',
  use: 'Frictional resistance coefficient C_F = 0.075/(log₁₀Re − 2)².',
};
export const SRC_ITTC78: Source = {
  citation:
    '15th ITTC (1978), ITTC-1978 performance prediction method (form-factor approach, viscous resistance (1+k)·R_F).',
  use: 'Form factor applied to the frictional resistance.',
};
export const SRC_ROSS: Source = {
  citation:
    'R.G. Ross Jr. (1981), "Design techniques for flat-plate photovoltaic arrays", Proc. 15th IEEE Photovoltaic Specialists Conference, 811–817.',
  use: 'Cell temperature from NOCT: T_c = T_a + (NOCT − 20)/800 · G.',
};
export const SRC_PVWATTS: Source = {
  citation: 'A.P. Dobos (2014), "PVWatts Version 5 Manual", NREL/TP-6A20-62641, National Renewable Energy Laboratory.',
  use: 'DC power with a linear temperature coefficient: P = P_STC · G/1000 · (1 + γ(T_c − 25)).',
};
export const SRC_PVLIB: Source = {
  citation:
    'pvlib-python test suite: test_temperature.py::test_ross and test_pvsystem.py::test_pvwatts_dc_scalars (W.F. Holmgren, C.W. Hansen & M.A. Mikofski (2018), J. Open Source Software 3(29), 884).',
  use: 'Published test vectors for the cell-temperature and power models.',
};
export const SRC_COPPER: Source = {
  citation:
    'IEC 60028:1925, "International standard of resistance for copper" (ρ₂₀ = 1/58 Ω·mm²/m = 1.7241·10⁻⁸ Ω·m, α₂₀ = 0.00393 /K); NBS Handbook 100 (1966), "Copper Wire Tables".',
  use: 'Resistance of annealed copper conductors and its temperature coefficient.',
};
export const SRC_FLOYD: Source = {
  citation: 'T.L. Floyd, "Electric Circuit Fundamentals", Pearson, AWG wire table (Ω per 1000 ft at 20 °C).',
  use: 'Check values for conductor resistance.',
};
export const SRC_COLEBROOK: Source = {
  citation:
    'C.F. Colebrook (1939), "Turbulent flow in pipes, with particular reference to the transition region between the smooth and rough pipe laws", J. Inst. Civil Engineers 11(4), 133–156.',
  use: 'Darcy friction factor in turbulent pipe flow (solved iteratively).',
};
export const SRC_FLUIDS: Source = {
  citation:
    'C. Bell et al., "fluids" Python library documentation, fluids.friction (friction_factor, Colebrook, Haaland, Swamee_Jain examples).',
  use: 'Reference values for the friction-factor correlations.',
};
export const SRC_ASHRAE_EG: Source = {
  citation:
    'ASHRAE Handbook—Fundamentals, ch. 31 "Physical Properties of Secondary Coolants (Brines)", density of aqueous ethylene glycol solutions by volume (lb/ft³), as reproduced in Viega Design Manual IM-PR 566442 1114, Table 5-16.',
  use: 'Density of a 50 % (by volume) ethylene-glycol coolant.',
};
export const SRC_ETB_EG: Source = {
  citation:
    'The Engineering ToolBox, "Ethylene Glycol Heat-Transfer Fluid", table of dynamic viscosity of ethylene glycol solutions (% by volume).',
  use: 'Viscosity of a 50 % (by volume) ethylene-glycol coolant for the pipe Reynolds number.',
};

// --- issue 15, sections 1, 2 and 5 (motor envelope, sprint, cavitation, battery pack) ---
export const SRC_IF97_PSAT: Source = {
  citation:
    'IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997 for the Thermodynamic Properties of Water and Steam", region 4 saturation-pressure equation (Eqs. 29–30, Table 34; verification values Table 35).',
  use: 'Vapour pressure of water for the cavitation number.',
};
export const SRC_SHARQAWY_PV: Source = {
  citation:
    'M.H. Sharqawy, J.H. Lienhard V & S.M. Zubair (2010), "Thermophysical properties of seawater: a review of existing correlations and data", Desalination and Water Treatment 16, 354–380, Eq. 6 (after R.A. Robinson 1954).',
  use: 'Vapour pressure of seawater relative to pure water.',
};
export const SRC_BURRILL: Source = {
  citation:
    'L.C. Burrill (1943), "Developments in propeller design and manufacture for merchant ships", Trans. Institution of Engineers and Shipbuilders in Scotland 86; L.C. Burrill & A. Emerson (1963), "Propeller cavitation: further tests on 16 in. propeller models in the King’s College cavitation tunnel", Trans. North East Coast Institution of Engineers and Shipbuilders 79, 295–320; as reproduced in J. Carlton, "Marine Propellers and Propulsion", Butterworth-Heinemann (cavitation chapter). Limit line used: 5 % back cavitation, τ_c = 0.1082·ln σ₀.₇R + 0.2675 for 0.16 ≤ σ₀.₇R ≤ 1.5 (logarithmic fit of the diagram’s line published in the open-source heliceb-automation propeller tool, cavitation.py).',
  use: 'Thrust loading coefficient τ_c = T/(A_P·½ρV_R²) with A_P = A_D(1.067 − 0.229·P/D), and its limit at the cavitation number σ₀.₇R.',
};
export const SRC_KELLER: Source = {
  citation:
    'J. auf’m Keller (1966), "Enige aspecten bij het ontwerpen van scheepsschroeven", Schip en Werf 33; as given in J. Carlton, "Marine Propellers and Propulsion", Butterworth-Heinemann (blade area selection), and in G. Kuiper (1992), "The Wageningen Propeller Series", MARIN publication 92-001.',
  use: 'Minimum blade area ratio A_E/A_0 = (1.3 + 0.3·Z)·T/((p_atm + ρgh − p_v)·D²) + k.',
};
export const SRC_BATTERY_ECM: Source = {
  citation:
    'G.L. Plett (2015), "Battery Management Systems, Volume I: Battery Modeling", Artech House, ch. 2 (equivalent-circuit cell: terminal voltage = open-circuit voltage − i·R₀); cells in series add voltage and resistance, strings in parallel divide resistance and add capacity.',
  use: 'Pack voltage, resistance, current for a power load from P = I·(V − I·R), heat I²R.',
};
export const SRC_QUADRATIC_DRAG: Source = {
  citation:
    'Standing start with constant thrust and quadratic drag, v(t) = v_t·tanh(t/τ), x(t) = v_t·τ·ln cosh(t/τ) (closed form used to check the integrator; e.g. J.R. Taylor (2005), "Classical Mechanics", University Science Books, §2.4).',
  use: 'Check of the time integration of m·dv/dt = T(1 − t) − R.',
};
