/**
 * The safety caution (product.md), word for word: shown before a kernel is promoted or
 * reinstated, sent with every promotion and reinstatement, and in the README.
 */
export const safetyCaution =
  "Passing Stablehand's checks is evidence, not certification. Kernels used in safety-relevant " +
  "work (structures, vehicles, medical devices, process control) still go through the organisation's " +
  'own verification and validation and the standards and codes that apply there, under the ' +
  'responsibility of qualified engineers.';
