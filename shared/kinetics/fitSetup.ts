import { KineticsInputError } from "./kineticsInputError.js";

/** What every fit needs to know about the charge. */
export interface ChargeSetup {
  /** Gas volume at t = 0, L. */
  V0: number;
  epsilonA: number;
  /** Initial concentration of A, mol/L; needed unless the order is 1. */
  cA0?: number;
}

/** Throws a KineticsInputError when the charge cannot be fitted at this order. */
export function assertFittable(setup: ChargeSetup, order: number, orderFitted: boolean): void {
  if (!(setup.V0 > 0) || !Number.isFinite(setup.V0)) {
    throw new KineticsInputError("V0", `V0 must be a positive volume in L (got ${setup.V0}).`);
  }
  if (!Number.isFinite(setup.epsilonA) || setup.epsilonA === 0) {
    throw new KineticsInputError("epsilonA", "εA is zero: the volume does not move, so conversion cannot be read from it.");
  }
  if (!(setup.epsilonA > -1)) throw new KineticsInputError("epsilonA", `εA must exceed −1 (got ${setup.epsilonA}).`);
  if (!(order >= 0) || !Number.isFinite(order)) {
    throw new KineticsInputError("order", `The order must be zero or positive (got ${order}).`);
  }
  if ((order !== 1 || orderFitted) && !(setup.cA0 !== undefined && setup.cA0 > 0)) {
    throw new KineticsInputError("cA0", `An initial concentration cA0 > 0 (mol/L) is needed for order ${order}.`);
  }
}
