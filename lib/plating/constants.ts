// Physical constants used by the engine.

// Source: CODATA 2018 (exact since the 2019 SI redefinition, F = N_A·e); reference §1.1, S1.
export const FARADAY_C_PER_MOL = 96485.33212;

export const SECONDS_PER_HOUR = 3600;

// One faraday expressed in ampere-hours per mole of electrons: F/3600 = 26.8015 A·h/mol
// (reference §1.1, computed).
export const FARADAY_AH_PER_MOL = FARADAY_C_PER_MOL / SECONDS_PER_HOUR;

// Geometry conversions used by Faraday's law: 1 dm² = 100 cm², 1 µm = 1e-4 cm.
export const CM2_PER_DM2 = 100;
export const CM_PER_UM = 1e-4;
