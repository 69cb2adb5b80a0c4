/** Standard gravity, m/s² (exact by definition, CGPM 1901). The engine uses this everywhere. */
export const G = 9.80665;
/** Density of water, kg/m³ — 1000 is the usual design value (common practice). */
export const RHO_WATER = 1000;
/** Manning's equation unit factor k in Q = (k/n)·A·R^(2/3)·S^(1/2): 1 in SI. [Chow 1959] */
export const MANNING_K_SI = 1;
/** Manning's equation unit factor k for US customary units (ft, s). [Chow 1959] */
export const MANNING_K_US = 1.486;
/** One international foot, m (exact by definition, NIST SP 811); every US factor derives from it. */
export const FOOT = 0.3048;
