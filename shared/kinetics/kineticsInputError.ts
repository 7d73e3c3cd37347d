/** Input the kinetics library cannot work with; `field` is a dotted path to the offending input. */
export class KineticsInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = "KineticsInputError";
    this.field = field;
  }
}
