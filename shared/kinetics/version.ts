/** Version of the kinetics computation; stored beside every result. */
export const KINETICS_LIBRARY_VERSION = "1.1.0";

/** Molar gas constant, J/(mol·K) (exact since the 2019 SI redefinition). */
export const GAS_CONSTANT = 8.314462618;
