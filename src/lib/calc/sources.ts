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

// ---- Issue 15, sections 3, 4 and 6 (planing, foil, cable, coolant, solar) ----

export const SRC_SAVITSKY64: Source = {
  citation:
    'D. Savitsky (1964), "Hydrodynamic Design of Planing Hulls", Marine Technology 1(1), 71–95: Eqs. 15–16 (lift with deadrise), the mean bottom velocity, Eq. 31 (centre of pressure) and Table 1 (computational procedure, all forces through the centre of gravity); range 0.60 ≤ C_V ≤ 13, 2° ≤ τ ≤ 15°, λ ≤ 4.',
  use: 'Equilibrium trim, wetted length and resistance of a prismatic planing hull (friction here from the ITTC-1957 line instead of the paper’s Schoenherr line with roughness allowance).',
};
export const SRC_HELMBOLD: Source = {
  citation:
    'H.B. Helmbold (1942), "Der unverwundene Ellipsenflügel als tragende Wirbelfläche", Jahrbuch der Deutschen Luftfahrtforschung, I 111–113; as given in D.P. Raymer, "Aircraft Design: A Conceptual Approach" (lift-curve slope of a finite wing, A ≥ 0).',
  use: 'Lift-curve slope of a finite foil a = 2πA/(2 + √(A² + 4)) per radian.',
};
export const SRC_PRANDTL_INDUCED: Source = {
  citation:
    'L. Prandtl (1918), lifting-line theory; induced drag C_Di = C_L²/(π e A) with span efficiency e, as in J.D. Anderson, "Fundamentals of Aerodynamics", ch. 5.',
  use: 'Induced drag of the foil.',
};
export const SRC_IF97_SAT: Source = {
  citation:
    'IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997 for the Thermodynamic Properties of Water and Steam", Eq. 30 (saturation pressure) and Table 35 (check values).',
  use: 'Vapour pressure of water for the cavitation number.',
};
export const SRC_CAVITATION_INCEPTION: Source = {
  citation:
    'J.S. Carlton (2012), "Marine Propellers and Propulsion", 3rd ed., ch. 9 (cavitation inception when the cavitation number σ falls below the section’s −C_p,min).',
  use: 'Cavitation check of the foil’s suction peak (σ = (p_atm + ρgh − p_v)/(½ρV²)).',
};
export const SRC_IEC60228: Source = {
  citation:
    'IEC 60228:2004, "Conductors of insulated cables", Table 1 (class 1 solid conductors) and Table 2 (class 2 stranded conductors): maximum resistance of plain annealed copper conductors at 20 °C, Ω/km.',
  use: 'Conductor resistance per nominal cross-section at 20 °C, corrected to the conductor temperature with α₂₀ = 0.00393 /K.',
};
export const SRC_MELINDER: Source = {
  citation:
    'Å. Melinder (2010), "Properties of Secondary Working Fluids for Indirect Systems", International Institute of Refrigeration, ethylene glycol–water polynomial coefficients (mass fraction 0–60 %, base point 30.8462 %, 31.728 °C); Å. Melinder (2007), "Thermophysical Properties of Aqueous Solutions Used as Secondary Working Fluids", doctoral thesis, KTH Stockholm.',
  use: 'Density, specific heat, viscosity and freezing point of ethylene glycol–water coolant by mass fraction.',
};
export const SRC_SCP: Source = {
  citation:
    'M. Mitchell et al., SecondaryCoolantProps (Python library, National Renewable Energy Laboratory), scp.ethylene_glycol and its test suite tests/test_ethlylene_glycol.py.',
  use: 'Independent implementation of Melinder’s correlation; check values.',
};
export const SRC_FAIMAN: Source = {
  citation:
    'D. Faiman (2008), "Assessing the outdoor operating temperature of photovoltaic modules", Progress in Photovoltaics 16(4), 307–315: T_c = T_a + G/(U₀ + U₁·v), U₀ = 25.0 W/m²K, U₁ = 6.84 W·s/m³K.',
  use: 'Cell temperature with the wind speed the panel sees.',
};
export const SRC_PVLIB_FAIMAN: Source = {
  citation:
    'pvlib-python, pvlib.temperature.faiman and its tests test_temperature.py::test_faiman_default, test_faiman_kwargs, test_faiman_list (W.F. Holmgren, C.W. Hansen & M.A. Mikofski (2018), J. Open Source Software 3(29), 884).',
  use: 'Independent implementation and test vectors of the Faiman model.',
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
